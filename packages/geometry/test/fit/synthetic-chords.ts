// Synthetic chords for the fit tests, written independently of the fitter: each chord is a straight line
// p(t) = p0 + v·t crossing a known ellipse, cut by solving the line–ellipse intersection in closed form
// (substitute the line into u²/a² + w²/b² = 1 and solve the quadratic; common practice, no source).

import type { LimbPoint, NegativePath } from '../../src/fit/limb-fit.js';
import type { LimbEllipse, VelocityKmPerS } from '../../src/types.js';

export interface SyntheticChord {
  station: string;
  /** Times (s) of disappearance and reappearance relative to the moment of closest approach to the centre. */
  disappearanceSeconds: number;
  reappearanceSeconds: number;
}

/** Axes of the ellipse as unit vectors in (f, g): semi-major along (cos P, −sin P), semi-minor along (sin P, cos P). */
function axes(e: LimbEllipse) {
  const p = (e.positionAngleDeg * Math.PI) / 180;
  return { major: [Math.cos(p), -Math.sin(p)] as const, minor: [Math.sin(p), Math.cos(p)] as const };
}

/** Foot of the chord at impact parameter hKm (to the left of the velocity) at t = 0. */
function foot(e: LimbEllipse, v: VelocityKmPerS, hKm: number): [number, number] {
  const speed = Math.hypot(v.f, v.g);
  return [e.centerFKm - (v.g / speed) * hKm, e.centerGKm + (v.f / speed) * hKm];
}

/** Entry and exit times of the line foot + v·t through the ellipse, or null when it misses. */
export function crossingTimes(e: LimbEllipse, v: VelocityKmPerS, hKm: number): [number, number] | null {
  const { major, minor } = axes(e);
  const a = e.equatorialRadiusKm;
  const b = a * (1 - e.oblateness);
  const [f0, g0] = foot(e, v, hKm);
  const du = (f0 - e.centerFKm) * major[0] + (g0 - e.centerGKm) * major[1];
  const dw = (f0 - e.centerFKm) * minor[0] + (g0 - e.centerGKm) * minor[1];
  const vu = v.f * major[0] + v.g * major[1];
  const vw = v.f * minor[0] + v.g * minor[1];
  const qa = (vu * vu) / (a * a) + (vw * vw) / (b * b);
  const qb = 2 * ((du * vu) / (a * a) + (dw * vw) / (b * b));
  const qc = (du * du) / (a * a) + (dw * dw) / (b * b) - 1;
  const disc = qb * qb - 4 * qa * qc;
  if (disc <= 0) return null;
  const root = Math.sqrt(disc);
  return [(-qb - root) / (2 * qa), (-qb + root) / (2 * qa)];
}

export interface ChordSetOptions {
  truth: LimbEllipse;
  velocity: VelocityKmPerS;
  impactKm: number[];
  sigmaSeconds: number;
  /** Standard normal deviates, two per chord, for the timing noise; omit for exact points. */
  noise?: () => number;
  /** Seconds added to the reported times of named stations. */
  clockShiftSeconds?: Record<string, number>;
}

export function limbPoints(o: ChordSetOptions): LimbPoint[] {
  const out: LimbPoint[] = [];
  o.impactKm.forEach((h, i) => {
    const times = crossingTimes(o.truth, o.velocity, h);
    if (!times) throw new Error(`impact ${h} km misses the ellipse`);
    const station = `S${i + 1}`;
    const [f0, g0] = foot(o.truth, o.velocity, h);
    const shift = o.clockShiftSeconds?.[station] ?? 0;
    (['disappearance', 'reappearance'] as const).forEach((event, k) => {
      const t = (times[k] as number) + shift + (o.noise ? o.sigmaSeconds * o.noise() : 0);
      out.push({
        station,
        event,
        fKm: f0 + o.velocity.f * t,
        gKm: g0 + o.velocity.g * t,
        sigmaSeconds: o.sigmaSeconds,
        velocity: o.velocity,
      });
    });
  });
  return out;
}

/** A negative chord at impact hKm, long enough to run well past the body on both sides. */
export function negativePath(
  o: { truth: LimbEllipse; velocity: VelocityKmPerS },
  hKm: number,
  station: string,
): NegativePath {
  const [f0, g0] = foot(o.truth, o.velocity, hKm);
  const t = (4 * o.truth.equatorialRadiusKm) / Math.hypot(o.velocity.f, o.velocity.g);
  return {
    station,
    pathKm: [
      { fKm: f0 - o.velocity.f * t, gKm: g0 - o.velocity.g * t },
      { fKm: f0 + o.velocity.f * t, gKm: g0 + o.velocity.g * t },
    ],
  };
}
