// Figures of equilibrium of a uniformly rotating homogeneous fluid: the Maclaurin spheroids and the Jacobi
// ellipsoids, after S. Chandrasekhar, Ellipsoidal Figures of Equilibrium (Yale, 1969), ch. 3 (index
// symbols), ch. 5 (Maclaurin, §32) and ch. 6 (Jacobi, §39). Angular velocities are in the book's unit,
// Ω²/(πGρ). Equilibrium is an assumption about the body (a strengthless fluid), never a result of a fit.
import { asin } from '../math.js';
import { G_SI } from '../dynamics/constants.js';
import { carlsonRD } from './carlson.js';

export interface IndexSymbols {
  a1: number;
  a2: number;
  a3: number;
}

/**
 * Chandrasekhar's index symbols A_i = a₁a₂a₃ ∫₀^∞ du / ((a_i² + u) Δ), Δ² = ∏(a_j² + u) (ch. 3, eq. 22),
 * written with Carlson's R_D: A_i = (2/3) a₁a₂a₃ R_D(a_j², a_k², a_i²). They sum to 2.
 */
export function indexSymbols(a1: number, a2: number, a3: number): IndexSymbols {
  const p = (2 / 3) * a1 * a2 * a3;
  const [s1, s2, s3] = [a1 * a1, a2 * a2, a3 * a3];
  return { a1: p * carlsonRD(s2, s3, s1), a2: p * carlsonRD(s1, s3, s2), a3: p * carlsonRD(s1, s2, s3) };
}

/** Maclaurin spheroid of meridional eccentricity e = √(1 − c²/a²): Ω²/(πGρ) (ch. 5, eq. 4). */
export function maclaurinOmega2(eccentricity: number): number {
  const e = eccentricity;
  if (!(e >= 0 && e < 1)) throw new RangeError(`maclaurinOmega2: eccentricity must be in [0, 1), got ${e}`);
  const e2 = e * e;
  // Below e = 0.1 the closed form loses up to 1e-11 of its value to cancellation; its Taylor series
  // (expanded by computer algebra) 8e²/15 + 8e⁴/105 + 0·e⁶ − 64e⁸/3465 − 1024e¹⁰/45045 is good to 1e-14.
  if (e < 0.1) return e2 * (8 / 15 + e2 * (8 / 105 + e2 * e2 * (-64 / 3465 - (1024 / 45045) * e2)));
  const s = Math.sqrt(1 - e2);
  return ((2 * s) / e ** 3) * (3 - 2 * e2) * asin(e) - (6 * (1 - e2)) / e2;
}

/**
 * Jacobi ellipsoid with axis ratio a₂/a₁ (< 1): the a₃/a₁ that satisfies a₁²a₂²A₁₂ = a₃²A₃ (ch. 6, eq. 3)
 * and Ω²/(πGρ) = 2B₁₂ = 2(A₂ − a₁²A₁₂) (ch. 6, eq. 4), with A₁₂ = (A₁ − A₂)/(a₂² − a₁²) (ch. 3, eq. 107).
 */
export function jacobiEllipsoid(bOverA: number): { cOverA: number; omega2: number } {
  if (!(bOverA > 0 && bOverA < 1)) {
    throw new RangeError(`jacobiEllipsoid: b/a must be in (0, 1), got ${bOverA}`);
  }
  const a2 = bOverA;
  const residual = (a3: number): number => {
    const A = indexSymbols(1, a2, a3);
    const a12 = (A.a1 - A.a2) / (a2 * a2 - 1);
    return a2 * a2 * a12 - a3 * a3 * A.a3;
  };
  // The residual is negative for a₃ near a₂ and positive for a flat figure; bisect between.
  let lo = 1e-6 * a2;
  let hi = a2;
  if (!(residual(lo) > 0 && residual(hi * (1 - 1e-12)) < 0)) {
    throw new RangeError(`jacobiEllipsoid: no Jacobi figure bracketed for b/a = ${bOverA}`);
  }
  for (let i = 0; i < 200 && hi - lo > 1e-15; i++) {
    const mid = 0.5 * (lo + hi);
    if (residual(mid) > 0) lo = mid;
    else hi = mid;
  }
  const a3 = 0.5 * (lo + hi);
  const A = indexSymbols(1, a2, a3);
  const a12 = (A.a1 - A.a2) / (a2 * a2 - 1);
  return { cOverA: a3, omega2: 2 * (A.a2 - a12) };
}

/** Bulk density (kg/m³) of a figure of equilibrium with the given Ω²/(πGρ) and spin period. */
export function equilibriumDensityKgM3(omega2OverPiGRho: number, spinPeriodSeconds: number): number {
  const omega = (2 * Math.PI) / spinPeriodSeconds;
  return (omega * omega) / (Math.PI * G_SI * omega2OverPiGRho);
}
