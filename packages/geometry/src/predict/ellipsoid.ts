// Where a line of sight meets the WGS84 ellipsoid (height 0), and the geodetic latitude and longitude of
// a point on it. Axes are Earth-fixed (ITRS, polar motion neglected, as in astro/station.ts).
//   Ellipsoid: (x² + y²)/a² + z²/b² = 1, a = 6378.137 km, b = a(1 − f), 1/f = 298.257223563
//   (NIMA TR8350.2, Table 3.1). Scaling z by a/b turns it into a sphere of radius a, where the line
//   p + λu meets it at the roots of |p′ + λu′|² = a² (a quadratic in λ).
//   On the surface (h = 0) the normal is ∝ (x/a², y/a², z/b²), so the geodetic latitude is
//   φ = atan2(z, (1 − e²)·√(x² + y²)) exactly (the inverse of TR8350.2 eq. 4-14 at h = 0).
import { WGS84_A_KM, WGS84_INVERSE_FLATTENING } from '../astro/station.js';
import type { Vec3 } from '../astro/vec3.js';

const A = WGS84_A_KM;
const FLATTENING = 1 / WGS84_INVERSE_FLATTENING;
const B = A * (1 - FLATTENING);
const ONE_MINUS_E2 = (1 - FLATTENING) * (1 - FLATTENING);

/**
 * The point where the line p + λu (Earth-fixed km; u towards the star) meets the ellipsoid on the star's
 * side — the larger root λ, the first surface the starlight reaches — or null where the line misses it or
 * only grazes it (the star on the horizon). That point's outward normal has a positive component along u,
 * so the star is above its geometric horizon there.
 */
export function starFacingSurfacePoint(p: Vec3, u: Vec3): Vec3 | null {
  const k = A / B;
  const ps: Vec3 = [p[0], p[1], p[2] * k];
  const us: Vec3 = [u[0], u[1], u[2] * k];
  const qa = us[0] * us[0] + us[1] * us[1] + us[2] * us[2];
  const qb = ps[0] * us[0] + ps[1] * us[1] + ps[2] * us[2];
  const qc = ps[0] * ps[0] + ps[1] * ps[1] + ps[2] * ps[2] - A * A;
  const discriminant = qb * qb - qa * qc;
  if (!(discriminant > 0)) return null;
  // The larger root without cancellation: λ = (−qb + √Δ)/qa, or qc/(−qb − √Δ) when qb > 0.
  const root = Math.sqrt(discriminant);
  const lambda = qb <= 0 ? (-qb + root) / qa : qc / (-qb - root);
  return [p[0] + lambda * u[0], p[1] + lambda * u[1], p[2] + lambda * u[2]];
}

/** Geodetic latitude and longitude (radians, longitude in (−π, π]) of a point on the ellipsoid. */
export function surfaceGeodeticRad(point: Vec3): { latRad: number; lonRad: number } {
  return {
    latRad: Math.atan2(point[2], ONE_MINUS_E2 * Math.hypot(point[0], point[1])),
    lonRad: Math.atan2(point[1], point[0]),
  };
}

/** The geodetic vertical (ellipsoid normal, unit) at a latitude and longitude, Earth-fixed axes. */
export function geodeticUp(latRad: number, lonRad: number): Vec3 {
  const c = Math.cos(latRad);
  return [c * Math.cos(lonRad), c * Math.sin(lonRad), Math.sin(latRad)];
}
