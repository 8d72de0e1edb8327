// The apparent radial residual of a ring crossing and its weight, for the joint pole fit. The formula is
// the single-event fits' (../fit/ellipse-fit.ts, chi2Of), kept here so the joint fit does not depend on
// that file's internal helpers: ρ = d − ab·d/√(b²u² + a²w²) with (u, w) the point in the ellipse's axes
// and d = √(u² + w²), weighted by σρ = σt·max(|v·∇ρ|, 0.1|v|), the effective variance of a timing error
// along the path (Orear, Am. J. Phys. 50 (1982) 912). The 0.1|v| floor keeps a near-grazing crossing from
// taking an unbounded weight (common practice, no source).

import type { VelocityKmPerS } from '../types.js';

/** A ring's apparent ellipse: semi-minor axis along position angle P (north through east). */
export interface ApparentRing {
  centerFKm: number;
  centerGKm: number;
  semiMajorKm: number;
  semiMinorKm: number;
  cosP: number;
  sinP: number;
}

export const ALONG_FLOOR = 0.1;

/** ρ/σρ for one crossing at (fKm, gKm) timed to sigmaSeconds while moving at velocity. */
export function normalisedRingResidual(
  fKm: number,
  gKm: number,
  sigmaSeconds: number,
  velocity: VelocityKmPerS,
  ring: ApparentRing,
): number {
  const df = fKm - ring.centerFKm;
  const dg = gKm - ring.centerGKm;
  const u = df * ring.cosP - dg * ring.sinP;
  const w = df * ring.sinP + dg * ring.cosP;
  const d = Math.sqrt(u * u + w * w);
  const a = ring.semiMajorKm;
  const b = ring.semiMinorKm;
  const s2 = b * b * u * u + a * a * w * w;
  const speed = Math.sqrt(velocity.f * velocity.f + velocity.g * velocity.g);
  if (d === 0 || s2 === 0) return -Math.min(a, b) / (sigmaSeconds * ALONG_FLOOR * speed);
  const k = (a * b) / Math.sqrt(s2);
  const rho = d * (1 - k);
  const dRhoDu = (u / d) * (1 - k) + (d * k * b * b * u) / s2;
  const dRhoDw = (w / d) * (1 - k) + (d * k * a * a * w) / s2;
  const dRhoDf = dRhoDu * ring.cosP + dRhoDw * ring.sinP;
  const dRhoDg = -dRhoDu * ring.sinP + dRhoDw * ring.cosP;
  const along = Math.max(Math.abs(velocity.f * dRhoDf + velocity.g * dRhoDg), ALONG_FLOOR * speed);
  return rho / (sigmaSeconds * along);
}
