// The apparent radial residual of a ring crossing and its weight, for the joint pole fit: the same model
// and weight as the single-event fits (../fit/ellipse.ts for ρ and ∇ρ, ../fit/ellipse-fit.ts chi2Of for
// the weight), ρ/σρ with σρ = σt·max(|v·∇ρ|, 0.1|v|), the effective variance of a timing error along the
// path (Orear, Am. J. Phys. 50 (1982) 912).

import { ALONG_FLOOR, type EllipseFrame, frameResidualGradient } from '../fit/ellipse.js';
import type { VelocityKmPerS } from '../types.js';

/** A ring's apparent ellipse in the fits' working form: semi-minor axis along position angle P. */
export type ApparentRing = EllipseFrame;

const grad: [number, number, number] = [0, 0, 0];

/** ρ/σρ for one crossing at (fKm, gKm) timed to sigmaSeconds while moving at velocity. */
export function normalisedRingResidual(
  fKm: number,
  gKm: number,
  sigmaSeconds: number,
  velocity: VelocityKmPerS,
  ring: ApparentRing,
): number {
  frameResidualGradient(fKm, gKm, ring, grad);
  const speed = Math.sqrt(velocity.f * velocity.f + velocity.g * velocity.g);
  const along = Math.max(Math.abs(velocity.f * grad[1] + velocity.g * grad[2]), ALONG_FLOOR * speed);
  return grad[0] / (sigmaSeconds * along);
}
