/** A map projection working on columns of degrees and metres (the shape of every fast path in reprojection). */
export interface ColumnarProjection {
  /** Projects columns; `NaN` in gives `NaN` out; points outside the domain give non-finite values. */
  forward(lonDeg: Float64Array, latDeg: Float64Array, eastingM: Float64Array, northingM: Float64Array): void;
  /** Unprojects columns; `NaN` in gives `NaN` out. */
  inverse(eastingM: Float64Array, northingM: Float64Array, lonDeg: Float64Array, latDeg: Float64Array): void;
}
