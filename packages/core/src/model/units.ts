/**
 * Unit conversions used across Leadline. Every other module converts through these, so a unit
 * rule (for example which foot a log meant) lives in one place.
 */

/** Metres in one international foot (exact, 1959 agreement). */
export const METRES_PER_FOOT = 0.3048;
/** Metres in one US survey foot (exact, 1200/3937; still used by some US state plane CRSs). */
export const METRES_PER_US_SURVEY_FOOT = 1200 / 3937;
/** Metres in one international nautical mile (exact). */
export const METRES_PER_NAUTICAL_MILE = 1852;
/** Metres in one fathom (6 international feet). */
export const METRES_PER_FATHOM = 6 * METRES_PER_FOOT;
/** Metres per second in one knot (one nautical mile per hour). */
export const MPS_PER_KNOT = METRES_PER_NAUTICAL_MILE / 3600;

/** A length unit Leadline understands in headers, cells and options. */
export type LengthUnit = 'm' | 'km' | 'ft' | 'us-ft' | 'fathom' | 'nmi';
/** A speed unit Leadline understands in headers, cells and options. */
export type SpeedUnit = 'mps' | 'knot' | 'kmh';

const METRES_PER: Record<LengthUnit, number> = {
  m: 1,
  km: 1000,
  ft: METRES_PER_FOOT,
  'us-ft': METRES_PER_US_SURVEY_FOOT,
  fathom: METRES_PER_FATHOM,
  nmi: METRES_PER_NAUTICAL_MILE,
};

const MPS_PER: Record<SpeedUnit, number> = { mps: 1, knot: MPS_PER_KNOT, kmh: 1000 / 3600 };

/** Converts a length in `unit` to metres; `NaN` stays `NaN`. */
export function toMetres(value: number, unit: LengthUnit): number {
  return value * METRES_PER[unit];
}

/** Converts a length in metres to `unit`; `NaN` stays `NaN`. */
export function fromMetres(valueM: number, unit: LengthUnit): number {
  return valueM / METRES_PER[unit];
}

/** Converts a speed in `unit` to metres per second; `NaN` stays `NaN`. */
export function toMetresPerSecond(value: number, unit: SpeedUnit): number {
  return value * MPS_PER[unit];
}

/** Converts a speed in metres per second to `unit`; `NaN` stays `NaN`. */
export function fromMetresPerSecond(valueMps: number, unit: SpeedUnit): number {
  return valueMps / MPS_PER[unit];
}

/** Degrees to radians. */
export function degToRad(deg: number): number {
  return (deg * Math.PI) / 180;
}

/** Radians to degrees. */
export function radToDeg(rad: number): number {
  return (rad * 180) / Math.PI;
}

/** Wraps an angle in degrees into [0, 360); used for headings, bearings and azimuths. */
export function normaliseAzimuthDeg(deg: number): number {
  const wrapped = deg % 360;
  return wrapped < 0 ? wrapped + 360 : wrapped + 0; // `+ 0` turns -0 into 0
}

/** Wraps a longitude or signed angle in degrees into [-180, 180); a value already inside comes back untouched (no rounding noise). */
export function normaliseLongitudeDeg(deg: number): number {
  if (deg >= -180 && deg < 180) return deg;
  const wrapped = (((deg + 180) % 360) + 360) % 360;
  return wrapped - 180;
}

/** Wraps a longitude difference in radians into [−π, π); a value already inside comes back untouched. */
export function normaliseLongitudeRad(rad: number): number {
  if (rad >= -Math.PI && rad < Math.PI) return rad;
  return rad - 2 * Math.PI * Math.floor((rad + Math.PI) / (2 * Math.PI));
}

const LENGTH_UNIT_WORDS: ReadonlyArray<readonly [RegExp, LengthUnit]> = [
  [/^(m|metres?|meters?)$/i, 'm'],
  [/^(km|kilomet(re|er)s?)$/i, 'km'],
  [/^(ft|feet|foot|')$/i, 'ft'],
  [/^(us-?ft|ftus|us survey f(oo|ee)t)$/i, 'us-ft'],
  [/^(fm|fathoms?)$/i, 'fathom'],
  [/^(nmi|nm|nautical miles?)$/i, 'nmi'],
];

/** Reads a length unit word (`m`, `metres`, `ft`, `feet`, `fathoms`, ...); `undefined` when unknown. */
export function parseLengthUnit(word: string): LengthUnit | undefined {
  const trimmed = word.trim();
  for (const [pattern, unit] of LENGTH_UNIT_WORDS) if (pattern.test(trimmed)) return unit;
  return undefined;
}

const SPEED_UNIT_WORDS: ReadonlyArray<readonly [RegExp, SpeedUnit]> = [
  [/^(m\/s|mps|ms-1|metres? per second)$/i, 'mps'],
  [/^(kn|kt|kts|knots?)$/i, 'knot'],
  [/^(km\/h|kmh|kph)$/i, 'kmh'],
];

/** Reads a speed unit word (`m/s`, `kn`, `knots`, `km/h`, ...); `undefined` when unknown. */
export function parseSpeedUnit(word: string): SpeedUnit | undefined {
  const trimmed = word.trim();
  for (const [pattern, unit] of SPEED_UNIT_WORDS) if (pattern.test(trimmed)) return unit;
  return undefined;
}
