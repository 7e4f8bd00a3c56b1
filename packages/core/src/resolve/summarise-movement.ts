/** How far positions moved, summarised over the fixes that have both an old and a new position. */
export interface MovementSummary {
  /** Fixes with a finite movement value. */
  comparedCount: number;
  /** Metres; `NaN` when nothing was compared. Percentiles interpolate linearly between ranks (Hyndman & Fan type 7). */
  medianM: number;
  p95M: number;
  maxM: number;
  meanM: number;
  /** Root mean square, metres. */
  rmsM: number;
}

/**
 * Summarises per-fix distances in metres (`NaN` entries are skipped): median, 95th percentile
 * (linear interpolation between order statistics, the common "type 7" definition), maximum, mean
 * and RMS. Empty or all-`NaN` input gives `comparedCount` 0 and `NaN` statistics.
 */
export function summariseMovement(distancesM: ArrayLike<number>): MovementSummary {
  const values: number[] = [];
  for (let i = 0; i < distancesM.length; i++) {
    const d = distancesM[i] as number;
    if (Number.isFinite(d)) values.push(d);
  }
  if (values.length === 0)
    return {
      comparedCount: 0,
      medianM: Number.NaN,
      p95M: Number.NaN,
      maxM: Number.NaN,
      meanM: Number.NaN,
      rmsM: Number.NaN,
    };
  const sorted = Float64Array.from(values).sort();
  let sum = 0;
  let sumSquares = 0;
  for (const v of sorted) {
    sum += v;
    sumSquares += v * v;
  }
  return {
    comparedCount: sorted.length,
    medianM: quantile(sorted, 0.5),
    p95M: quantile(sorted, 0.95),
    maxM: sorted[sorted.length - 1] as number,
    meanM: sum / sorted.length,
    rmsM: Math.sqrt(sumSquares / sorted.length),
  };
}

function quantile(sorted: Float64Array, p: number): number {
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  const a = sorted[lo] as number;
  const b = sorted[hi] as number;
  return a + (h - lo) * (b - a);
}
