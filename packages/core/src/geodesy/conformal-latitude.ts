/**
 * Conformal latitude on an ellipsoid (Karney 2011, "Transverse Mercator with an accuracy of a few
 * nanometers", eqs. 7–9 and 19–21), shared by the Transverse Mercator and Mercator projections.
 * Works with tangents so the poles need no special case.
 */

/** Converts between the tangents of geodetic and conformal latitude for eccentricity² `e2`. */
export interface ConformalLatitude {
  /** tan(conformal latitude) from tan(geodetic latitude). */
  conformalTan(tau: number): number;
  /** tan(geodetic latitude) from tan(conformal latitude), by Newton's method. */
  geodeticTan(tauPrime: number): number;
  /**
   * Geodetic latitude (radians) from tan(conformal latitude), by a sine series whose coefficients
   * are taken once from `geodeticTan` itself: the same values to about 1e-15 rad, several times faster.
   */
  geodeticLatitude(tauPrime: number): number;
}

/** Terms of the conformal → geodetic sine series; term j falls off like (e²/2)^j, so 8 reach double precision. */
const SERIES_TERMS = 8;
/** Samples of the discrete sine transform that yields the coefficients (exact for fewer terms than samples). */
const SERIES_SAMPLES = 32;

/** Builds the conformal-latitude conversions for an ellipsoid of eccentricity squared `e2` (0 for a sphere). */
export function createConformalLatitude(e2: number): ConformalLatitude {
  const e = Math.sqrt(e2);
  const e2m = 1 - e2;
  // Newton from the guess τ'/(1 − e²), as GeographicLib's Math::tauf: convergence is quadratic, so
  // stopping at |δτ| < 1.5e-9 leaves an error far below double precision.
  const tauTolerance = Math.sqrt(Number.EPSILON) / 10;
  function conformalTan(tau: number): number {
    if (e === 0) return tau;
    const sigma = Math.sinh(e * Math.atanh((e * tau) / Math.sqrt(1 + tau * tau)));
    return tau * Math.sqrt(1 + sigma * sigma) - sigma * Math.sqrt(1 + tau * tau);
  }
  function geodeticTan(tauPrime: number): number {
    if (e === 0) return tauPrime;
    let tau = tauPrime / e2m;
    for (let i = 0; i < 5; i++) {
      const tp = conformalTan(tau);
      const dTau =
        ((tauPrime - tp) / Math.sqrt(1 + tp * tp)) * ((1 + e2m * tau * tau) / (e2m * Math.sqrt(1 + tau * tau)));
      tau += dTau;
      if (!(Math.abs(dTau) >= tauTolerance * Math.max(1, Math.abs(tau)))) break;
    }
    return tau;
  }
  // φ − χ is odd with period π, so φ = χ + Σ c_j sin(2jχ); the c_j come from a discrete sine
  // transform of the exact (Newton) values at 2χ = kπ/N, exact for a band-limited series.
  const c = new Float64Array(SERIES_TERMS);
  for (let k = 1; k < SERIES_SAMPLES; k++) {
    const theta = (k * Math.PI) / SERIES_SAMPLES;
    const chi = theta / 2;
    const difference = Math.atan(geodeticTan(Math.tan(chi))) - chi;
    for (let j = 0; j < SERIES_TERMS; j++)
      c[j] = (c[j] as number) + (2 / SERIES_SAMPLES) * difference * Math.sin((j + 1) * theta);
  }
  function geodeticLatitude(tauPrime: number): number {
    const chi = Math.atan(tauPrime);
    if (e === 0 || !Number.isFinite(tauPrime)) return chi;
    // sin 2χ and cos 2χ from tan χ, then Clenshaw's sum of c_j sin(2jχ).
    const t2 = tauPrime * tauPrime;
    const sin2 = (2 * tauPrime) / (1 + t2);
    const cos2 = (1 - t2) / (1 + t2);
    const twoCos = 2 * cos2;
    let b1 = 0;
    let b2 = 0;
    for (let j = SERIES_TERMS - 1; j >= 0; j--) {
      const b0 = (c[j] as number) + twoCos * b1 - b2;
      b2 = b1;
      b1 = b0;
    }
    return chi + b1 * sin2;
  }
  return { conformalTan, geodeticTan, geodeticLatitude };
}
