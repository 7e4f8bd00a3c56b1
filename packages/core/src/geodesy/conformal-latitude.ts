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
}

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
  return { conformalTan, geodeticTan };
}
