import { parseDecimal } from './parse-csv-row-fast.js';

/** Which axis a coordinate belongs to; decides the valid hemisphere letters and the range. */
export type CoordinateAxis = 'lat' | 'lon';

/** The written form a coordinate was found in. */
export type CoordinateForm = 'dd' | 'ddm' | 'dms';

/** A parsed coordinate, or why it could not be parsed. */
export type ParsedCoordinate =
  | { ok: true; deg: number; form: CoordinateForm }
  | {
      ok: false;
      code: 'unparsable-coordinate' | 'latitude-out-of-range' | 'longitude-out-of-range' | 'non-finite-value';
      expected: string;
    };

const NUMBER = /\d+(?:[.,]\d+)?|[.,]\d+/g;
const SEPARATORS = /^[\s°º˚'′’"″”:dDmMsS]*$/;

/**
 * Parses a latitude or longitude written as decimal degrees (`-59.5`, `59,5`), degrees and decimal
 * minutes (`59 30.000 N`, `59°30.0'N`) or degrees, minutes and seconds (`59°30'00.0"N`,
 * `59 30 00 N`), with a sign or a hemisphere letter before or after. A comma may be the decimal
 * mark. Checks minutes and seconds below 60 and the axis range (±90 / ±180).
 * Codes on failure: `unparsable-coordinate`, `non-finite-value`, `latitude-out-of-range`, `longitude-out-of-range`.
 */
export function parseCoordinate(text: string, axis: CoordinateAxis): ParsedCoordinate {
  // Fast path: `[+-]digits[.digits]` with nothing around it (what loggers write), the value `Number()` gives.
  const plainDecimal = parseDecimal(text, 0, text.length);
  if (!Number.isNaN(plainDecimal)) return checkRange(plainDecimal, axis, 'dd');
  const expectedForm =
    axis === 'lat'
      ? 'a latitude in decimal degrees, degrees-minutes or degrees-minutes-seconds, N/S or a sign'
      : 'a longitude in decimal degrees, degrees-minutes or degrees-minutes-seconds, E/W or a sign';
  let s = text.trim();
  // Fast path: a plain decimal number (the common case on the hot path).
  const plain = Number(s);
  if (s.length > 0 && Number.isFinite(plain) && !/[xXeE]/.test(s)) return checkRange(plain, axis, 'dd');
  if (/^[+-]?(nan|inf(inity)?)$/i.test(s)) return { ok: false, code: 'non-finite-value', expected: expectedForm };
  let sign = 1;
  let hemisphere = '';
  const lead = s.charAt(0).toUpperCase();
  if (lead === 'N' || lead === 'S' || lead === 'E' || lead === 'W') {
    hemisphere = lead;
    s = s.slice(1).trim();
  }
  const trail = s.charAt(s.length - 1).toUpperCase();
  if (trail === 'N' || trail === 'S' || trail === 'E' || trail === 'W') {
    if (hemisphere !== '') return { ok: false, code: 'unparsable-coordinate', expected: expectedForm };
    hemisphere = trail;
    s = s.slice(0, -1).trim();
  }
  if (s.startsWith('-')) {
    sign = -1;
    s = s.slice(1).trim();
  } else if (s.startsWith('+')) {
    s = s.slice(1).trim();
  }
  if (hemisphere !== '') {
    const valid = axis === 'lat' ? hemisphere === 'N' || hemisphere === 'S' : hemisphere === 'E' || hemisphere === 'W';
    if (!valid) return { ok: false, code: 'unparsable-coordinate', expected: expectedForm };
    if (hemisphere === 'S' || hemisphere === 'W') sign = sign === -1 ? 1 : -1;
    // a minus sign together with S or W is contradictory
    if (text.includes('-')) return { ok: false, code: 'unparsable-coordinate', expected: expectedForm };
  }
  const numbers = s.match(NUMBER);
  if (numbers === null || numbers.length > 3)
    return { ok: false, code: 'unparsable-coordinate', expected: expectedForm };
  if (!SEPARATORS.test(s.replace(NUMBER, ' ')))
    return { ok: false, code: 'unparsable-coordinate', expected: expectedForm };
  const values = numbers.map((n) => Number(n.replace(',', '.')));
  const [deg = Number.NaN, min = 0, sec = 0] = values;
  // only the last component may carry decimals
  for (let i = 0; i < numbers.length - 1; i++) {
    if (/[.,]/.test(numbers[i] as string)) return { ok: false, code: 'unparsable-coordinate', expected: expectedForm };
  }
  if (min >= 60 || sec >= 60)
    return { ok: false, code: 'unparsable-coordinate', expected: `${expectedForm} (minutes and seconds below 60)` };
  const form: CoordinateForm = values.length === 1 ? 'dd' : values.length === 2 ? 'ddm' : 'dms';
  return checkRange(sign * (deg + min / 60 + sec / 3600), axis, form);
}

function checkRange(deg: number, axis: CoordinateAxis, form: CoordinateForm): ParsedCoordinate {
  if (axis === 'lat' ? deg < -90 || deg > 90 : deg < -180 || deg > 180) {
    return axis === 'lat'
      ? { ok: false, code: 'latitude-out-of-range', expected: 'a latitude from -90 to 90 degrees' }
      : { ok: false, code: 'longitude-out-of-range', expected: 'a longitude from -180 to 180 degrees' };
  }
  return { ok: true, deg, form };
}
