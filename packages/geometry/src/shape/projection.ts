// The silhouette of a triaxial ellipsoid seen from far away along a direction s: an ellipse in the plane
// perpendicular to s. With the ellipsoid xᵀ A x = 1 expressed in the basis (f, g, s) as
//   A' = [[K, k], [kᵀ, κ]]  (K 2×2),
// the silhouette is where the surface normal is perpendicular to s, and its projection is the conic
//   uᵀ (K − k kᵀ/κ) u = 1,
// the Schur complement of κ in A' (the standard result for the orthographic outline of a quadric; see
// e.g. Hartley & Zisserman, Multiple View Geometry, 2nd ed., 2004, §8.3, "the contour generator and
// apparent contour of a quadric", here in the affine limit).
import { type Mat3, type Vec3, column, dot } from './frames.js';

export interface SemiAxesKm {
  aKm: number;
  bKm: number;
  cKm: number;
}

/** A centred sky-plane ellipse: semi-axes and the position angle of the semi-minor axis from north (+g)
 * through east (+f), in [0, π) — the convention of the limb fit (src/fit/ellipse.ts). */
export interface ApparentEllipse {
  semiMajorKm: number;
  semiMinorKm: number;
  positionAngleRad: number;
  /** The conic matrix [[Kff, Kfg], [Kfg, Kgg]] of uᵀ K u = 1, u = (f, g) in km. */
  conic: { ff: number; fg: number; gg: number };
}

/**
 * Projects the ellipsoid with semi-axes along the columns of `bodyToSky` (body x, y, z to equatorial)
 * onto the sky plane of basis (f, g, s).
 */
export function projectEllipsoid(
  axes: SemiAxesKm,
  bodyToSky: Mat3,
  basis: { f: Vec3; g: Vec3; s: Vec3 },
): ApparentEllipse {
  const inverseSquares = [1 / axes.aKm ** 2, 1 / axes.bKm ** 2, 1 / axes.cKm ** 2] as const;
  const e = [column(bodyToSky, 0), column(bodyToSky, 1), column(bodyToSky, 2)] as const;
  // A' = Σᵢ (1/aᵢ²) (pᵢ)(pᵢ)ᵀ with pᵢ = the body axis i in (f, g, s) components.
  const p = e.map((axis) => [dot(axis, basis.f), dot(axis, basis.g), dot(axis, basis.s)] as const);
  const entry = (r: 0 | 1 | 2, c: 0 | 1 | 2): number =>
    p.reduce((sum, pi, i) => sum + inverseSquares[i as 0 | 1 | 2] * pi[r] * pi[c], 0);
  const kappa = entry(2, 2);
  const kf = entry(0, 2);
  const kg = entry(1, 2);
  const conic = {
    ff: entry(0, 0) - (kf * kf) / kappa,
    fg: entry(0, 1) - (kf * kg) / kappa,
    gg: entry(1, 1) - (kg * kg) / kappa,
  };
  return { ...conicAxes(conic), conic };
}

/** Semi-axes and semi-minor-axis position angle of the centred ellipse uᵀ K u = 1. */
export function conicAxes(conic: { ff: number; fg: number; gg: number }): Omit<ApparentEllipse, 'conic'> {
  const mean = 0.5 * (conic.ff + conic.gg);
  const half = Math.hypot(0.5 * (conic.ff - conic.gg), conic.fg);
  const large = mean + half;
  const small = mean - half;
  if (!(small > 0)) throw new RangeError('conicAxes: the conic is not an ellipse');
  // Eigenvector of the larger eigenvalue (the semi-minor axis): (K − λ_small I) has it as its range.
  const vf = conic.ff - small;
  const vg = conic.fg;
  const [uf, ug] = vf === 0 && vg === 0 ? [conic.fg, conic.gg - small] : [vf, vg];
  let positionAngleRad = Math.atan2(uf, ug);
  if (positionAngleRad < 0) positionAngleRad += Math.PI;
  if (positionAngleRad >= Math.PI) positionAngleRad -= Math.PI;
  return { semiMajorKm: 1 / Math.sqrt(small), semiMinorKm: 1 / Math.sqrt(large), positionAngleRad };
}
