/**
 * Sliding-window robust statistics used by several checks. Windows are by fix index: the
 * `halfWidth` fixes either side of fix i, fix i itself left out, `NaN` values skipped.
 */

/**
 * Writes into `out[i]` the median of the non-`NaN` values among the neighbours either side of fix
 * i (fix i excluded). The window is symmetric: `halfWidth` fixes each side, fewer near the ends of
 * the log (so a moving vehicle's first and last fixes are not compared with one side only); `NaN`
 * where fewer than 2 neighbours have values, so the very first and last fix are never judged.
 */
export function neighbourMedian(values: Float64Array, halfWidth: number, out: Float64Array): Float64Array {
  const n = values.length;
  const scratch = new Float64Array(2 * halfWidth);
  for (let i = 0; i < n; i++) {
    let count = 0;
    let h = halfWidth;
    if (i < h) h = i;
    if (n - 1 - i < h) h = n - 1 - i;
    const from = i - h;
    const to = i + h;
    for (let j = from; j <= to; j++) {
      if (j === i) continue;
      const v = values[j] as number;
      if (Number.isNaN(v)) continue;
      // insertion sort as we go
      let k = count - 1;
      while (k >= 0 && (scratch[k] as number) > v) {
        scratch[k + 1] = scratch[k] as number;
        k--;
      }
      scratch[k + 1] = v;
      count++;
    }
    if (count < 2) out[i] = Number.NaN;
    else if (count % 2 === 1) out[i] = scratch[(count - 1) >> 1] as number;
    else out[i] = ((scratch[count / 2 - 1] as number) + (scratch[count / 2] as number)) / 2;
  }
  return out;
}

/**
 * Writes into `out[i]` the mean of the non-`NaN` values within `halfWidth` fixes of fix i (fix i
 * included); `NaN` when there are none. A running sum, so O(n) whatever the width.
 */
export function windowMean(values: Float64Array, halfWidth: number, out: Float64Array): Float64Array {
  const n = values.length;
  let sum = 0;
  let count = 0;
  let hi = -1; // last index added
  let lo = 0; // first index still in the sum
  for (let i = 0; i < n; i++) {
    const wantHi = i + halfWidth < n ? i + halfWidth : n - 1;
    while (hi < wantHi) {
      hi++;
      const v = values[hi] as number;
      if (!Number.isNaN(v)) {
        sum += v;
        count++;
      }
    }
    const wantLo = Math.max(i - halfWidth, 0);
    while (lo < wantLo) {
      const v = values[lo] as number;
      if (!Number.isNaN(v)) {
        sum -= v;
        count--;
      }
      lo++;
    }
    out[i] = count === 0 ? Number.NaN : sum / count;
  }
  return out;
}
