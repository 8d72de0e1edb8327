// The speed at which each edge of an occultation sweeps across a station: the component of the shadow's
// sky-plane velocity along the limb's outward normal where the station's track crosses the limb. That
// component, not the full speed, spreads diffraction, the star's disc and the exposure over the edge: a
// chord at impact b from the centre of a round limb of radius R meets it at an angle whose normal
// component is v·√(1 − (b/R)²) (0.44 v at 0.9 R; plane geometry, common practice, no source).

import { ALONG_FLOOR } from '../fit/ellipse.js';
import { DEG, MAS_PER_RAD } from '../math.js';
import type { PredictionSettings } from '../predict/types.js';
import type { LimbEllipse, SkyPointKm, VelocityKmPerS } from '../types.js';
import type { EdgeSpeeds } from './well-model.js';

export interface LimbCrossing extends EdgeSpeeds {
  /** Entry and exit of the track, seconds after the instant at which the station is at `pointKm`. */
  disappearanceSeconds: number;
  reappearanceSeconds: number;
}

/**
 * Where the straight track p(t) = point + velocity·t crosses the ellipse, and the limb-normal speed there:
 * |v·n| with n the outward unit normal (the gradient of u²/a² + w²/b²), floored at 0.1·|v| as the limb
 * fit's effective variance is (a grazing track would otherwise get an edge of unbounded length). Null when
 * the track misses the ellipse or only touches it.
 */
export function limbCrossing(
  ellipse: LimbEllipse,
  pointKm: SkyPointKm,
  velocity: VelocityKmPerS,
): LimbCrossing | null {
  const p = ellipse.positionAngleDeg * DEG;
  const a = ellipse.equatorialRadiusKm;
  const b = a * (1 - ellipse.oblateness);
  const [cos, sin] = [Math.cos(p), Math.sin(p)];
  // Ellipse frame: u along the semi-major axis (cos P, −sin P), w along the semi-minor (sin P, cos P).
  const toFrame = (f: number, g: number): [number, number] => [f * cos - g * sin, f * sin + g * cos];
  const [du, dw] = toFrame(pointKm.fKm - ellipse.centerFKm, pointKm.gKm - ellipse.centerGKm);
  const [vu, vw] = toFrame(velocity.f, velocity.g);
  const qa = (vu * vu) / (a * a) + (vw * vw) / (b * b);
  const qb = 2 * ((du * vu) / (a * a) + (dw * vw) / (b * b));
  const qc = (du * du) / (a * a) + (dw * dw) / (b * b) - 1;
  const disc = qb * qb - 4 * qa * qc;
  if (!(qa > 0) || !(disc > 0)) return null;
  const root = Math.sqrt(disc);
  const times = [(-qb - root) / (2 * qa), (-qb + root) / (2 * qa)] as const;
  const speed = Math.hypot(velocity.f, velocity.g);
  const normalSpeed = (t: number): number => {
    const u = du + vu * t;
    const w = dw + vw * t;
    const nu = u / (a * a);
    const nw = w / (b * b);
    return Math.max(Math.abs(vu * nu + vw * nw) / Math.hypot(nu, nw), ALONG_FLOOR * speed);
  };
  return {
    disappearanceSeconds: times[0],
    reappearanceSeconds: times[1],
    disappearanceKmPerS: normalSpeed(times[0]),
    reappearanceKmPerS: normalSpeed(times[1]),
  };
}

/**
 * The limb a prediction assumes: a circle of the body's radius about the body's place shifted by the
 * prediction's offset, B' = B + D·(Δα*·e_f + Δδ·e_g) (docs/method.md, "Prediction"), written in the fits'
 * frame (station minus the ephemeris body), where the station that sees the shifted body's centre is at
 * D·(Δα*, Δδ).
 */
export function predictedLimb(
  settings: Pick<PredictionSettings, 'bodyRadiusKm' | 'offsetMas'>,
  distanceKm: number,
): LimbEllipse {
  return {
    centerFKm: (distanceKm * settings.offsetMas.raCosDec) / MAS_PER_RAD,
    centerGKm: (distanceKm * settings.offsetMas.dec) / MAS_PER_RAD,
    equatorialRadiusKm: settings.bodyRadiusKm,
    oblateness: 0,
    positionAngleDeg: 0,
  };
}
