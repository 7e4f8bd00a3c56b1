import { createReprojection } from './create-reprojection.js';
import { type ResolveCrsOptions, resolveCrs } from './resolve-crs.js';

/** WGS 84 positions converted from a CRS, with how and which rows failed. */
export interface ConvertToWgs84Result {
  lonDeg: Float64Array;
  latDeg: Float64Array;
  /** The CRS's `note`: method (proj4, supplied grid, or Helmert fallback) and accuracy, for output. */
  method: string;
  /** Horizontal accuracy of the datum step in metres, `undefined` when the dataset states none. */
  accuracyM: number | undefined;
  /** Indices whose finite input could not be converted (their outputs are `NaN`). */
  failedIndices: number[];
}

/**
 * Converts projected or geographic coordinates in an EPSG CRS (`EPSG:27700`, `25832`) to WGS 84
 * degrees, column by column. `x` is easting (or longitude), `y` northing (or latitude), in the
 * CRS's own unit. Rows that cannot be converted are listed in `failedIndices` so readers can emit
 * `projection-failed` rejections. Throws `InvalidArgumentError` for an unknown or unusable CRS
 * (see `resolveCrs`).
 */
export function convertToWgs84(
  crsCode: string,
  x: Float64Array,
  y: Float64Array,
  options: ResolveCrsOptions = {},
): ConvertToWgs84Result {
  const crs = resolveCrs(crsCode, options);
  const result = createReprojection(crs).inverse(x, y);
  return {
    lonDeg: result.x,
    latDeg: result.y,
    method: crs.note,
    accuracyM: crs.accuracyM,
    failedIndices: result.failedIndices,
  };
}
