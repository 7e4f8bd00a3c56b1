/**
 * Speed of sound in water from temperature, salinity and depth (or pressure) by published
 * equations, and the effective speed over an acoustic path through a sound-speed profile.
 *
 * Sources:
 * - Mackenzie, K. V. (1981), "Nine-term equation for sound speed in the oceans",
 *   J. Acoust. Soc. Am. 70(3), 807–812.
 * - Chen, C.-T. & Millero, F. J. (1977), as coded in Fofonoff, N. P. & Millard, R. C. Jr. (1983),
 *   "Algorithms for computation of fundamental properties of seawater", UNESCO Technical Papers in
 *   Marine Science 44 (routines SVEL and DEPTH).
 * - Marczak, W. (1997), "Water as a standard in the measurements of speed of sound in liquids",
 *   J. Acoust. Soc. Am. 102, 2776.
 * - Bilaniuk, N. & Wong, G. S. K. (1993), "Speed of sound in pure water as a function of
 *   temperature", J. Acoust. Soc. Am. 93, 1609 (148-point fit, with the 1996 erratum).
 */

import { InvalidArgumentError } from '../errors.js';

/**
 * Speed of sound in sea water by Mackenzie's (1981) nine-term equation, in m/s.
 * Valid for 2–30 °C, salinity 25–40 (PSS-78) and depth 0–8000 m; outside that range the value is
 * an extrapolation (not rejected). `NaN` in any argument gives `NaN`.
 */
export function soundSpeedMackenzie1981(temperatureC: number, salinityPsu: number, depthM: number): number {
  const t = temperatureC;
  const s = salinityPsu - 35;
  const d = depthM;
  return (
    1448.96 +
    4.591 * t -
    5.304e-2 * t * t +
    2.374e-4 * t * t * t +
    1.34 * s +
    1.63e-2 * d +
    1.675e-7 * d * d -
    1.025e-2 * t * s -
    7.139e-13 * t * d * d * d
  );
}

/** The temperature scale a temperature is given in: ITS-90 (modern instruments) or IPTS-68 (UNESCO 1983). */
export type TemperatureScale = 'its90' | 'ipts68';

/** Options of {@link soundSpeedUnesco1983}. */
export interface Unesco1983Options {
  /** Scale of `temperatureC`; default `its90`, converted with T68 = 1.00024 × T90 (UNESCO 44 convention). */
  temperatureScale?: TemperatureScale;
}

/**
 * Speed of sound in sea water by the Chen & Millero (1977) equation as coded in UNESCO Technical
 * Papers in Marine Science 44 (routine SVEL), in m/s. Takes sea pressure in decibars (not depth;
 * see {@link pressureFromDepthUnesco1983}), salinity on PSS-78 and temperature in °C (ITS-90 by
 * default; the equation itself is defined on IPTS-68). Valid for 0–40 °C, salinity 0–40 and
 * 0–10 000 dbar; outside that range the value is an extrapolation. `NaN` in gives `NaN` out.
 */
export function soundSpeedUnesco1983(
  temperatureC: number,
  salinityPsu: number,
  pressureDbar: number,
  options: Unesco1983Options = {},
): number {
  const t = (options.temperatureScale ?? 'its90') === 'its90' ? 1.00024 * temperatureC : temperatureC;
  const s = salinityPsu;
  // SVEL works in bars.
  const p = pressureDbar / 10;
  const sr = Math.sqrt(Math.abs(s));
  // S² term
  const d = 1.727e-3 - 7.9836e-6 * p;
  // S^(3/2) term
  const b1 = 7.3637e-5 + 1.7945e-7 * t;
  const b0 = -1.922e-2 - 4.42e-5 * t;
  const b = b0 + b1 * p;
  // S¹ term
  const a3 = (-3.389e-13 * t + 6.649e-12) * t + 1.1e-10;
  const a2 = ((7.988e-12 * t - 1.6002e-10) * t + 9.1041e-9) * t - 3.9064e-7;
  const a1 = (((-2.0122e-10 * t + 1.0507e-8) * t - 6.4885e-8) * t - 1.258e-5) * t + 9.4742e-5;
  const a0 = (((-3.21e-8 * t + 2.006e-6) * t + 7.164e-5) * t - 1.262e-2) * t + 1.389;
  const a = ((a3 * p + a2) * p + a1) * p + a0;
  // S⁰ term
  const c3 = (-2.3643e-12 * t + 3.8504e-10) * t - 9.7729e-9;
  const c2 = (((1.0405e-12 * t - 2.5335e-10) * t + 2.5974e-8) * t - 1.7107e-6) * t + 3.126e-5;
  const c1 = (((-6.1185e-10 * t + 1.3621e-7) * t - 8.1788e-6) * t + 6.8982e-4) * t + 0.153563;
  const c0 = ((((3.1464e-9 * t - 1.478e-6) * t + 3.342e-4) * t - 5.80852e-2) * t + 5.03711) * t + 1402.388;
  const c = ((c3 * p + c2) * p + c1) * p + c0;
  return c + (a + b * sr + d * s) * s;
}

/**
 * Depth in metres from sea pressure in decibars at a latitude, by Saunders & Fofonoff (1976) as
 * coded in UNESCO Technical Papers in Marine Science 44 (routine DEPTH; standard ocean, 0 °C,
 * salinity 35). `NaN` in gives `NaN` out.
 */
export function depthFromPressureUnesco1983(pressureDbar: number, latDeg: number): number {
  const x0 = Math.sin((latDeg * Math.PI) / 180);
  const x = x0 * x0;
  // Gravity variation with latitude (Anon. 1970, Bulletin Géodésique), as in DEPTH.
  const gr = 9.780318 * (1 + (5.2788e-3 + 2.36e-5 * x) * x) + 1.092e-6 * pressureDbar;
  const p = pressureDbar;
  return ((((-1.82e-15 * p + 2.279e-10) * p - 2.2512e-5) * p + 9.72659) * p) / gr;
}

/**
 * Sea pressure in decibars at a depth in metres and a latitude: the exact inverse (Newton
 * iteration to 1e-9 dbar) of {@link depthFromPressureUnesco1983}, so it inherits that routine's
 * standard-ocean assumption (error of order 0.1 % against a real water column, which changes the
 * UNESCO sound speed by well under 0.1 m/s at diving depths). Throws `InvalidArgumentError` for
 * negative depth; `NaN` in gives `NaN` out.
 */
export function pressureFromDepthUnesco1983(depthM: number, latDeg: number): number {
  if (Number.isNaN(depthM) || Number.isNaN(latDeg)) return Number.NaN;
  if (depthM < 0) throw new InvalidArgumentError(`depth must be 0 m or more, got ${depthM} m`);
  // Start from ~1.0 dbar per metre and refine; the depth-pressure relation is smooth and monotonic.
  let p = depthM * 1.0;
  for (let i = 0; i < 50; i++) {
    const f = depthFromPressureUnesco1983(p, latDeg) - depthM;
    const h = 1e-3;
    const slope = (depthFromPressureUnesco1983(p + h, latDeg) - depthFromPressureUnesco1983(p - h, latDeg)) / (2 * h);
    const step = f / slope;
    p -= step;
    if (Math.abs(step) < 1e-9) break;
  }
  return p;
}

/**
 * Speed of sound in sea water by UNESCO 1983 (Chen & Millero) at a depth rather than a pressure:
 * converts depth to pressure with {@link pressureFromDepthUnesco1983} at `latDeg`, then calls
 * {@link soundSpeedUnesco1983}. Units: °C, PSS-78, metres positive down, degrees; m/s out.
 */
export function soundSpeedUnesco1983AtDepth(
  temperatureC: number,
  salinityPsu: number,
  depthM: number,
  latDeg: number,
  options: Unesco1983Options = {},
): number {
  return soundSpeedUnesco1983(temperatureC, salinityPsu, pressureFromDepthUnesco1983(depthM, latDeg), options);
}

/**
 * Speed of sound in pure (fresh) water at atmospheric pressure by Marczak (1997), in m/s, with the
 * coefficients as published by NPL ("Speed of sound in pure water"). Valid for 0–95 °C (ITS-90);
 * pressure and dissolved salts are ignored, which is fine for lakes and rivers at diving depths
 * (pressure adds about 0.016 m/s per metre of depth). `NaN` in gives `NaN` out.
 */
export function soundSpeedFreshMarczak1997(temperatureC: number): number {
  const t = temperatureC;
  return 1402.385 + t * (5.038813 + t * (-5.799136e-2 + t * (3.287156e-4 + t * (-1.398845e-6 + t * 2.78786e-9))));
}

/**
 * Speed of sound in pure (fresh) water at atmospheric pressure by Bilaniuk & Wong (1993), the
 * 148-point fit (with the 1996 erratum), in m/s. Valid for 0–100 °C (ITS-90); pressure is
 * ignored. `NaN` in gives `NaN` out.
 */
export function soundSpeedFreshBilaniukWong1993(temperatureC: number): number {
  const t = temperatureC;
  return (
    1402.38744 + t * (5.03836171 + t * (-5.81172916e-2 + t * (3.34638117e-4 + t * (-1.48259672e-6 + t * 3.1658502e-9))))
  );
}

/** One point of a sound-speed profile: speed in m/s at a depth in metres (positive down). */
export interface SoundSpeedSample {
  depthM: number;
  soundSpeedMps: number;
}

/**
 * The effective (harmonic-mean) speed of sound over the depth span between two depths, in m/s:
 * the span divided by the vertical one-way travel time through the profile, with speed varying
 * linearly between samples and held constant above the shallowest and below the deepest sample.
 * This is the speed that turns a travel time into a slant range for a straight acoustic path;
 * ray bending (refraction) is out of scope, so at long horizontal ranges through a strong
 * gradient the true path is longer than the straight line assumed here. When the two depths are
 * equal it returns the speed at that depth. Throws `InvalidArgumentError` for an empty profile,
 * non-finite samples, non-positive speeds or depths that do not increase.
 */
export function harmonicMeanSoundSpeed(
  profile: readonly SoundSpeedSample[],
  fromDepthM: number,
  toDepthM: number,
): number {
  if (profile.length === 0) throw new InvalidArgumentError('sound-speed profile has no samples');
  for (let i = 0; i < profile.length; i++) {
    const sample = profile[i] as SoundSpeedSample;
    if (!Number.isFinite(sample.depthM) || !Number.isFinite(sample.soundSpeedMps) || sample.soundSpeedMps <= 0)
      throw new InvalidArgumentError(
        `sound-speed profile sample ${i + 1} must have a finite depth and a positive speed, got ${sample.depthM} m, ${sample.soundSpeedMps} m/s`,
      );
    if (i > 0 && sample.depthM <= (profile[i - 1] as SoundSpeedSample).depthM)
      throw new InvalidArgumentError(`sound-speed profile depths must increase; sample ${i + 1} does not`);
  }
  if (Number.isNaN(fromDepthM) || Number.isNaN(toDepthM)) return Number.NaN;
  const top = Math.min(fromDepthM, toDepthM);
  const bottom = Math.max(fromDepthM, toDepthM);
  if (bottom === top) return soundSpeedAtDepth(profile, top);

  // Integrate dz / c(z) piecewise over the knots inside [top, bottom].
  const knots = [top];
  for (const sample of profile) if (sample.depthM > top && sample.depthM < bottom) knots.push(sample.depthM);
  knots.push(bottom);
  let slownessIntegral = 0;
  for (let i = 1; i < knots.length; i++) {
    const z0 = knots[i - 1] as number;
    const z1 = knots[i] as number;
    const c0 = soundSpeedAtDepth(profile, z0);
    const c1 = soundSpeedAtDepth(profile, z1);
    // For c linear in z: ∫ dz / c = Δz · ln(c1/c0) / (c1 − c0).
    slownessIntegral += Math.abs(c1 - c0) < 1e-12 ? (z1 - z0) / c0 : ((z1 - z0) * Math.log(c1 / c0)) / (c1 - c0);
  }
  return (bottom - top) / slownessIntegral;
}

/** Speed at a depth by linear interpolation, constant beyond the profile's ends. */
function soundSpeedAtDepth(profile: readonly SoundSpeedSample[], depthM: number): number {
  const first = profile[0] as SoundSpeedSample;
  const last = profile[profile.length - 1] as SoundSpeedSample;
  if (depthM <= first.depthM) return first.soundSpeedMps;
  if (depthM >= last.depthM) return last.soundSpeedMps;
  for (let i = 1; i < profile.length; i++) {
    const b = profile[i] as SoundSpeedSample;
    if (depthM <= b.depthM) {
      const a = profile[i - 1] as SoundSpeedSample;
      const f = (depthM - a.depthM) / (b.depthM - a.depthM);
      return a.soundSpeedMps + f * (b.soundSpeedMps - a.soundSpeedMps);
    }
  }
  return last.soundSpeedMps;
}
