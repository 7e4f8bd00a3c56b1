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
    if (/e/i.test(text)) text = expandExponent(text);
  } else {
    text = value.toFixed(decimals);
    if (/e/i.test(text)) text = expandExponent(text);
    if (text.includes('.')) text = text.replace(/0+$/, '').replace(/\.$/, '');
  }
  if (/^-0(\.0*)?$/.test(text)) return '0';
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
  const date = new Date(timeMs);
  return Number.isNaN(date.getTime()) ? '' : date.toISOString();
}
