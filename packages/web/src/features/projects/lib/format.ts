/** `2026-03-04 09:15` in UTC, or an en dash for none. */
export function formatUtc(iso: string | null): string {
  if (iso === null) return '–';
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '–';
  return `${date.toISOString().slice(0, 10)} ${date.toISOString().slice(11, 16)}`;
}

/** `1 h 05 min`, `23 min`, `45 s`. */
export function formatDuration(seconds: number | null): string {
  if (seconds === null || !Number.isFinite(seconds)) return '–';
  if (seconds < 60) return `${Math.round(seconds)} s`;
  const minutes = Math.round(seconds / 60);
  if (minutes < 60) return `${minutes} min`;
  return `${Math.floor(minutes / 60)} h ${String(minutes % 60).padStart(2, '0')} min`;
}

/** Metres with one decimal (depths). */
export function formatMetres(value: number | null, digits = 1): string {
  if (value === null || !Number.isFinite(value)) return '–';
  return `${value.toFixed(digits)} m`;
}

/** Metres below 1 km, kilometres with two decimals above. */
export function formatDistance(metres: number | null): string {
  if (metres === null || !Number.isFinite(metres)) return '–';
  return metres < 1000 ? `${Math.round(metres)} m` : `${(metres / 1000).toFixed(2)} km`;
}

/** The name a dive goes by in lists: its track name, else the log file and dive number. */
export function diveLabel(dive: { trackName: string; logFileName: string; diveNumber: number }): string {
  return dive.trackName.trim() !== '' ? dive.trackName : `${dive.logFileName} · dive ${dive.diveNumber}`;
}
