import { createLocalFrame } from '@leadline/core';
import { SEVERITY_CODE } from '../lib/prepare-plot-data';
import type { DiveFinding, DiveSummaryView, DiveViewData, S44ShareView, Severity } from '../types';

/** Options of `createSampleDive`. */
export interface SampleDiveOptions {
  /** Vehicle fixes to generate (at least 100). */
  fixCount: number;
  /** Seed of the noise and the faults; the same seed gives the same dive. */
  seed: number;
}

// An invented site of the invented operator Hollowtide Subsea.
const SITE = { name: 'Gullvik net pens', latDeg: 59.0412, lonDeg: 5.6127 } as const;
const START_MS = Date.UTC(2026, 5, 14, 7, 30, 0);

/** mulberry32 (a small public-domain PRNG), seeded. */
function createRandom(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function gaussian(random: () => number): number {
  const u = Math.max(random(), 1e-12);
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * random());
}

function lerp(a: number, b: number, t: number): number {
  return a + (b - a) * t;
}

/** The true path at dive fraction u ∈ [0, 1], local metres and depth. */
function pathAt(u: number): [number, number, number] {
  const pen = { e: 40, n: 60, r: 22 };
  const penStart: [number, number] = [pen.e - pen.r, pen.n];
  if (u < 0.06) {
    const t = u / 0.06;
    return [lerp(0, penStart[0], t), lerp(0, penStart[1], t), lerp(0.5, 8, t)];
  }
  if (u < 0.5) {
    const t = (u - 0.06) / 0.44;
    const angle = Math.PI + t * 6 * 2 * Math.PI;
    const r = pen.r + 0.8 * Math.sin(t * 40);
    return [pen.e + r * Math.cos(angle), pen.n + r * Math.sin(angle), lerp(8, 28, t)];
  }
  const quay = { e: -90, n: -20, azimuthDeg: 70, length: 60, spacing: 4, lines: 5 };
  const along: [number, number] = [
    Math.sin((quay.azimuthDeg * Math.PI) / 180),
    Math.cos((quay.azimuthDeg * Math.PI) / 180),
  ];
  const out: [number, number] = [along[1], -along[0]];
  const quayPoint = (a: number, o: number): [number, number] => [
    quay.e + along[0] * a + out[0] * o,
    quay.n + along[1] * a + out[1] * o,
  ];
  if (u < 0.56) {
    const t = (u - 0.5) / 0.06;
    const [qe, qn] = quayPoint(0, 3);
    return [lerp(penStart[0], qe, t), lerp(penStart[1], qn, t), lerp(28, 18, t)];
  }
  if (u < 0.94) {
    const t = ((u - 0.56) / 0.38) * quay.lines;
    const line = Math.min(quay.lines - 1, Math.floor(t));
    const f = t - line;
    const a = line % 2 === 0 ? f * quay.length : (1 - f) * quay.length;
    const o = 3 + line * quay.spacing;
    const [qe, qn] = quayPoint(a, o);
    return [qe, qn, 18 + 0.25 * o];
  }
  const t = (u - 0.94) / 0.06;
  const [qe, qn] = quayPoint(quay.lines % 2 === 0 ? 0 : quay.length, 3 + (quay.lines - 1) * quay.spacing);
  return [lerp(qe, 0, t), lerp(qn, 0, t), lerp(22, 0.5, t)];
}

/**
 * A deterministic invented dive for the preview page and the tests: a vehicle circling a net pen
 * while descending, then flying lines along a quay, with noise and injected faults (multipath
 * jumps, a time gap, a depth spike, a surface-unit drift). Its findings are the injected faults,
 * not an audit's output.
 */
export function createSampleDive({ fixCount, seed }: SampleDiveOptions): DiveViewData {
  const n = Math.max(100, Math.floor(fixCount));
  const random = createRandom(seed);
  const frame = createLocalFrame(SITE.latDeg, SITE.lonDeg);
  const intervalS = n > 20_000 ? 0.2 : 1;
  const timeMs = new Float64Array(n);
  const eastM = new Float64Array(n);
  const northM = new Float64Array(n);
  const depthM = new Float64Array(n);
  const findings: DiveFinding[] = [];
  const gapAt = Math.floor(n * 0.33);
  const gapS = 45;
  // Position noise is correlated from fix to fix (first-order autoregressive, about 0.3 m standard
  // deviation), as a filtered USBL solution is; white noise at 5 Hz would inflate the track length.
  const keep = Math.exp(-intervalS / 20);
  const kick = 0.3 * Math.sqrt(1 - keep * keep);
  let noiseE = 0;
  let noiseN = 0;
  for (let i = 0; i < n; i++) {
    const [e, no, d] = pathAt(i / (n - 1));
    noiseE = keep * noiseE + kick * gaussian(random);
    noiseN = keep * noiseN + kick * gaussian(random);
    timeMs[i] = START_MS + i * intervalS * 1000 + (i >= gapAt ? gapS * 1000 : 0);
    eastM[i] = e + noiseE;
    northM[i] = no + noiseN;
    depthM[i] = Math.max(0, d + 0.03 * gaussian(random));
  }
  const addFinding = (check: string, severity: Severity, start: number, end: number, message: string) =>
    findings.push({
      id: `${check}-${start}`,
      check,
      severity,
      startIndex: start,
      endIndex: end,
      startTimeMs: timeMs[start] as number,
      endTimeMs: timeMs[end] as number,
      message,
    });
  addFinding(
    'time-gap',
    'warn',
    gapAt - 1,
    gapAt,
    `No fix for ${(gapS + intervalS).toFixed(1)} s; the profile allows 10 s.`,
  );
  // Multipath jumps: a few fixes thrown off by 8–22 m.
  for (const at of [0.12, 0.21, 0.41, 0.62, 0.68, 0.88]) {
    const start = Math.floor(n * at) + Math.floor(random() * 20);
    const length = 1 + Math.floor(random() * 3);
    const jumpM = 8 + random() * 14;
    const angle = random() * 2 * Math.PI;
    for (let i = start; i < start + length; i++) {
      eastM[i] = (eastM[i] as number) + jumpM * Math.sin(angle);
      northM[i] = (northM[i] as number) + jumpM * Math.cos(angle);
    }
    addFinding(
      'position-jump',
      jumpM > 15 ? 'fail' : 'warn',
      start,
      start + length - 1,
      `${length === 1 ? 'A fix lies' : `${length} fixes lie`} ${jumpM.toFixed(1)} m off the track of their neighbours; the profile allows 5 m.`,
    );
  }
  const spikeAt = Math.floor(n * 0.71);
  depthM[spikeAt] = (depthM[spikeAt] as number) + 3.2;
  addFinding('depth-jump', 'warn', spikeAt, spikeAt, 'Depth changes by 3.2 m from one fix to the next and back.');

  // The surface unit: a boat holding position at 1 Hz, wandering slowly, drifting off once.
  const surfaceCount = Math.max(2, Math.floor(((timeMs[n - 1] as number) - START_MS) / 1000) + 1);
  const surfaceTime = new Float64Array(surfaceCount);
  const surfaceE = new Float64Array(surfaceCount);
  const surfaceN = new Float64Array(surfaceCount);
  let we = 0;
  let wn = 0;
  const driftFrom = Math.floor(surfaceCount * 0.76);
  const driftTo = Math.floor(surfaceCount * 0.84);
  for (let k = 0; k < surfaceCount; k++) {
    we = 0.995 * we + 0.08 * gaussian(random);
    wn = 0.995 * wn + 0.08 * gaussian(random);
    const inDrift = k >= driftFrom && k <= driftTo;
    const drift = inDrift ? 14 * Math.sin((Math.PI * (k - driftFrom)) / (driftTo - driftFrom)) : 0;
    surfaceTime[k] = START_MS + k * 1000;
    surfaceE[k] = we + drift * 0.8;
    surfaceN[k] = wn - drift * 0.6;
  }
  const driftStartFix = timeIndex(timeMs, START_MS + driftFrom * 1000);
  const driftEndFix = timeIndex(timeMs, START_MS + driftTo * 1000);
  addFinding(
    'surface-drift',
    'warn',
    driftStartFix,
    driftEndFix,
    'The surface unit moved 14.0 m from its held position; the profile allows 5 m while holding station.',
  );
  findings.sort((a, b) => a.startTimeMs - b.startTimeMs);

  const latDeg = new Float64Array(n);
  const lonDeg = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const p = frame.inverse(eastM[i] as number, northM[i] as number);
    latDeg[i] = p.latDeg;
    lonDeg[i] = p.lonDeg;
  }
  const surfaceLat = new Float64Array(surfaceCount);
  const surfaceLon = new Float64Array(surfaceCount);
  for (let k = 0; k < surfaceCount; k++) {
    const p = frame.inverse(surfaceE[k] as number, surfaceN[k] as number);
    surfaceLat[k] = p.latDeg;
    surfaceLon[k] = p.lonDeg;
  }
  // Only checks that judge single fixes flag them; a gap or a drifting surface unit does not make the fixes suspect.
  const severity = new Uint8Array(n);
  for (const f of findings.filter((x) => x.check === 'position-jump' || x.check === 'depth-jump'))
    for (let i = f.startIndex; i <= f.endIndex; i++)
      severity[i] = Math.max(severity[i] as number, SEVERITY_CODE[f.severity]);

  const worst = findings.some((f) => f.severity === 'fail')
    ? 'fail'
    : findings.some((f) => f.severity === 'warn')
      ? 'warn'
      : 'pass';
  return {
    id: `preview-${seed}-${n}`,
    title: `Preview dive: ${SITE.name}`,
    subtitle: `Hollowtide Subsea · inspection ROV · ${n.toLocaleString('en-GB')} simulated fixes`,
    verdict: worst,
    vehicle: { timeMs, latDeg, lonDeg, depthM },
    surface: { timeMs: surfaceTime, latDeg: surfaceLat, lonDeg: surfaceLon },
    fixSeverity: severity,
    findings,
    summary: summarise(timeMs, eastM, northM, depthM, surfaceTime, surfaceE, surfaceN, severity),
    s44: s44Shares(timeMs, eastM, northM, depthM, surfaceTime, surfaceE, surfaceN, severity),
    crsChoices: [
      { code: 'EPSG:25832', name: 'ETRS89 / UTM zone 32N', proj4: '+proj=utm +zone=32 +ellps=GRS80 +units=m +no_defs' },
    ],
  };
}

function timeIndex(timeMs: Float64Array, target: number): number {
  for (let i = 0; i < timeMs.length; i++) if ((timeMs[i] as number) >= target) return i;
  return timeMs.length - 1;
}

function surfaceAt(surfaceTime: Float64Array, values: Float64Array, t: number): number {
  const k = Math.min(values.length - 1, Math.max(0, Math.round((t - (surfaceTime[0] as number)) / 1000)));
  return values[k] as number;
}

function summarise(
  timeMs: Float64Array,
  eastM: Float64Array,
  northM: Float64Array,
  depthM: Float64Array,
  surfaceTime: Float64Array,
  surfaceE: Float64Array,
  surfaceN: Float64Array,
  severity: Uint8Array,
): DiveSummaryView {
  const n = timeMs.length;
  let distance = 0;
  let distance3d = 0;
  let maxDepth = 0;
  let depthSum = 0;
  let maxRange = 0;
  let maxSlant = 0;
  let flagged = 0;
  for (let i = 0; i < n; i++) {
    const d = depthM[i] as number;
    maxDepth = Math.max(maxDepth, d);
    depthSum += d;
    if ((severity[i] as number) > 0) flagged++;
    const t = timeMs[i] as number;
    const h = Math.hypot(
      (eastM[i] as number) - surfaceAt(surfaceTime, surfaceE, t),
      (northM[i] as number) - surfaceAt(surfaceTime, surfaceN, t),
    );
    maxRange = Math.max(maxRange, h);
    maxSlant = Math.max(maxSlant, Math.hypot(h, d));
    if (i > 0) {
      const dh = Math.hypot(
        (eastM[i] as number) - (eastM[i - 1] as number),
        (northM[i] as number) - (northM[i - 1] as number),
      );
      distance += dh;
      distance3d += Math.hypot(dh, d - (depthM[i - 1] as number));
    }
  }
  let bottomS = 0;
  for (let i = 1; i < n; i++)
    if ((depthM[i] as number) >= 0.8 * maxDepth && (depthM[i - 1] as number) >= 0.8 * maxDepth)
      bottomS += ((timeMs[i] as number) - (timeMs[i - 1] as number)) / 1000;
  const durationS = ((timeMs[n - 1] as number) - (timeMs[0] as number)) / 1000;
  return {
    startTimeMs: timeMs[0] as number,
    endTimeMs: timeMs[n - 1] as number,
    durationS,
    fixCount: n,
    meanFixRateHz: (n - 1) / durationS,
    distanceM: distance,
    distance3dM: distance3d,
    maxDepthM: maxDepth,
    meanDepthM: depthSum / n,
    timeOnBottomS: bottomS,
    maxHorizontalRangeM: maxRange,
    maxSlantRangeM: maxSlant,
    flaggedShare: flagged / n,
  };
}

// IHO S-44 Ed. 6.0.0 (2020) Table 1: THU = c + p·d, TVU = √(a² + (b·d)²), 95 %.
const S44 = [
  { order: 'exclusive', label: 'Exclusive', c: 1, p: 0, a: 0.15, b: 0.0075 },
  { order: 'special', label: 'Special', c: 2, p: 0, a: 0.25, b: 0.0075 },
  { order: '1a', label: '1a', c: 5, p: 0.05, a: 0.5, b: 0.013 },
  { order: '1b', label: '1b', c: 5, p: 0.05, a: 0.5, b: 0.013 },
  { order: '2', label: '2', c: 20, p: 0.1, a: 1, b: 0.023 },
] as const;

function s44Shares(
  timeMs: Float64Array,
  eastM: Float64Array,
  northM: Float64Array,
  depthM: Float64Array,
  surfaceTime: Float64Array,
  surfaceE: Float64Array,
  surfaceN: Float64Array,
  severity: Uint8Array,
): S44ShareView[] {
  // A plain uncertainty model for the preview: 0.1 m + 1 % of slant range for the USBL, 0.5 m GNSS,
  // 0.5° heading error (common-practice magnitudes, not any maker's figures).
  return S44.map(({ order, label, c, p, a, b }) => {
    let judged = 0;
    let meeting = 0;
    for (let i = 0; i < timeMs.length; i++) {
      if ((severity[i] as number) > 0) continue;
      const t = timeMs[i] as number;
      const d = depthM[i] as number;
      const h = Math.hypot(
        (eastM[i] as number) - surfaceAt(surfaceTime, surfaceE, t),
        (northM[i] as number) - surfaceAt(surfaceTime, surfaceN, t),
      );
      const slant = Math.hypot(h, d);
      const usbl = 0.1 + 0.01 * slant;
      const heading = h * Math.sin((0.5 * Math.PI) / 180);
      const thu = Math.sqrt(usbl * usbl + 0.25 + heading * heading);
      const tvu = 0.1 + 0.001 * d;
      judged++;
      if (thu <= c + p * d && tvu <= Math.sqrt(a * a + (b * d) ** 2)) meeting++;
    }
    return { order, label, judged, meeting, share: judged > 0 ? meeting / judged : null };
  });
}
