/**
 * Number formatting shared by the writers: plain decimal notation (never exponent form, which
 * `xsd:decimal` and many spreadsheet readers refuse), fixed or shortest round-trip digits.
 */

/**
 * Formats a finite number in plain decimal notation. With `decimals`, rounds to that many places
 * and drops trailing zeros; without, writes the shortest digits that read back to the same double.
 * `-0` becomes `0`. Non-finite values give an empty string (callers omit the field).
 */
export function formatDecimal(value: number, decimals?: number): string {
  if (!Number.isFinite(value)) return '';
  let text: string;
  if (decimals === undefined) {
    text = String(value);
    if (text.includes('e')) text = expandExponent(text);
  } else {
    text = value.toFixed(decimals);
    if (text.includes('e')) text = expandExponent(text);
    if (text.includes('.')) {
      // Trailing zeros, then a bare point, are dropped.
      let end = text.length;
      while (text.charCodeAt(end - 1) === 48) end--;
      if (text.charCodeAt(end - 1) === 46) end--;
      text = text.slice(0, end);
    }
  }
  if (text.startsWith('-0') && /^-0(\.0*)?$/.test(text)) return '0';
  return text;
}

function expandExponent(text: string): string {
  const match = /^(-?)(\d)(?:\.(\d+))?e([+-]\d+)$/i.exec(text);
  if (!match) return text;
  const sign = match[1] ?? '';
  const digits = (match[2] ?? '') + (match[3] ?? '');
  const exponent = Number(match[4]);
  const pointAt = 1 + exponent;
  if (pointAt <= 0) return `${sign}0.${'0'.repeat(-pointAt)}${digits}`;
  if (pointAt >= digits.length) return `${sign}${digits}${'0'.repeat(pointAt - digits.length)}`;
  return `${sign}${digits.slice(0, pointAt)}.${digits.slice(pointAt)}`;
}

/**
 * `Math.round(x)` (halves rounded up, `-0` kept), quicker for the magnitudes writers round
 * coordinates at: for 0.5 < |x| < 2^52, x + 0.5 is exact or rounds without reaching another
 * integer, so its floor is the answer. Elsewhere (|x| <= 0.5, where 0.49999999999999994 + 0.5
 * rounds up to 1 and -0.5 gives -0; whole numbers from 2^52; NaN) Math.round itself is used.
 */
export function roundHalfUp(x: number): number {
  const abs = Math.abs(x);
  return abs > 0.5 && abs < 2 ** 52 ? Math.floor(x + 0.5) : Math.round(x);
}

/** Escapes text for XML element content and attribute values. */
export function escapeXml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;');
}

/** UTC ms to ISO 8601 with milliseconds and `Z`; empty for `NaN` or a time outside the Date range. */
export function formatIsoTime(timeMs: number): string {
  if (!Number.isFinite(timeMs)) return '';
  // Writers format fixes in time order, mostly within one day: the date part of the last day
  // formatted is kept, and the time of day is written directly (same text as toISOString).
  const intoDay = timeMs - isoDayStartMs;
  if (intoDay >= 0 && intoDay < 86_400_000 && Number.isInteger(timeMs)) {
    const h = Math.floor(intoDay / 3_600_000);
    const m = Math.floor(intoDay / 60_000) % 60;
    const sec = Math.floor(intoDay / 1000) % 60;
    const ms = intoDay % 1000;
    return `${isoDayPrefix}${TWO_DIGITS[h]}:${TWO_DIGITS[m]}:${TWO_DIGITS[sec]}.${ms < 10 ? '00' : ms < 100 ? '0' : ''}${ms}Z`;
  }
  const date = new Date(timeMs);
  if (Number.isNaN(date.getTime())) return '';
  const iso = date.toISOString();
  // Only plain four-digit years (`YYYY-MM-DDT`) are kept as the day to reuse.
  if (iso.length === 24 && Number.isInteger(timeMs)) {
    isoDayStartMs = timeMs - (((timeMs % 86_400_000) + 86_400_000) % 86_400_000);
    isoDayPrefix = iso.slice(0, 11);
  }
  return iso;
}

const TWO_DIGITS = Array.from({ length: 60 }, (_, i) => String(i).padStart(2, '0'));
let isoDayStartMs = Number.NaN;
let isoDayPrefix = '';
