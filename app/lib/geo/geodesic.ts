/**
 * Geodesics on the WGS84 ellipsoid, solved on the auxiliary sphere.
 *
 * The method follows the formulation of C. F. F. Karney, "Algorithms for geodesics",
 * J. Geodesy 87 (2013) 43–55: reduced latitude β, the equatorial azimuth α0, the arc length σ on
 * the auxiliary sphere and the three integrals
 *
 *   s / b     = ∫ √(1 + k² sin²σ) dσ                                  (distance, eq. 7)
 *   λ − ω     = −f sin α0 ∫ (2 − f) / (1 + (1 − f) √(1 + k² sin²σ)) dσ  (longitude, eq. 8)
 *   J(σ)      = ∫ √(1 + k² sin²σ) − 1/√(1 + k² sin²σ) dσ               (reduced length, eq. 38)
 *
 * with k² = e′² cos²α0. Instead of truncated series in f (Vincenty 1975 and Karney 2013 both
 * truncate), this module evaluates the integrals by Gauss–Legendre quadrature: the integrands are
 * analytic in a wide strip around the real axis (the nearest singularity is at Im σ = asinh(1/k)),
 * so 24 nodes give full double precision for any arc up to a half circle. The inverse problem is a
 * one-dimensional root search for α1 in [0, π] on the canonical configuration (Karney §4: point 1
 * in the southern hemisphere, |β2| ≤ |β1|, 0 ≤ λ12 ≤ π), where λ12(α1) is monotonic. Newton steps
 * use the derivative dλ12/dα1 = m12 / (a cos α2 cos β2) (Karney eq. 46) and are safeguarded by
 * bisection, so near-antipodal and near-pole cases converge too.
 *
 * This solver is the accurate, general path. Route code uses a cheaper chord formula for short
 * segments (see route.ts) and calls this for long ones.
 */
import { DEG, WGS84_A, WGS84_B, WGS84_EP2, WGS84_F, normalizeAzimuth, normalizeLon, sincosd } from "./ellipsoid";

const F = WGS84_F;
const F1 = 1 - F;
const A = WGS84_A;
const B = WGS84_B;
const EP2 = WGS84_EP2;

// ---------------------------------------------------------------------------------------------
// Gauss–Legendre nodes and weights on [−1, 1], computed once by Newton's method on P_n.
const GL_N = 24;
const GL_X = new Float64Array(GL_N);
const GL_W = new Float64Array(GL_N);
(function initGaussLegendre() {
  const n = GL_N;
  for (let i = 0; i < n; i++) {
    let x = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (x * p1 - p0)) / (x * x - 1);
      const dx = p1 / dp;
      x -= dx;
      if (Math.abs(dx) < 1e-16) break;
    }
    GL_X[i] = x;
    GL_W[i] = 2 / ((1 - x * x) * dp * dp);
  }
})();

interface Integrals {
  /** ∫ √(1 + k² sin²σ) dσ */
  i1: number;
  /** ∫ 1/√(1 + k² sin²σ) dσ */
  i2: number;
  /** ∫ (2 − f) / (1 + (1 − f)√(1 + k² sin²σ)) dσ */
  i3: number;
}

/** The three integrals from σa to σb (radians); arcs longer than π are split into pieces. */
function integrals(sa: number, sb: number, k2: number): Integrals {
  let i1 = 0;
  let i2 = 0;
  let i3 = 0;
  const span = sb - sa;
  const pieces = Math.max(1, Math.ceil(Math.abs(span) / Math.PI));
  const h = span / pieces;
  for (let p = 0; p < pieces; p++) {
    const lo = sa + p * h;
    const mid = lo + h / 2;
    const half = h / 2;
    let s1 = 0;
    let s2 = 0;
    let s3 = 0;
    for (let i = 0; i < GL_N; i++) {
      const sn = Math.sin(mid + half * GL_X[i]);
      const w = Math.sqrt(1 + k2 * sn * sn);
      const wt = GL_W[i];
      s1 += wt * w;
      s2 += wt / w;
      s3 += wt / (1 + F1 * w);
    }
    i1 += s1 * half;
    i2 += s2 * half;
    i3 += s3 * half;
  }
  return { i1, i2, i3: i3 * (2 - F) };
}

/** ∫ √(1 + k² sin²σ) dσ only (used by the direct problem). */
function integralI1(sa: number, sb: number, k2: number): number {
  const span = sb - sa;
  const pieces = Math.max(1, Math.ceil(Math.abs(span) / Math.PI));
  const h = span / pieces;
  let total = 0;
  for (let p = 0; p < pieces; p++) {
    const mid = sa + p * h + h / 2;
    const half = h / 2;
    let s1 = 0;
    for (let i = 0; i < GL_N; i++) {
      const sn = Math.sin(mid + half * GL_X[i]);
      s1 += GL_W[i] * Math.sqrt(1 + k2 * sn * sn);
    }
    total += s1 * half;
  }
  return total;
}

export interface InverseResult {
  /** Geodesic distance in metres. */
  s12: number;
  /** Forward azimuth at point 1, degrees clockwise from north, [0, 360). */
  azi1: number;
  /** Forward azimuth at point 2 (direction of travel on arrival), degrees, [0, 360). */
  azi2: number;
  /** Iterations used by the root search (0 for the closed-form special cases). */
  iterations: number;
}

interface LambdaEval {
  lam: number;
  dlam: number;
  s12: number;
  salp0: number;
  calp2cbet2: number;
}

function evalLambda(
  salp1: number,
  calp1: number,
  sbet1: number,
  cbet1: number,
  sbet2: number,
  cbet2: number,
  wantDerivative: boolean,
): LambdaEval {
  const salp0 = salp1 * cbet1;
  const calp0 = Math.hypot(calp1, salp1 * sbet1);
  const c1 = calp1 * cbet1;
  // cos α2 cos β2 ≥ 0 on the canonical branch; cos²β2 − cos²β1 written to avoid cancellation.
  const diff = cbet1 < -sbet1 ? (cbet2 - cbet1) * (cbet1 + cbet2) : (sbet1 - sbet2) * (sbet1 + sbet2);
  const calp2cbet2 = Math.sqrt(Math.max(0, c1 * c1 + diff));
  const sig1 = Math.atan2(sbet1, c1);
  const sig2 = Math.atan2(sbet2, calp2cbet2);
  const omg1 = Math.atan2(salp0 * sbet1, c1);
  const omg2 = Math.atan2(salp0 * sbet2, calp2cbet2);
  const k2 = EP2 * calp0 * calp0;
  const q = integrals(sig1, sig2, k2);
  const lam = omg2 - omg1 - F * salp0 * q.i3;
  let dlam = NaN;
  if (wantDerivative && calp2cbet2 > 0) {
    const ss1 = Math.sin(sig1);
    const cs1 = Math.cos(sig1);
    const ss2 = Math.sin(sig2);
    const cs2 = Math.cos(sig2);
    const w1 = Math.sqrt(1 + k2 * ss1 * ss1);
    const w2 = Math.sqrt(1 + k2 * ss2 * ss2);
    const m12b = w2 * cs1 * ss2 - w1 * ss1 * cs2 - cs1 * cs2 * (q.i1 - q.i2);
    dlam = (F1 * m12b) / calp2cbet2;
  }
  return { lam, dlam, s12: B * q.i1, salp0, calp2cbet2 };
}

/** Reduced latitude (sin β, cos β) of a geodetic latitude in degrees. */
function reducedLatitude(lat: number): [number, number] {
  const [sphi, cphi] = sincosd(lat);
  let sb = F1 * sphi;
  let cb = cphi;
  const r = Math.hypot(sb, cb);
  sb /= r;
  cb /= r;
  // keep the point off the exact pole so that azimuths stay defined (as in Karney 2013 §4)
  return [sb, Math.max(cb, 1e-300)];
}

/**
 * Inverse geodesic problem on WGS84: shortest distance and azimuths between two points given as
 * latitude/longitude in degrees.
 */
export function geodesicInverse(lat1: number, lon1: number, lat2: number, lon2: number): InverseResult {
  // canonical configuration: lon12 ∈ [0, 180], |lat1| ≥ |lat2|, lat1 ≤ 0
  let lon12 = normalizeLon(lon2 - lon1);
  let lonsign = lon12 >= 0 ? 1 : -1;
  lon12 = Math.abs(lon12);
  const swapp = Math.abs(lat1) < Math.abs(lat2) ? -1 : 1;
  if (swapp < 0) {
    lonsign = -lonsign;
    const t = lat1;
    lat1 = lat2;
    lat2 = t;
  }
  const latsign = lat1 > 0 ? -1 : 1;
  lat1 = -Math.abs(lat1);
  lat2 *= latsign;

  const [sbet1, cbet1] = reducedLatitude(lat1);
  const [sbet2, cbet2] = reducedLatitude(lat2);
  const lam12 = lon12 * DEG;

  let salp1: number;
  let calp1: number;
  let salp2: number;
  let calp2: number;
  let s12: number;
  let iterations = 0;

  if (lat1 === lat2 && lon12 === 0) {
    return { s12: 0, azi1: 0, azi2: 0, iterations: 0 };
  }

  if (lon12 === 0 || lon12 === 180) {
    // meridional: along the meridian northwards, or over the south pole
    salp1 = 0;
    calp1 = lon12 === 0 ? 1 : -1;
    const e = evalLambda(salp1, calp1, sbet1, cbet1, sbet2, cbet2, false);
    s12 = e.s12;
    salp2 = 0;
    calp2 = 1;
  } else if (lat1 === 0 && lat2 === 0 && lam12 <= (1 - F) * Math.PI) {
    // equatorial
    s12 = A * lam12;
    salp1 = salp2 = 1;
    calp1 = calp2 = 0;
  } else {
    let lo = sbet1 === sbet2 ? Math.PI / 2 : 0;
    let hi = Math.PI;
    // starting value: the spherical azimuth with ω12 = λ12
    let alp = Math.atan2(cbet2 * Math.sin(lam12), cbet1 * sbet2 - sbet1 * cbet2 * Math.cos(lam12));
    if (!(alp > lo && alp < hi)) alp = (lo + hi) / 2;
    let best: LambdaEval | null = null;
    let bestAlp = alp;
    for (let iter = 0; iter < 200; iter++) {
      iterations = iter + 1;
      const e = evalLambda(Math.sin(alp), Math.cos(alp), sbet1, cbet1, sbet2, cbet2, true);
      const v = e.lam - lam12;
      if (best === null || Math.abs(v) <= Math.abs(best.lam - lam12)) {
        best = e;
        bestAlp = alp;
      }
      if (Math.abs(v) <= 4e-16 * Math.max(1, lam12)) break;
      if (v < 0) lo = alp;
      else hi = alp;
      let next = alp - v / e.dlam;
      if (!(e.dlam > 0) || !(next > lo && next < hi)) next = (lo + hi) / 2;
      if (Math.abs(next - alp) <= 1e-17 * Math.max(1, alp) || hi - lo <= 4e-16) break;
      alp = next;
    }
    const e = best!;
    s12 = e.s12;
    salp1 = Math.sin(bestAlp);
    calp1 = Math.cos(bestAlp);
    salp2 = e.salp0;
    calp2 = e.calp2cbet2;
  }

  // undo the canonical transformation
  if (swapp < 0) {
    let t = salp1;
    salp1 = salp2;
    salp2 = t;
    t = calp1;
    calp1 = calp2;
    calp2 = t;
  }
  salp1 *= swapp * lonsign;
  calp1 *= swapp * latsign;
  salp2 *= swapp * lonsign;
  calp2 *= swapp * latsign;
  return {
    s12,
    azi1: normalizeAzimuth(Math.atan2(salp1, calp1) / DEG),
    azi2: normalizeAzimuth(Math.atan2(salp2, calp2) / DEG),
    iterations,
  };
}

export interface DirectResult {
  lat2: number;
  lon2: number;
  /** Forward azimuth at the end point, degrees [0, 360). */
  azi2: number;
}

/**
 * Direct geodesic problem on WGS84: the point reached from (lat1, lon1) after s12 metres with
 * initial azimuth azi1 (degrees clockwise from north).
 */
export function geodesicDirect(lat1: number, lon1: number, azi1: number, s12: number): DirectResult {
  const [sbet1, cbet1] = reducedLatitude(lat1);
  const [salp1, calp1] = sincosd(azi1);
  const salp0 = salp1 * cbet1;
  const calp0 = Math.hypot(calp1, salp1 * sbet1);
  const ssig1 = sbet1;
  const csig1 = sbet1 !== 0 || calp1 !== 0 ? calp1 * cbet1 : 1;
  const somg1 = salp0 * sbet1;
  const comg1 = csig1;
  const sig1 = Math.atan2(ssig1, csig1);
  const k2 = EP2 * calp0 * calp0;

  // solve b·∫_{σ1}^{σ2} √(1 + k² sin²σ) dσ = s12 for σ2 by Newton's method
  const meanW = integralI1(0, Math.PI, k2) / Math.PI;
  const target = s12 / B;
  let sig2 = sig1 + target / meanW;
  for (let iter = 0; iter < 20; iter++) {
    const g = integralI1(sig1, sig2, k2) - target;
    const sn = Math.sin(sig2);
    const step = g / Math.sqrt(1 + k2 * sn * sn);
    sig2 -= step;
    if (Math.abs(step) < 1e-15) break;
  }
  const q = integrals(sig1, sig2, k2);
  const ssig2 = Math.sin(sig2);
  const csig2 = Math.cos(sig2);
  const sbet2 = calp0 * ssig2;
  const cbet2 = Math.hypot(salp0, calp0 * csig2);
  const E = salp0 < 0 || Object.is(salp0, -0) ? -1 : 1;
  const somg2 = salp0 * ssig2;
  const comg2 = csig2;
  const omg12 =
    E *
    (sig2 - sig1 - (Math.atan2(ssig2, csig2) - Math.atan2(ssig1, csig1)) +
      (Math.atan2(E * somg2, comg2) - Math.atan2(E * somg1, comg1)));
  const lam12 = omg12 - F * salp0 * q.i3;
  const lat2 = Math.atan2(sbet2, F1 * cbet2) / DEG;
  const lon2 = normalizeLon(lon1 + lam12 / DEG);
  const azi2 = normalizeAzimuth(Math.atan2(salp0, calp0 * csig2) / DEG);
  return { lat2, lon2, azi2 };
}
