/**
 * Transverse Mercator on an ellipsoid with Krüger's series to order n⁶ (Karney 2011, "Transverse
 * Mercator with an accuracy of a few nanometers", J. Geodesy 85, eqs. 35–36). Accurate to well
 * under a millimetre within 3900 km of the central meridian; used for UTM, the local frame and the
 * fast path of reprojection. Columnar and allocation-free in the loops.
 */

/** Parameters of one Transverse Mercator projection. */
export interface TransverseMercatorParams {
  /** Semi-major axis in metres. */
  a: number;
  /** Flattening (1/f = inverse flattening). */
  f: number;
  /** Central meridian, degrees. */
  lon0Deg: number;
  /** Latitude of origin, degrees. */
  lat0Deg: number;
  /** Scale factor on the central meridian. */
  k0: number;
  /** False easting and northing, metres. */
  falseEastingM: number;
  falseNorthingM: number;
}

/** A ready Transverse Mercator projection working on columns of degrees and metres. */
export interface TransverseMercator {
  readonly params: TransverseMercatorParams;
  /** Projects one position; writes easting/northing (m) into `out[0]`, `out[1]`. */
  forwardPoint(latDeg: number, lonDeg: number, out: Float64Array): void;
  /** Unprojects one position; writes latitude/longitude (deg) into `out[0]`, `out[1]`. */
  inversePoint(eastingM: number, northingM: number, out: Float64Array): void;
  /** Projects columns; `NaN` in gives `NaN` out. */
  forward(lonDeg: Float64Array, latDeg: Float64Array, eastingM: Float64Array, northingM: Float64Array): void;
  /** Unprojects columns; `NaN` in gives `NaN` out. */
  inverse(eastingM: Float64Array, northingM: Float64Array, lonDeg: Float64Array, latDeg: Float64Array): void;
}

const DEG = Math.PI / 180;

/** Builds a Transverse Mercator projection (Krüger series, order 6). */
export function createTransverseMercator(params: TransverseMercatorParams): TransverseMercator {
  const { a, f, k0, falseEastingM, falseNorthingM } = params;
  const n = f / (2 - f);
  const n2 = n * n;
  const n3 = n2 * n;
  const n4 = n3 * n;
  const n5 = n4 * n;
  const n6 = n5 * n;
  const e2 = f * (2 - f);
  const e = Math.sqrt(e2);
  const rectifyingRadius = (a / (1 + n)) * (1 + n2 / 4 + n4 / 64 + n6 / 256);
  const alpha = [
    n / 2 - (2 * n2) / 3 + (5 * n3) / 16 + (41 * n4) / 180 - (127 * n5) / 288 + (7891 * n6) / 37800,
    (13 * n2) / 48 - (3 * n3) / 5 + (557 * n4) / 1440 + (281 * n5) / 630 - (1983433 * n6) / 1935360,
    (61 * n3) / 240 - (103 * n4) / 140 + (15061 * n5) / 26880 + (167603 * n6) / 181440,
    (49561 * n4) / 161280 - (179 * n5) / 168 + (6601661 * n6) / 7257600,
    (34729 * n5) / 80640 - (3418889 * n6) / 1995840,
    (212378941 * n6) / 319334400,
  ];
  const beta = [
    n / 2 - (2 * n2) / 3 + (37 * n3) / 96 - n4 / 360 - (81 * n5) / 512 + (96199 * n6) / 604800,
    n2 / 48 + n3 / 15 - (437 * n4) / 1440 + (46 * n5) / 105 - (1118711 * n6) / 3870720,
    (17 * n3) / 480 - (37 * n4) / 840 - (209 * n5) / 4480 + (5569 * n6) / 90720,
    (4397 * n4) / 161280 - (11 * n5) / 504 - (830251 * n6) / 7257600,
    (4583 * n5) / 161280 - (108847 * n6) / 3991680,
    (20648693 * n6) / 638668800,
  ];
  const [a1, a2, a3, a4, a5, a6] = alpha as [number, number, number, number, number, number];
  const [b1, b2, b3, b4, b5, b6] = beta as [number, number, number, number, number, number];
  const lon0 = params.lon0Deg * DEG;
  const scale = k0 * rectifyingRadius;

  // Conformal latitude tangent from the geodetic latitude tangent (Karney 2011, eqs. 7–9).
  function conformalTan(tau: number): number {
    const sigma = Math.sinh(e * Math.atanh((e * tau) / Math.sqrt(1 + tau * tau)));
    return tau * Math.sqrt(1 + sigma * sigma) - sigma * Math.sqrt(1 + tau * tau);
  }

  // Inverse of conformalTan by Newton's method (Karney 2011, eqs. 19–21); 2–3 iterations suffice.
  function geodeticTan(tauPrime: number): number {
    let tau = tauPrime;
    for (let i = 0; i < 5; i++) {
      const tp = conformalTan(tau);
      const dTau =
        ((tauPrime - tp) / Math.sqrt(1 + tp * tp)) *
        ((1 + (1 - e2) * tau * tau) / ((1 - e2) * Math.sqrt(1 + tau * tau)));
      tau += dTau;
      if (Math.abs(dTau) < 1e-14 * Math.max(1, Math.abs(tau))) break;
    }
    return tau;
  }

  // Northing of the latitude of origin on the central meridian, subtracted so lat0 maps to FN.
  let northingOfOrigin = 0;
  const out0 = new Float64Array(2);
  function rawForward(latDeg: number, lonDeg: number, out: Float64Array): void {
    let dLon = lonDeg * DEG - lon0;
    // Keep the longitude difference in [-π, π) so a frame near the antimeridian works.
    dLon -= 2 * Math.PI * Math.floor((dLon + Math.PI) / (2 * Math.PI));
    const phi = latDeg * DEG;
    const tauP = conformalTan(Math.tan(phi));
    const xiP = Math.atan2(tauP, Math.cos(dLon));
    const etaP = Math.asinh(Math.sin(dLon) / Math.sqrt(tauP * tauP + Math.cos(dLon) ** 2));
    const xi =
      xiP +
      a1 * Math.sin(2 * xiP) * Math.cosh(2 * etaP) +
      a2 * Math.sin(4 * xiP) * Math.cosh(4 * etaP) +
      a3 * Math.sin(6 * xiP) * Math.cosh(6 * etaP) +
      a4 * Math.sin(8 * xiP) * Math.cosh(8 * etaP) +
      a5 * Math.sin(10 * xiP) * Math.cosh(10 * etaP) +
      a6 * Math.sin(12 * xiP) * Math.cosh(12 * etaP);
    const eta =
      etaP +
      a1 * Math.cos(2 * xiP) * Math.sinh(2 * etaP) +
      a2 * Math.cos(4 * xiP) * Math.sinh(4 * etaP) +
      a3 * Math.cos(6 * xiP) * Math.sinh(6 * etaP) +
      a4 * Math.cos(8 * xiP) * Math.sinh(8 * etaP) +
      a5 * Math.cos(10 * xiP) * Math.sinh(10 * etaP) +
      a6 * Math.cos(12 * xiP) * Math.sinh(12 * etaP);
    out[0] = scale * eta;
    out[1] = scale * xi;
  }
  rawForward(params.lat0Deg, params.lon0Deg, out0);
  northingOfOrigin = out0[1] as number;

  function forwardPoint(latDeg: number, lonDeg: number, out: Float64Array): void {
    rawForward(latDeg, lonDeg, out);
    out[0] = (out[0] as number) + falseEastingM;
    out[1] = (out[1] as number) - northingOfOrigin + falseNorthingM;
  }

  function inversePoint(eastingM: number, northingM: number, out: Float64Array): void {
    const xi = (northingM - falseNorthingM + northingOfOrigin) / scale;
    const eta = (eastingM - falseEastingM) / scale;
    const xiP =
      xi -
      b1 * Math.sin(2 * xi) * Math.cosh(2 * eta) -
      b2 * Math.sin(4 * xi) * Math.cosh(4 * eta) -
      b3 * Math.sin(6 * xi) * Math.cosh(6 * eta) -
      b4 * Math.sin(8 * xi) * Math.cosh(8 * eta) -
      b5 * Math.sin(10 * xi) * Math.cosh(10 * eta) -
      b6 * Math.sin(12 * xi) * Math.cosh(12 * eta);
    const etaP =
      eta -
      b1 * Math.cos(2 * xi) * Math.sinh(2 * eta) -
      b2 * Math.cos(4 * xi) * Math.sinh(4 * eta) -
      b3 * Math.cos(6 * xi) * Math.sinh(6 * eta) -
      b4 * Math.cos(8 * xi) * Math.sinh(8 * eta) -
      b5 * Math.cos(10 * xi) * Math.sinh(10 * eta) -
      b6 * Math.cos(12 * xi) * Math.sinh(12 * eta);
    const sinhEtaP = Math.sinh(etaP);
    const cosXiP = Math.cos(xiP);
    const tauP = Math.sin(xiP) / Math.sqrt(sinhEtaP * sinhEtaP + cosXiP * cosXiP);
    const tau = geodeticTan(tauP);
    out[0] = Math.atan(tau) / DEG;
    let lonDeg = (lon0 + Math.atan2(sinhEtaP, cosXiP)) / DEG;
    lonDeg = ((((lonDeg + 180) % 360) + 360) % 360) - 180;
    out[1] = lonDeg;
  }

  const scratch = new Float64Array(2);
  return {
    params: { ...params },
    forwardPoint,
    inversePoint,
    forward(lonDeg, latDeg, eastingM, northingM) {
      const count = Math.min(lonDeg.length, latDeg.length);
      for (let i = 0; i < count; i++) {
        const lat = latDeg[i] as number;
        const lon = lonDeg[i] as number;
        if (Number.isNaN(lat) || Number.isNaN(lon)) {
          eastingM[i] = Number.NaN;
          northingM[i] = Number.NaN;
          continue;
        }
        forwardPoint(lat, lon, scratch);
        eastingM[i] = scratch[0] as number;
        northingM[i] = scratch[1] as number;
      }
    },
    inverse(eastingM, northingM, lonDeg, latDeg) {
      const count = Math.min(eastingM.length, northingM.length);
      for (let i = 0; i < count; i++) {
        const x = eastingM[i] as number;
        const y = northingM[i] as number;
        if (Number.isNaN(x) || Number.isNaN(y)) {
          lonDeg[i] = Number.NaN;
          latDeg[i] = Number.NaN;
          continue;
        }
        inversePoint(x, y, scratch);
        latDeg[i] = scratch[0] as number;
        lonDeg[i] = scratch[1] as number;
      }
    },
  };
}
