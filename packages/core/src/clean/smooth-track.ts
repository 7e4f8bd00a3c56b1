import { isPlausiblePosition } from '../audit/audit-context.js';
import { createTangentPlane } from '../audit/create-tangent-plane.js';
import type { FixColumns, Track } from '../model/track.js';

/** Settings of `smoothTrack`. */
export interface SmoothOptions {
  /** Standard deviation of the vehicle's unmodelled acceleration, m/s² (the profile's `smoothingAccelerationMps2`). */
  accelerationSigmaMps2: number;
  /** Per-fix horizontal uncertainty at 95 %, metres (the audit's); `NaN` entries use `defaultHorizontal95M`. */
  horizontal95M?: Float64Array;
  /** Used where no per-fix uncertainty is known, metres at 95 %. Default 2. */
  defaultHorizontal95M?: number;
  /** Fixes with a non-zero flag (the audit's) are not used as measurements; their positions become the estimate. */
  flags?: ArrayLike<number>;
  /** Innovation gate: squared Mahalanobis distance above which a fix is rejected. Default 13.82 (χ², 2 degrees of freedom, 99.9 %). */
  gate?: number;
  /** After this many rejections in a row the filter restarts at the next fix (the track really moved). Default 5. */
  maxConsecutiveRejections?: number;
  /** A gap longer than this restarts the filter, seconds; nothing is carried across it. Default 120. */
  maxGapS?: number;
}

/** What `smoothTrack` returns. */
export interface SmoothResult {
  /** Same fixes and times; latitude and longitude replaced by the smoothed estimates. Depth and other columns unchanged. */
  track: Track;
  /** 1 where the innovation gate rejected the fix as an outlier. */
  gated: Uint8Array;
  gatedCount: number;
}

/** 95 % radius of a circular 2-D normal divided by its per-axis sigma: √(χ²₂(0.95)) = 2.4477 (IHO S-44 Ed. 6 ch. 2 rounds it to 2.45). */
const RADIUS95_PER_SIGMA = 2.4477;

/**
 * Smooths a track's horizontal positions with a constant-velocity Kalman filter (east and north in
 * a local metric frame, `createTangentPlane`, white-noise acceleration) followed by a Rauch–Tung–Striebel smoother.
 * Each measurement's noise comes from its 95 % horizontal uncertainty. Innovation gating rejects
 * outliers (they do not pull the estimate; their positions are replaced by the smoothed track),
 * and a run of `maxConsecutiveRejections` restarts the filter. Fixes without a plausible position,
 * flagged fixes and fixes whose time goes backwards are not used as measurements. Nothing is
 * carried across a gap longer than `maxGapS`: each side is smoothed on its own. Depth is left as logged.
 */
export function smoothTrack(track: Track, options: SmoothOptions): SmoothResult {
  const n = track.length;
  const { latDeg, lonDeg, timeMs } = track.columns;
  const gate = options.gate ?? 13.82;
  const maxRejections = options.maxConsecutiveRejections ?? 5;
  const maxGapMs = (options.maxGapS ?? 120) * 1000;
  const q = options.accelerationSigmaMps2 * options.accelerationSigmaMps2;
  const defaultSigma = (options.defaultHorizontal95M ?? 2) / RADIUS95_PER_SIGMA;
  const flags = options.flags;
  const gated = new Uint8Array(n);

  let origin = -1;
  for (let i = 0; i < n && origin < 0; i++)
    if (isPlausiblePosition(latDeg[i] as number, lonDeg[i] as number)) origin = i;
  const columns = { ...track.columns } as FixColumns;
  if (origin < 0) return { track: { ...track, columns }, gated, gatedCount: 0 };
  const frame = createTangentPlane(latDeg[origin] as number, lonDeg[origin] as number);
  const zE = new Float64Array(n);
  const zN = new Float64Array(n);
  frame.forwardColumns(latDeg, lonDeg, zE, zN);
  const point = new Float64Array(2);
  const usable = new Uint8Array(n);
  for (let i = 0; i < n; i++)
    usable[i] = isPlausiblePosition(latDeg[i] as number, lonDeg[i] as number) && !flags?.[i] ? 1 : 0;

  // filtered state per fix and the shared covariance (east and north see the same noise)
  const xE = new Float64Array(n);
  const vE = new Float64Array(n);
  const xN = new Float64Array(n);
  const vN = new Float64Array(n);
  const pA = new Float64Array(n);
  const pB = new Float64Array(n);
  const pC = new Float64Array(n);
  const tau = new Float64Array(n); // processing time, never going backwards
  const restart = new Uint8Array(n); // 1 where the filter (re)started: the smoother does not cross it

  let initialised = false;
  let ex = 0;
  let evx = 0;
  let ny = 0;
  let evy = 0;
  let a = 0;
  let b = 0;
  let c = 0;
  let rejections = 0;
  let lastTau = Number.NEGATIVE_INFINITY;
  let lastAcceptedTau = Number.NEGATIVE_INFINITY;
  const speedPrior = 4; // m/s, one sigma of the unknown initial velocity

  for (let i = 0; i < n; i++) {
    const t = timeMs[i] as number;
    const backwards = t < lastTau;
    const now = backwards ? lastTau : t;
    tau[i] = now;
    const sigmaRaw =
      options.horizontal95M === undefined ? Number.NaN : (options.horizontal95M[i] as number) / RADIUS95_PER_SIGMA;
    const sigma = sigmaRaw > 0 ? sigmaRaw : defaultSigma;
    const r = sigma * sigma;
    const canMeasure = usable[i] === 1 && !backwards;
    const mustRestart = !initialised || now - lastAcceptedTau > maxGapMs || rejections >= maxRejections;
    if (mustRestart && canMeasure) {
      ex = zE[i] as number;
      ny = zN[i] as number;
      evx = 0;
      evy = 0;
      a = r;
      b = 0;
      c = speedPrior * speedPrior;
      initialised = true;
      rejections = 0;
      restart[i] = 1;
      lastAcceptedTau = now;
    } else if (initialised) {
      const dt = (now - lastTau) / 1000;
      if (dt > 0) {
        ex += dt * evx;
        ny += dt * evy;
        const dt2 = dt * dt;
        const na = a + 2 * dt * b + dt2 * c + (q * dt2 * dt) / 3;
        const nb = b + dt * c + (q * dt2) / 2;
        const nc = c + q * dt;
        a = na;
        b = nb;
        c = nc;
      }
      if (canMeasure) {
        const yE = (zE[i] as number) - ex;
        const yN = (zN[i] as number) - ny;
        const s = a + r;
        if ((yE * yE + yN * yN) / s > gate) {
          gated[i] = 1;
          rejections++;
        } else {
          const k0 = a / s;
          const k1 = b / s;
          ex += k0 * yE;
          ny += k0 * yN;
          evx += k1 * yE;
          evy += k1 * yN;
          const na = (1 - k0) * a;
          const nb = (1 - k0) * b;
          const nc = c - k1 * b;
          a = na;
          b = nb;
          c = nc;
          rejections = 0;
          lastAcceptedTau = now;
        }
      }
    } else {
      // nothing measured yet: the fix gets no estimate until the filter starts
      restart[i] = 1;
    }
    lastTau = now;
    xE[i] = initialised ? ex : Number.NaN;
    vE[i] = evx;
    xN[i] = initialised ? ny : Number.NaN;
    vN[i] = evy;
    pA[i] = a;
    pB[i] = b;
    pC[i] = c;
  }

  // Rauch–Tung–Striebel backward pass, segment by segment (never across a restart)
  let sE = 0;
  let sVE = 0;
  let sN = 0;
  let sVN = 0;
  const outLat = new Float64Array(n);
  const outLon = new Float64Array(n);
  for (let k = n - 1; k >= 0; k--) {
    if (k === n - 1 || restart[k + 1] === 1) {
      sE = xE[k] as number;
      sVE = vE[k] as number;
      sN = xN[k] as number;
      sVN = vN[k] as number;
    } else {
      const dt = ((tau[k + 1] as number) - (tau[k] as number)) / 1000;
      const fa = pA[k] as number;
      const fb = pB[k] as number;
      const fc = pC[k] as number;
      const e0 = xE[k] as number;
      const e1 = vE[k] as number;
      const n0 = xN[k] as number;
      const n1 = vN[k] as number;
      if (dt > 0) {
        const dt2 = dt * dt;
        const ppa = fa + 2 * dt * fb + dt2 * fc + (q * dt2 * dt) / 3;
        const ppb = fb + dt * fc + (q * dt2) / 2;
        const ppc = fc + q * dt;
        const det = ppa * ppc - ppb * ppb;
        // C = P Fᵀ Pp⁻¹ with P Fᵀ = [[a + dt b, b], [b + dt c, c]]
        const m00 = fa + dt * fb;
        const m01 = fb;
        const m10 = fb + dt * fc;
        const m11 = fc;
        const c00 = (m00 * ppc - m01 * ppb) / det;
        const c01 = (-m00 * ppb + m01 * ppa) / det;
        const c10 = (m10 * ppc - m11 * ppb) / det;
        const c11 = (-m10 * ppb + m11 * ppa) / det;
        const dE0 = sE - (e0 + dt * e1);
        const dE1 = sVE - e1;
        const dN0 = sN - (n0 + dt * n1);
        const dN1 = sVN - n1;
        sE = e0 + c00 * dE0 + c01 * dE1;
        sVE = e1 + c10 * dE0 + c11 * dE1;
        sN = n0 + c00 * dN0 + c01 * dN1;
        sVN = n1 + c10 * dN0 + c11 * dN1;
      }
      // dt = 0: same instant, same estimate
    }
    if (Number.isNaN(sE)) {
      outLat[k] = latDeg[k] as number;
      outLon[k] = lonDeg[k] as number;
    } else {
      frame.inverseInto(sE, sN, point);
      outLat[k] = point[0] as number;
      outLon[k] = point[1] as number;
    }
  }
  columns.latDeg = outLat;
  columns.lonDeg = outLon;
  let gatedCount = 0;
  for (let i = 0; i < n; i++) gatedCount += gated[i] as number;
  return { track: { ...track, columns }, gated, gatedCount };
}
