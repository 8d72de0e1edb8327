// The apparent-ellipse model shared by the limb and ring fits: radial residual, its gradient, radius in a
// direction, outline, and how a negative path clears the ellipse. Pure functions.
//
// Frame: f points east, g points north in the sky plane. The position angle P of the semi-minor axis is
// measured from north (+g) through east (+f), so its unit vector is (sin P, cos P) and the semi-major
// axis lies along (cos P, −sin P). A point's coordinates in the ellipse frame are
//   u = Δf·cos P − Δg·sin P   (along the semi-major axis),
//   w = Δf·sin P + Δg·cos P   (along the semi-minor axis).

import { DEG, PI, wrap } from '../math.js';
import type { LimbEllipse, SkyPointKm } from '../types.js';

/**
 * Floor of a point's along-path weight, as a fraction of its speed: σρ = σt·max(|v·∇ρ|, ALONG_FLOOR·|v|)
 * keeps a near-grazing crossing from taking an unbounded weight (common practice, no source).
 */
export const ALONG_FLOOR = 0.1;

/** The ellipse in the working form used inside loops: radians, both semi-axes, and the rotation. */
export interface EllipseFrame {
  centerFKm: number;
  centerGKm: number;
  semiMajorKm: number;
  semiMinorKm: number;
  cosP: number;
  sinP: number;
}

export function ellipseFrame(e: LimbEllipse): EllipseFrame {
  const p = e.positionAngleDeg * DEG;
  return {
    centerFKm: e.centerFKm,
    centerGKm: e.centerGKm,
    semiMajorKm: e.equatorialRadiusKm,
    semiMinorKm: e.equatorialRadiusKm * (1 - e.oblateness),
    cosP: Math.cos(p),
    sinP: Math.sin(p),
  };
}

/**
 * Distance of the point from the centre minus the ellipse's radius in that direction (km); positive outside.
 * With d = √(u² + w²) and the polar radius r = ab·d / √(b²u² + a²w²), ρ = d − r.
 */
export function radialResidualKm(point: SkyPointKm, e: LimbEllipse): number {
  return frameResidualKm(point.fKm, point.gKm, ellipseFrame(e));
}

export function frameResidualKm(fKm: number, gKm: number, fr: EllipseFrame): number {
  const df = fKm - fr.centerFKm;
  const dg = gKm - fr.centerGKm;
  const u = df * fr.cosP - dg * fr.sinP;
  const w = df * fr.sinP + dg * fr.cosP;
  // Math.sqrt rather than Math.hypot: hypot's overflow guard costs more than the rest of the loop.
  const d = Math.sqrt(u * u + w * w);
  const a = fr.semiMajorKm;
  const b = fr.semiMinorKm;
  const s = Math.sqrt(b * b * u * u + a * a * w * w);
  return s === 0 ? -Math.min(a, b) : d - (a * b * d) / s;
}

/**
 * ρ and its gradient with respect to the point's sky-plane position, written into out as [ρ, ∂ρ/∂f, ∂ρ/∂g].
 * With k = ab/S, S = √(b²u² + a²w²): ∂ρ/∂u = (u/d)(1 − k) + d·k·b²u/S², ∂ρ/∂w = (w/d)(1 − k) + d·k·a²w/S².
 * At the centre the direction is undefined; the gradient is reported as zero so the caller's floor applies.
 */
export function frameResidualGradient(
  fKm: number,
  gKm: number,
  fr: EllipseFrame,
  out: [number, number, number],
): void {
  const df = fKm - fr.centerFKm;
  const dg = gKm - fr.centerGKm;
  const u = df * fr.cosP - dg * fr.sinP;
  const w = df * fr.sinP + dg * fr.cosP;
  const d = Math.sqrt(u * u + w * w);
  const a = fr.semiMajorKm;
  const b = fr.semiMinorKm;
  const s2 = b * b * u * u + a * a * w * w;
  if (d === 0 || s2 === 0) {
    out[0] = -Math.min(a, b);
    out[1] = 0;
    out[2] = 0;
    return;
  }
  const k = (a * b) / Math.sqrt(s2);
  out[0] = d * (1 - k);
  const dRhoDu = (u / d) * (1 - k) + (d * k * b * b * u) / s2;
  const dRhoDw = (w / d) * (1 - k) + (d * k * a * a * w) / s2;
  out[1] = dRhoDu * fr.cosP + dRhoDw * fr.sinP;
  out[2] = -dRhoDu * fr.sinP + dRhoDw * fr.cosP;
}

/** Radius of the ellipse (km) in the direction of the given position angle (radians, north through east). */
export function ellipseRadiusKm(e: LimbEllipse, positionAngleRad: number): number {
  const psi = positionAngleRad - e.positionAngleDeg * DEG;
  const a = e.equatorialRadiusKm;
  const b = a * (1 - e.oblateness);
  // psi is measured from the semi-minor axis, so the semi-minor radius goes with cos ψ.
  return (a * b) / Math.hypot(b * Math.sin(psi), a * Math.cos(psi));
}

/** n points evenly spaced in the eccentric anomaly around the ellipse, in the sky plane (km). */
export function ellipseOutline(e: LimbEllipse, n: number): SkyPointKm[] {
  const fr = ellipseFrame(e);
  const out: SkyPointKm[] = [];
  for (let i = 0; i < n; i++) {
    const t = (2 * PI * i) / n;
    const u = fr.semiMajorKm * Math.cos(t);
    const w = fr.semiMinorKm * Math.sin(t);
    out.push({
      fKm: fr.centerFKm + u * fr.cosP + w * fr.sinP,
      gKm: fr.centerGKm - u * fr.sinP + w * fr.cosP,
    });
  }
  return out;
}

/**
 * The same ellipse with ε in [0, 1) and P in [0, 180): a negative ε (b > a) swaps the axes, which turns
 * the semi-minor axis by 90°.
 */
export function normaliseEllipse(e: LimbEllipse): LimbEllipse {
  let { equatorialRadiusKm: a, oblateness: eps, positionAngleDeg: p } = e;
  if (eps < 0) {
    const b = a * (1 - eps);
    eps = 1 - a / b;
    a = b;
    p += 90;
  }
  return { ...e, equatorialRadiusKm: a, oblateness: eps, positionAngleDeg: wrap(p, 180) };
}

export function equivalentRadiusKm(e: LimbEllipse): number {
  return e.equatorialRadiusKm * Math.sqrt(1 - e.oblateness);
}

/**
 * Smallest value of √((u/a)² + (w/b)²) along a polyline: below 1 the path enters the ellipse. It is the
 * distance from the origin after the affine map that turns the ellipse into the unit circle, under which
 * straight segments stay straight, so the minimum over a segment is a point-to-segment distance.
 */
export function pathClearance(path: readonly SkyPointKm[], fr: EllipseFrame): number {
  let best = Infinity;
  let pu = 0;
  let pw = 0;
  for (let i = 0; i < path.length; i++) {
    const pt = path[i] as SkyPointKm;
    const df = pt.fKm - fr.centerFKm;
    const dg = pt.gKm - fr.centerGKm;
    const cu = (df * fr.cosP - dg * fr.sinP) / fr.semiMajorKm;
    const cw = (df * fr.sinP + dg * fr.cosP) / fr.semiMinorKm;
    if (i === 0) {
      best = Math.sqrt(cu * cu + cw * cw);
    } else {
      const su = cu - pu;
      const sw = cw - pw;
      const len2 = su * su + sw * sw;
      const t = len2 === 0 ? 0 : Math.min(1, Math.max(0, -(pu * su + pw * sw) / len2));
      const qu = pu + t * su;
      const qw = pw + t * sw;
      best = Math.min(best, Math.sqrt(qu * qu + qw * qw));
    }
    pu = cu;
    pw = cw;
  }
  return best;
}
