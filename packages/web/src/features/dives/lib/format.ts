/** `14:03:22` in UTC. */
export function formatClockUtc(timeMs: number): string {
  if (!Number.isFinite(timeMs)) return '—';
  return new Date(timeMs).toISOString().slice(11, 19);
}

/** `2026-06-14 14:03:22 UTC`. */
export function formatDateTimeUtc(timeMs: number | null): string {
  if (timeMs === null || !Number.isFinite(timeMs)) return '—';
  const iso = new Date(timeMs).toISOString();
  return `${iso.slice(0, 10)} ${iso.slice(11, 19)} UTC`;
}

/** `1 h 04 min 09 s`, `4 min 09 s`, `9 s`. */
export function formatDuration(seconds: number | null): string {
  if (seconds === null || !Number.isFinite(seconds)) return '—';
  const total = Math.round(Math.abs(seconds));
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = total % 60;
  if (h > 0) return `${h} h ${String(m).padStart(2, '0')} min ${String(s).padStart(2, '0')} s`;
  if (m > 0) return `${m} min ${String(s).padStart(2, '0')} s`;
  return `${s} s`;
}

/** A value with its unit and a fixed number of decimals, `—` when unknown. */
export function formatQuantity(value: number | null, unit: string, decimals = 1): string {
  if (value === null || !Number.isFinite(value)) return '—';
  return `${value.toLocaleString('en-GB', { minimumFractionDigits: decimals, maximumFractionDigits: decimals })} ${unit}`;
}

/** A share 0–1 as a percentage, `—` when unknown. */
export function formatShare(share: number | null, decimals = 1): string {
  if (share === null || !Number.isFinite(share)) return '—';
  return `${(share * 100).toFixed(decimals)} %`;
}

/** A whole count with thousands separators. */
export function formatCount(value: number): string {
  return value.toLocaleString('en-GB');
}
