import { InvalidArgumentError } from '../errors.js';
import { normaliseAzimuthDeg } from '../model/units.js';
import type { RandomSource } from './create-random-source.js';
import type { VehiclePlatform } from './vehicle-platforms.js';

/** A point in a site's local east-north frame, metres, with depth positive down. */
export interface LocalPoint {
  eastM: number;
  northM: number;
  depthM: number;
}

/**
 * What the vehicle flies on the bottom, in the site's local frame (metres east/north of the site
 * origin, depth positive down, azimuths in degrees clockwise from north):
 * - `lawnmower`: passes parallel to a quay wall (from `wallStart` along `wallAzimuthDeg` for
 *   `wallLengthM`; the water is to the right of that direction), `lineCount` lines spaced
 *   `lineSpacingM` apart from `firstOffsetM` off the wall, flown facing the wall at `altitudeM`
 *   over a seabed `wallFootDepthM` deep at the wall that deepens by `seabedSlope` m per m outward;
 *   then back out again.
 * - `circles`: laps around a net pen's centre at `radiusM`, facing the net, from `topDepthM`
 *   down to `bottomDepthM` over `laps` laps, then back up the other way round.
 * - `transit`: straight runs from `from` to `to` and back, heading along the track.
 * - `station`: holding over a target at `depthM` with a fixed heading and a small wander
 *   (`wanderSigmaM`, metres, one axis).
 */
export type VehiclePattern =
  | {
      kind: 'lawnmower';
      wallStartEastM: number;
      wallStartNorthM: number;
      wallAzimuthDeg: number;
      wallLengthM: number;
      firstOffsetM: number;
      lineSpacingM: number;
      lineCount: number;
      wallFootDepthM: number;
      seabedSlope: number;
      altitudeM: number;
    }
  | {
      kind: 'circles';
      centreEastM: number;
      centreNorthM: number;
      radiusM: number;
      topDepthM: number;
      bottomDepthM: number;
      laps: number;
      clockwise: boolean;
    }
  | { kind: 'transit'; from: LocalPoint; to: LocalPoint }
  | { kind: 'station'; target: LocalPoint; headingDeg: number; wanderSigmaM: number };

/** The whole dive's flight plan: where the vehicle is launched and recovered, and what it flies in between. */
export interface VehicleFlightPlan {
  platform: VehiclePlatform;
  /** Launch and recovery point (near the surface unit), depth near 0. */
  launch: LocalPoint;
  pattern: VehiclePattern;
  /** Pattern speed, m/s; must not exceed the platform's limit. */
  speedMps: number;
  /** The dive's intended length, seconds; the recovery leg may end a few seconds later. */
  durationS: number;
}

/** The true vehicle track sampled at a fixed interval, local frame. */
export interface VehiclePathSamples {
  /** Seconds since the dive start. */
  timeS: Float64Array;
  eastM: Float64Array;
  northM: Float64Array;
  depthM: Float64Array;
  /** True heading, degrees in [0, 360). */
  headingDeg: Float64Array;
  /** The pattern's phase per sample: 0 descent, 1 bottom, 2 ascent. */
  phase: Uint8Array;
}

type HeadingRule = { kind: 'along' } | { kind: 'fixed'; deg: number } | { kind: 'face'; eastM: number; northM: number };

interface Leg {
  from: LocalPoint;
  to: LocalPoint;
  durationS: number;
  heading: HeadingRule;
  phase: 0 | 1 | 2;
  /** Station keeping: hold `from` with a wander instead of moving. */
  hold: boolean;
}

// Patterns fly at most this share of a platform's limits.
const LIMIT_SHARE = 0.8;

function legDuration(from: LocalPoint, to: LocalPoint, speedMps: number, verticalMps: number): number {
  const horizontal = Math.hypot(to.eastM - from.eastM, to.northM - from.northM);
  return Math.max(horizontal / speedMps, Math.abs(to.depthM - from.depthM) / verticalMps, 1e-3);
}

function patternVertices(pattern: VehiclePattern): { points: LocalPoint[]; heading: HeadingRule; closed: boolean } {
  switch (pattern.kind) {
    case 'lawnmower': {
      const a = (pattern.wallAzimuthDeg * Math.PI) / 180;
      const ue = Math.sin(a);
      const un = Math.cos(a);
      // The water side is to the right of the wall's direction.
      const ne = Math.cos(a);
      const nn = -Math.sin(a);
      const points: LocalPoint[] = [];
      for (let k = 0; k < pattern.lineCount; k++) {
        const offset = pattern.firstOffsetM + k * pattern.lineSpacingM;
        const depthM = pattern.wallFootDepthM + pattern.seabedSlope * offset - pattern.altitudeM;
        const ends = [0, pattern.wallLengthM];
        if (k % 2 === 1) ends.reverse();
        for (const along of ends) {
          points.push({
            eastM: pattern.wallStartEastM + along * ue + offset * ne,
            northM: pattern.wallStartNorthM + along * un + offset * nn,
            depthM,
          });
        }
      }
      return {
        points,
        heading: { kind: 'fixed', deg: normaliseAzimuthDeg(pattern.wallAzimuthDeg - 90) },
        closed: false,
      };
    }
    case 'circles': {
      const stepsPerLap = 72;
      const total = Math.max(1, Math.round(pattern.laps * stepsPerLap));
      const points: LocalPoint[] = [];
      for (let i = 0; i <= total; i++) {
        const angle = ((pattern.clockwise ? 1 : -1) * 2 * Math.PI * i) / stepsPerLap;
        points.push({
          eastM: pattern.centreEastM + pattern.radiusM * Math.sin(angle),
          northM: pattern.centreNorthM + pattern.radiusM * Math.cos(angle),
          depthM: pattern.topDepthM + ((pattern.bottomDepthM - pattern.topDepthM) * i) / total,
        });
      }
      return {
        points,
        heading: { kind: 'face', eastM: pattern.centreEastM, northM: pattern.centreNorthM },
        closed: false,
      };
    }
    case 'transit':
      return { points: [pattern.from, pattern.to], heading: { kind: 'along' }, closed: false };
    case 'station':
      return { points: [pattern.target], heading: { kind: 'fixed', deg: pattern.headingDeg }, closed: false };
  }
}

function interpolate(a: LocalPoint, b: LocalPoint, f: number): LocalPoint {
  return {
    eastM: a.eastM + (b.eastM - a.eastM) * f,
    northM: a.northM + (b.northM - a.northM) * f,
    depthM: a.depthM + (b.depthM - a.depthM) * f,
  };
}

function planLegs(plan: VehicleFlightPlan): Leg[] {
  const { platform, launch, pattern } = plan;
  const speed = plan.speedMps;
  const vertical = platform.maxVerticalSpeedMps * LIMIT_SHARE;
  const { points, heading } = patternVertices(pattern);
  const first = points[0] as LocalPoint;
  const legs: Leg[] = [];
  const descent = legDuration(launch, first, speed, vertical);
  legs.push({ from: launch, to: first, durationS: descent, heading: { kind: 'along' }, phase: 0, hold: false });
  let elapsed = descent;
  const ascentFrom = (p: LocalPoint) => legDuration(p, launch, speed, vertical);
  let current = first;
  if (pattern.kind === 'station') {
    const holdS = Math.max(0, plan.durationS - elapsed - ascentFrom(first));
    legs.push({ from: first, to: first, durationS: holdS, heading, phase: 1, hold: true });
    elapsed += holdS;
  } else if (points.length > 1) {
    let order = points;
    let index = 1;
    // Fly the pattern's vertices back and forth until only the ascent's time is left.
    for (let guard = 0; guard < 1_000_000; guard++) {
      if (index >= order.length) {
        order = [...order].reverse();
        index = 1;
      }
      const next = order[index] as LocalPoint;
      const duration = legDuration(current, next, speed, vertical);
      const spare = plan.durationS - elapsed - ascentFrom(next);
      if (spare < duration) {
        // Stop part-way along this leg, where the time left just covers the ascent (bisection).
        let low = 0;
        let high = 1;
        for (let k = 0; k < 40; k++) {
          const mid = (low + high) / 2;
          const over = elapsed + duration * mid + ascentFrom(interpolate(current, next, mid)) > plan.durationS;
          if (over) high = mid;
          else low = mid;
        }
        const f = low;
        const stop = interpolate(current, next, f);
        if (f > 0) legs.push({ from: current, to: stop, durationS: duration * f, heading, phase: 1, hold: false });
        elapsed += duration * f;
        current = stop;
        break;
      }
      legs.push({ from: current, to: next, durationS: duration, heading, phase: 1, hold: false });
      elapsed += duration;
      current = next;
      index++;
    }
  }
  legs.push({
    from: current,
    to: launch,
    durationS: ascentFrom(current),
    heading: { kind: 'along' },
    phase: 2,
    hold: false,
  });
  return legs;
}

/**
 * Samples the true vehicle track of a flight plan every `intervalS` seconds: descent from the
 * launch point to the pattern, the pattern flown until only the ascent's time is left, and the
 * ascent back to the launch point. Speeds stay within 80 % of the platform's limits; heading turns
 * no faster than its turn-rate limit. Deterministic for a given random source (used only for the
 * station-keeping wander). Throws `InvalidArgumentError` for a non-positive interval or speed, or
 * a pattern speed above the platform's limit.
 */
export function sampleVehiclePath(
  plan: VehicleFlightPlan,
  intervalS: number,
  random: RandomSource,
): VehiclePathSamples {
  if (!(intervalS > 0)) throw new InvalidArgumentError(`the sample interval must be positive, got ${intervalS} s`);
  if (!(plan.speedMps > 0) || plan.speedMps > plan.platform.maxSpeedMps)
    throw new InvalidArgumentError(
      `the pattern speed ${plan.speedMps} m/s must be positive and within the ${plan.platform.name}'s ${plan.platform.maxSpeedMps} m/s`,
    );
  const legs = planLegs(plan);
  let totalS = 0;
  for (const leg of legs) totalS += leg.durationS;
  const count = Math.floor(totalS / intervalS) + 1;
  const samples: VehiclePathSamples = {
    timeS: new Float64Array(count),
    eastM: new Float64Array(count),
    northM: new Float64Array(count),
    depthM: new Float64Array(count),
    headingDeg: new Float64Array(count),
    phase: new Uint8Array(count),
  };
  let legIndex = 0;
  let legStart = 0;
  let heading = Number.NaN;
  let wanderE = 0;
  let wanderN = 0;
  const wanderTauS = 20;
  const maxTurn = plan.platform.maxTurnRateDegPerS * intervalS;
  for (let i = 0; i < count; i++) {
    const t = i * intervalS;
    while (legIndex < legs.length - 1 && t > legStart + (legs[legIndex] as Leg).durationS) {
      legStart += (legs[legIndex] as Leg).durationS;
      legIndex++;
    }
    const leg = legs[legIndex] as Leg;
    const f = leg.durationS > 0 ? Math.min(1, Math.max(0, (t - legStart) / leg.durationS)) : 1;
    let point = interpolate(leg.from, leg.to, f);
    if (leg.hold && plan.pattern.kind === 'station') {
      // A first-order Gauss–Markov wander around the target, standard deviation wanderSigmaM per axis.
      const decay = Math.exp(-intervalS / wanderTauS);
      const kick = plan.pattern.wanderSigmaM * Math.sqrt(1 - decay * decay);
      wanderE = wanderE * decay + random.normal(0, kick);
      wanderN = wanderN * decay + random.normal(0, kick);
      point = { eastM: point.eastM + wanderE, northM: point.northM + wanderN, depthM: point.depthM };
    }
    let target: number;
    const rule = leg.heading;
    if (rule.kind === 'fixed') target = rule.deg;
    else if (rule.kind === 'face') target = Math.atan2(rule.eastM - point.eastM, rule.northM - point.northM);
    else target = Math.atan2(leg.to.eastM - leg.from.eastM, leg.to.northM - leg.from.northM);
    if (rule.kind !== 'fixed') target = (target * 180) / Math.PI;
    const moving =
      rule.kind !== 'along' || Math.hypot(leg.to.eastM - leg.from.eastM, leg.to.northM - leg.from.northM) > 0.01;
    if (Number.isNaN(heading)) heading = normaliseAzimuthDeg(moving ? target : 0);
    else if (moving) {
      const turn = ((target - heading + 540) % 360) - 180;
      heading = normaliseAzimuthDeg(heading + Math.max(-maxTurn, Math.min(maxTurn, turn)));
    }
    samples.timeS[i] = t;
    samples.eastM[i] = point.eastM;
    samples.northM[i] = point.northM;
    samples.depthM[i] = Math.max(0, point.depthM);
    samples.headingDeg[i] = heading;
    samples.phase[i] = leg.phase;
  }
  return samples;
}
