// The 1-sigma of a ring's two pole solutions: (RA, Dec) are functions of the ring's opening angle |B| and
// position angle P (../astro/ring-pole.ts), so their covariance is G·C·Gᵀ with C the (|B|, P) covariance
// of the ring fit and G the Jacobian of (RA, Dec) with respect to (|B|, P), taken by central differences.

import { ringPoles } from '../astro/ring-pole.js';
import type { SkyPlaneBasis } from '../astro/star.js';
import type { RingPole } from '../types.js';
import { propagateCovariance } from './covariance.js';

/** Finite-difference step in |B| and P (degrees): small against any σ, large against rounding. */
const STEP_DEG = 1e-5;

/** A difference of right ascensions taken across 0°/360° the short way (degrees). */
function raDifferenceDeg(a: number, b: number): number {
  return ((((a - b) % 360) + 540) % 360) - 180;
}

/**
 * poles[0] for B = +|B|, poles[1] for B = −|B| (as ringPoles), each with its first-order 1-sigma:
 * RA in degrees of RA (not multiplied by cos Dec), Dec in degrees, and their correlation. `covariance`
 * is the 2 × 2 covariance of (|B|, P) in degrees².
 */
export function ringPolesWithUncertainty(
  basis: SkyPlaneBasis,
  openingAngleDeg: number,
  positionAngleDeg: number,
  covariance: readonly [readonly [number, number], readonly [number, number]],
): [RingPole, RingPole] {
  const poles = ringPoles(basis, openingAngleDeg, positionAngleDeg);
  const plusB = ringPoles(basis, openingAngleDeg + STEP_DEG, positionAngleDeg);
  const minusB = ringPoles(basis, openingAngleDeg - STEP_DEG, positionAngleDeg);
  const plusP = ringPoles(basis, openingAngleDeg, positionAngleDeg + STEP_DEG);
  const minusP = ringPoles(basis, openingAngleDeg, positionAngleDeg - STEP_DEG);
  const cov = covariance.map((row) => [...row]);
  const withSigma = (k: 0 | 1): RingPole => {
    const d = 2 * STEP_DEG;
    const g = [
      [
        raDifferenceDeg(plusB[k].raDeg, minusB[k].raDeg) / d,
        raDifferenceDeg(plusP[k].raDeg, minusP[k].raDeg) / d,
      ],
      [(plusB[k].decDeg - minusB[k].decDeg) / d, (plusP[k].decDeg - minusP[k].decDeg) / d],
    ];
    const c = propagateCovariance(cov, g);
    const raDeg = Math.sqrt(Math.max(0, c[0]?.[0] ?? 0));
    const decDeg = Math.sqrt(Math.max(0, c[1]?.[1] ?? 0));
    const correlation = raDeg > 0 && decDeg > 0 ? (c[0]?.[1] ?? 0) / (raDeg * decDeg) : 0;
    return {
      ...poles[k],
      uncertainty: { raDeg, decDeg, correlation: Math.max(-1, Math.min(1, correlation)) },
    };
  };
  return [withSigma(0), withSigma(1)];
}
