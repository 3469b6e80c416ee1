/**
 * WGS84 reference ellipsoid (NIMA TR8350.2, 3rd edition: a = 6,378,137 m,
 * 1/f = 298.257223563) and small helpers shared by the geodesic code.
 */
export const WGS84_A = 6378137;
export const WGS84_F = 1 / 298.257223563;
export const WGS84_B = WGS84_A * (1 - WGS84_F);
/** First eccentricity squared e² = f(2 − f). */
export const WGS84_E2 = WGS84_F * (2 - WGS84_F);
/** Second eccentricity squared e′² = e² / (1 − e²). */
export const WGS84_EP2 = WGS84_E2 / (1 - WGS84_E2);

export const DEG = Math.PI / 180;

/** Longitude (degrees) normalised to (−180, 180]. */
export function normalizeLon(lon: number): number {
  let x = lon % 360;
  if (x <= -180) x += 360;
  else if (x > 180) x -= 360;
  return x;
}

/** Azimuth (degrees) normalised to [0, 360). */
export function normalizeAzimuth(azi: number): number {
  let x = azi % 360;
  if (x < 0) x += 360;
  if (x >= 360) x -= 360;
  return x;
}

/** Exact sine/cosine of an angle in degrees, reduced first so that multiples of 90° come out exact. */
export function sincosd(deg: number): [number, number] {
  if (deg === 0) return [deg, 1]; // keeps the sign of −0 (the canonical southern latitude)
  let r = deg % 360;
  const q = Math.round(r / 90);
  r -= 90 * q;
  const rad = r * DEG;
  const s = Math.sin(rad);
  const c = Math.cos(rad);
  let sinx: number;
  let cosx: number;
  switch (((q % 4) + 4) % 4) {
    case 0:
      sinx = s;
      cosx = c;
      break;
    case 1:
      sinx = c;
      cosx = -s;
      break;
    case 2:
      sinx = -s;
      cosx = -c;
      break;
    default:
      sinx = -c;
      cosx = s;
  }
  return [sinx, cosx + 0];
}
