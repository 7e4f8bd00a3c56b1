import { createLocalFrame } from '../geodesy/create-local-frame.js';
import type { Fix, Track } from '../model/track.js';
import { TrackBuilder } from '../model/track-builder.js';

/** Origin of the invented test site (Hollowtide Subsea's fish-farm inspection, invented). */
export const TEST_ORIGIN = { latDeg: 63.4412, lonDeg: 8.6931 } as const;

/** A small deterministic generator for test noise (mulberry32), returning a standard normal sampler. */
export function createNormalSampler(seed: number): () => number {
  let state = seed >>> 0;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => {
    const u = Math.max(uniform(), 1e-12);
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform());
  };
}

/** One local fix for `buildTestTrack`: metres east/north of TEST_ORIGIN, depth, time. */
export interface LocalFix {
  timeS: number;
  eastM: number;
  northM: number;
  depthM: number;
  extra?: Partial<Fix>;
}

/**
 * Test helper: a vehicle track built from local positions, with a surface unit 5 m south of the
 * origin when `withSurface` (so slant ranges are known). Test use only.
 */
export function buildTestTrack(
  fixes: readonly LocalFix[],
  options: { withSurface?: boolean; doubtful?: boolean } = {},
): Track {
  const frame = createLocalFrame(TEST_ORIGIN.latDeg, TEST_ORIGIN.lonDeg);
  const surface = frame.inverse(0, -5);
  const builder = new TrackBuilder(fixes.length + 1);
  fixes.forEach((f, index) => {
    const p = frame.inverse(f.eastM, f.northM);
    builder.push(
      {
        timeMs: Date.UTC(2026, 5, 3, 8, 0, 0) + Math.round(f.timeS * 1000),
        latDeg: p.latDeg,
        lonDeg: p.lonDeg,
        depthM: f.depthM,
        ...(options.withSurface === true ? { surfaceLatDeg: surface.latDeg, surfaceLonDeg: surface.lonDeg } : {}),
        ...f.extra,
      },
      index + 2,
    );
  });
  return builder.build({
    id: 'test',
    role: 'vehicle',
    provenance: {
      sourceFile: 'test.csv',
      format: 'csv',
      dialect: 'csv;comma',
      timeZone: 'UTC',
      depthSign: {
        rule: 'depth',
        doubtful: options.doubtful === true,
        reason: options.doubtful === true ? 'the test says so' : 'the log has a depth column',
      },
    },
  });
}

/**
 * Test helper: a vehicle swimming a 60 m square at 0.4 m/s, 1 fix per second, 15 m deep, with
 * Gaussian noise of `noiseM` per axis. Returns the local fixes (truth is `noiseM = 0`).
 */
export function squarePatrol(count: number, noiseM: number, seed = 1): LocalFix[] {
  const normal = createNormalSampler(seed);
  const fixes: LocalFix[] = [];
  for (let i = 0; i < count; i++) {
    const s = (i * 0.4) % 240;
    const side = Math.floor(s / 60);
    const along = s - side * 60;
    const east = side === 0 ? along : side === 1 ? 60 : side === 2 ? 60 - along : 0;
    const north = side === 0 ? 0 : side === 1 ? along : side === 2 ? 60 : 60 - along;
    fixes.push({
      timeS: i,
      eastM: east + noiseM * normal(),
      northM: north + noiseM * normal(),
      depthM: 15 + 0.05 * normal(),
    });
  }
  return fixes;
}
