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
    if (halfWidth === 4 && i >= 4 && i + 4 < n) {
      // the body of medianOfEight, inlined: a call per fix costs as much as the network itself
      let a0 = values[i - 4] as number;
      let a1 = values[i - 3] as number;
      let a2 = values[i - 2] as number;
      let a3 = values[i - 1] as number;
      let a4 = values[i + 1] as number;
      let a5 = values[i + 2] as number;
      let a6 = values[i + 3] as number;
      let a7 = values[i + 4] as number;
      if (!Number.isNaN(a0 + a1 + a2 + a3 + a4 + a5 + a6 + a7)) {
        let t = Math.min(a0, a1);
        a1 = Math.max(a0, a1);
        a0 = t;
        t = Math.min(a2, a3);
        a3 = Math.max(a2, a3);
        a2 = t;
        t = Math.min(a4, a5);
        a5 = Math.max(a4, a5);
        a4 = t;
        t = Math.min(a6, a7);
        a7 = Math.max(a6, a7);
        a6 = t;
        t = Math.min(a0, a2);
        a2 = Math.max(a0, a2);
        a0 = t;
        t = Math.min(a1, a3);
        a3 = Math.max(a1, a3);
        a1 = t;
        t = Math.min(a4, a6);
        a6 = Math.max(a4, a6);
        a4 = t;
        t = Math.min(a5, a7);
        a7 = Math.max(a5, a7);
        a5 = t;
        t = Math.min(a1, a2);
        a2 = Math.max(a1, a2);
        a1 = t;
        t = Math.min(a5, a6);
        a6 = Math.max(a5, a6);
        a5 = t;
        const lower = Math.max(Math.min(a0, a7), Math.min(a1, a6), Math.min(a2, a5), Math.min(a3, a4));
        const upper = Math.min(Math.max(a0, a7), Math.max(a1, a6), Math.max(a2, a5), Math.max(a3, a4));
        out[i] = (lower + upper) / 2;
        continue;
      }
    }
    let h = halfWidth;
    if (i < h) h = i;
    if (n - 1 - i < h) h = n - 1 - i;
    const from = i - h;
    const to = i + h;
    let count = 0;
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

/**
 * Median of eight numbers (mean of the 4th and 5th smallest); `NaN` when any is `NaN`. Sorts each
 * half with the first two layers of Batcher's odd-even merge network (Knuth TAOCP vol. 3 §5.3.4,
 * from memory), then takes the middle pair of the merged halves as max/min over the crossed pairs
 * (for sorted a0..a3 and b0..b3 the 4th smallest is max(min(a0,b3), min(a1,b2), min(a2,b1),
 * min(a3,b0)); checked against sorting in the tests). Branch-free: min and max compile to single
 * instructions, which matters at a million fixes.
 */
export function medianOfEight(
  a0: number,
  a1: number,
  a2: number,
  a3: number,
  a4: number,
  a5: number,
  a6: number,
  a7: number,
): number {
  if (Number.isNaN(a0 + a1 + a2 + a3 + a4 + a5 + a6 + a7)) return Number.NaN; // one test for all eight
  let t = Math.min(a0, a1);
  a1 = Math.max(a0, a1);
  a0 = t;
  t = Math.min(a2, a3);
  a3 = Math.max(a2, a3);
  a2 = t;
  t = Math.min(a4, a5);
  a5 = Math.max(a4, a5);
  a4 = t;
  t = Math.min(a6, a7);
  a7 = Math.max(a6, a7);
  a6 = t;
  t = Math.min(a0, a2);
  a2 = Math.max(a0, a2);
  a0 = t;
  t = Math.min(a1, a3);
  a3 = Math.max(a1, a3);
  a1 = t;
  t = Math.min(a4, a6);
  a6 = Math.max(a4, a6);
  a4 = t;
  t = Math.min(a5, a7);
  a7 = Math.max(a5, a7);
  a5 = t;
  t = Math.min(a1, a2);
  a2 = Math.max(a1, a2);
  a1 = t;
  t = Math.min(a5, a6);
  a6 = Math.max(a5, a6);
  a5 = t;
  const lower = Math.max(Math.min(a0, a7), Math.min(a1, a6), Math.min(a2, a5), Math.min(a3, a4));
  const upper = Math.min(Math.max(a0, a7), Math.max(a1, a6), Math.max(a2, a5), Math.max(a3, a4));
  return (lower + upper) / 2;
}

/**
 * Median of the non-`NaN` values among the `halfWidth` fixes either side of fix i (fix i left
 * out); `NaN` when none. Sorts a copy, so meant for the few fixes that need it, not for every fix.
 */
export function localMedian(values: Float64Array, i: number, halfWidth: number): number {
  const from = Math.max(0, i - halfWidth);
  const to = Math.min(values.length - 1, i + halfWidth);
  if (localScratch.length < to - from + 1) localScratch = new Float64Array(to - from + 1);
  let count = 0;
  for (let j = from; j <= to; j++) {
    if (j === i) continue;
    const v = values[j] as number;
    if (!Number.isNaN(v)) localScratch[count++] = v;
  }
  if (count === 0) return Number.NaN;
  // A typed sort (numeric, in place, no comparator calls) of a reused scratch: checks call this for
  // many fixes of a noisy log.
  const picked = localScratch.subarray(0, count).sort();
  const m = count >> 1;
  return count % 2 === 1 ? (picked[m] as number) : ((picked[m - 1] as number) + (picked[m] as number)) / 2;
}

let localScratch = new Float64Array(64);
