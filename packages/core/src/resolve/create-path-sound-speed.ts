import { InvalidArgumentError } from '../errors.js';
import type { WaterSoundSpeed } from './resolve-setup.js';
import {
  harmonicMeanSoundSpeed,
  type SoundSpeedSample,
  soundSpeedFreshBilaniukWong1993,
  soundSpeedFreshMarczak1997,
  soundSpeedMackenzie1981,
  soundSpeedUnesco1983AtDepth,
} from './sound-speed.js';

/** The mean speed of sound (m/s) along a straight acoustic path between two depths (m). */
export type PathSoundSpeed = (fromDepthM: number, toDepthM: number) => number;

/** Depth step, metres, at which a depth-dependent equation is sampled into a profile. */
const EQUATION_STEP_M = 1;

/**
 * Turns a setup's water sound speed into a function giving the effective (harmonic-mean) speed
 * over an acoustic path's depth span, in m/s. A number and the fresh-water equations (which have
 * no pressure term) give a constant; Mackenzie 1981 and UNESCO 1983 are sampled every metre from
 * the surface to `maxDepthM` (UNESCO converts depth to pressure at `latDeg`) and averaged like a
 * measured profile. Ray bending is not modelled. Throws `InvalidArgumentError` for a non-finite
 * `maxDepthM` or an equation-based method without a latitude where one is needed.
 */
export function createPathSoundSpeed(water: WaterSoundSpeed, maxDepthM: number, latDeg: number): PathSoundSpeed {
  switch (water.method) {
    case 'value':
      return () => water.soundSpeedMps;
    case 'fresh-marczak-1997': {
      const c = soundSpeedFreshMarczak1997(water.temperatureC);
      return () => c;
    }
    case 'fresh-bilaniuk-wong-1993': {
      const c = soundSpeedFreshBilaniukWong1993(water.temperatureC);
      return () => c;
    }
    case 'profile':
      return (from, to) => harmonicMeanSoundSpeed(water.samples, from, to);
    case 'mackenzie-1981':
    case 'unesco-1983': {
      if (!Number.isFinite(maxDepthM) || maxDepthM < 0)
        throw new InvalidArgumentError(`a depth span is needed to sample ${water.method}, got ${maxDepthM} m`);
      if (water.method === 'unesco-1983' && !Number.isFinite(latDeg))
        throw new InvalidArgumentError('unesco-1983 needs a latitude to turn depth into pressure');
      const samples: SoundSpeedSample[] = [];
      const last = Math.ceil(maxDepthM / EQUATION_STEP_M) + 1;
      for (let k = 0; k <= last; k++) {
        const depthM = k * EQUATION_STEP_M;
        const soundSpeedMps =
          water.method === 'mackenzie-1981'
            ? soundSpeedMackenzie1981(water.temperatureC, water.salinityPsu, depthM)
            : soundSpeedUnesco1983AtDepth(water.temperatureC, water.salinityPsu, depthM, latDeg, {
                temperatureScale: water.temperatureScale,
              });
        samples.push({ depthM, soundSpeedMps });
      }
      return createSlownessLookup(samples);
    }
  }
}

/** Harmonic-mean lookup over a fine, evenly spaced profile in O(1) per call via cumulative slowness. */
function createSlownessLookup(samples: readonly SoundSpeedSample[]): PathSoundSpeed {
  const n = samples.length;
  const cumulative = new Float64Array(n);
  for (let i = 1; i < n; i++) {
    const a = samples[i - 1] as SoundSpeedSample;
    const b = samples[i] as SoundSpeedSample;
    cumulative[i] =
      (cumulative[i - 1] as number) + segmentSlowness(a.depthM, a.soundSpeedMps, b.depthM, b.soundSpeedMps);
  }
  const first = samples[0] as SoundSpeedSample;
  const lastSample = samples[n - 1] as SoundSpeedSample;
  const slownessTo = (depthM: number): number => {
    if (depthM <= first.depthM) return (depthM - first.depthM) / first.soundSpeedMps;
    if (depthM >= lastSample.depthM)
      return (cumulative[n - 1] as number) + (depthM - lastSample.depthM) / lastSample.soundSpeedMps;
    const i = Math.min(n - 2, Math.floor((depthM - first.depthM) / EQUATION_STEP_M));
    const a = samples[i] as SoundSpeedSample;
    const b = samples[i + 1] as SoundSpeedSample;
    const c = a.soundSpeedMps + ((depthM - a.depthM) / (b.depthM - a.depthM)) * (b.soundSpeedMps - a.soundSpeedMps);
    return (cumulative[i] as number) + segmentSlowness(a.depthM, a.soundSpeedMps, depthM, c);
  };
  const speedAt = (depthM: number): number => {
    const d = Math.min(Math.max(depthM, first.depthM), lastSample.depthM);
    const i = Math.min(n - 2, Math.floor((d - first.depthM) / EQUATION_STEP_M));
    const a = samples[i] as SoundSpeedSample;
    const b = samples[i + 1] as SoundSpeedSample;
    return a.soundSpeedMps + ((d - a.depthM) / (b.depthM - a.depthM)) * (b.soundSpeedMps - a.soundSpeedMps);
  };
  return (from, to) => {
    if (Number.isNaN(from) || Number.isNaN(to)) return Number.NaN;
    if (from === to) return speedAt(from);
    return Math.abs(to - from) / Math.abs(slownessTo(to) - slownessTo(from));
  };
}

/** ∫ dz / c over one segment with c linear in z. */
function segmentSlowness(z0: number, c0: number, z1: number, c1: number): number {
  return Math.abs(c1 - c0) < 1e-12 ? (z1 - z0) / c0 : ((z1 - z0) * Math.log(c1 / c0)) / (c1 - c0);
}
