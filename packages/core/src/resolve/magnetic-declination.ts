import geomagnetism from 'geomagnetism';
import { InvalidArgumentError } from '../errors.js';

/** The declination at a place and time, and which model gave it. */
export interface MagneticDeclination {
  /** Declination in degrees, positive east (magnetic north lies east of true north). */
  declinationDeg: number;
  /** The World Magnetic Model release used, e.g. `WMM-2025`. */
  modelName: string;
  /** The decimal year the model was evaluated at (fraction of the calendar year, as WMM defines it). */
  decimalYear: number;
}

/** Decimal year of a UTC time as the WMM documents define it: 2025-07-02T12:00Z is 2025.5. */
export function decimalYearFromTimeMs(timeMs: number): number {
  const year = new Date(timeMs).getUTCFullYear();
  const start = Date.UTC(year, 0, 1);
  const end = Date.UTC(year + 1, 0, 1);
  return year + (timeMs - start) / (end - start);
}

/**
 * Magnetic declination (degrees, positive east) from the World Magnetic Model (WMM2025 from
 * 2024-11-13, WMM2020 before, via the `geomagnetism` package) at a WGS 84 position, a height in
 * metres above the ellipsoid (0 for the sea surface is fine: 1 km changes D by well under 0.01°
 * at mid latitudes) and a UTC time in ms. Throws `InvalidArgumentError` for a non-finite input or
 * a time outside every bundled model's validity (give the declination as a number instead).
 */
export function magneticDeclination(latDeg: number, lonDeg: number, timeMs: number, heightM = 0): MagneticDeclination {
  if (![latDeg, lonDeg, timeMs, heightM].every(Number.isFinite) || Math.abs(latDeg) > 90)
    throw new InvalidArgumentError(
      `magnetic declination needs a finite latitude (−90..90), longitude, time and height; got ${latDeg}, ${lonDeg}, ${timeMs}, ${heightM}`,
    );
  const decimalYear = decimalYearFromTimeMs(timeMs);
  const year = Math.floor(decimalYear);
  // geomagnetism turns a Date into a decimal year with a fixed 365-day year; hand it the instant
  // that maps to the calendar-fraction decimal year WMM defines, so leap years come out right.
  const libraryDate = new Date(Date.UTC(year, 0, 1) + (decimalYear - year) * 365 * 86_400_000);
  let model: ReturnType<typeof geomagnetism.model>;
  try {
    model = geomagnetism.model(libraryDate, { allowOutOfBoundsModel: false });
  } catch (error) {
    throw new InvalidArgumentError(
      `no World Magnetic Model covers ${new Date(timeMs).toISOString()} (bundled: WMM2015–WMM2025, valid to 2029-11-13); give the declination as a number`,
      { cause: error },
    );
  }
  const point = model.point([latDeg, lonDeg, heightM / 1000]);
  return { declinationDeg: point.decl, modelName: model.name || 'WMM', decimalYear };
}
