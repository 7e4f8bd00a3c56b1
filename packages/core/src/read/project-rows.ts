import { convertToWgs84 } from '../crs/convert-to-wgs84.js';

/**
 * Converts buffered projected rows (`x` easting, `y` northing in the CRS's unit) to WGS 84 through
 * the CRS module. Rows that fail come back as `NaN`. An unknown CRS throws `InvalidArgumentError`
 * (a caller mistake), from the CRS module.
 */
export function projectRowsToWgs84(
  crsCode: string,
  rows: readonly { x: number; y: number }[],
): { latDeg: Float64Array; lonDeg: Float64Array; method: string; error?: string } {
  const x = new Float64Array(rows.length);
  const y = new Float64Array(rows.length);
  for (let i = 0; i < rows.length; i++) {
    x[i] = (rows[i] as { x: number }).x;
    y[i] = (rows[i] as { y: number }).y;
  }
  const result = convertToWgs84(crsCode, x, y);
  return { latDeg: result.latDeg, lonDeg: result.lonDeg, method: result.method };
}
