// Synthetic ring crossings made without the fitter's model: the ring is a circle in 3-D space (the plane
// normal to the pole, through the body's centre) and a station's straight sky-plane path crosses it where
// the line of sight through the path meets the circle. For a sky point q, the point of the line q + z·s
// in the ring plane has z = −(q·p)/(s·p); the crossing condition |q + z·s|² = R² is a quadratic in time.
// This is the 3-D statement of the geometry, not the projected-ellipse formula the fitter uses.

import type { JointEvent } from '../../src/joint/joint-fit.js';

type V3 = [number, number, number];

const DEG = Math.PI / 180;

function unit(raDeg: number, decDeg: number): V3 {
  const a = raDeg * DEG;
  const d = decDeg * DEG;
  return [Math.cos(d) * Math.cos(a), Math.cos(d) * Math.sin(a), Math.sin(d)];
}

const dot = (a: V3, b: V3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const add = (a: V3, b: V3, k = 1): V3 => [a[0] + k * b[0], a[1] + k * b[1], a[2] + k * b[2]];
const scale = (a: V3, k: number): V3 => [k * a[0], k * a[1], k * a[2]];

/** East and north at the star's direction, computed here on its own (the usual tangent-plane triad; common practice, no source). */
export function triadTowards(raDeg: number, decDeg: number): { eF: V3; eG: V3; s: V3 } {
  const a = raDeg * DEG;
  const d = decDeg * DEG;
  return {
    s: unit(raDeg, decDeg),
    eF: [-Math.sin(a), Math.cos(a), 0],
    eG: [-Math.sin(d) * Math.cos(a), -Math.sin(d) * Math.sin(a), Math.cos(d)],
  };
}

export interface SyntheticEventSpec {
  title: string;
  starRaDeg: number;
  starDecDeg: number;
  centerFKm: number;
  centerGKm: number;
  /** Whether the fit is told the centre (as from a limb fit) or must find it. */
  centerKnown: boolean;
  velocityFKmPerS: number;
  velocityGKmPerS: number;
  /** Offsets (km) of each station's path from the centre, across the direction of motion. */
  pathOffsetsKm: number[];
  sigmaSeconds: number;
}

/**
 * The event with its crossings of a ring of radius radiusKm about the pole (poleRaDeg, poleDecDeg);
 * noise, when given, adds σt·noise() seconds to each crossing time.
 */
export function syntheticRingEvent(
  spec: SyntheticEventSpec,
  poleRaDeg: number,
  poleDecDeg: number,
  radiusKm: number,
  noise?: () => number,
): JointEvent {
  const triad = triadTowards(spec.starRaDeg, spec.starDecDeg);
  const p = unit(poleRaDeg, poleDecDeg);
  const sp = dot(triad.s, p);
  const v: V3 = add(scale(triad.eF, spec.velocityFKmPerS), scale(triad.eG, spec.velocityGKmPerS));
  const speed = Math.hypot(spec.velocityFKmPerS, spec.velocityGKmPerS);
  const across: V3 = add(
    scale(triad.eF, -spec.velocityGKmPerS / speed),
    scale(triad.eG, spec.velocityFKmPerS / speed),
  );
  const crossings: JointEvent['crossings'] = [];
  spec.pathOffsetsKm.forEach((offsetKm, i) => {
    // Sky-plane path relative to the body's centre: q(t) = q0 + t·v, with t = 0 at closest approach.
    const q0 = scale(across, offsetKm);
    // X(t) = q(t) − (q(t)·p / s·p)·s lies in the ring plane; |X(t)|² = R² is quadratic in t.
    const x0 = add(q0, triad.s, -dot(q0, p) / sp);
    const x1 = add(v, triad.s, -dot(v, p) / sp);
    const a = dot(x1, x1);
    const b = 2 * dot(x0, x1);
    const c = dot(x0, x0) - radiusKm * radiusKm;
    const disc = b * b - 4 * a * c;
    if (disc <= 0) return;
    for (const t of [(-b - Math.sqrt(disc)) / (2 * a), (-b + Math.sqrt(disc)) / (2 * a)]) {
      const observed = t + (noise ? spec.sigmaSeconds * noise() : 0);
      const q = add(q0, v, observed);
      crossings.push({
        station: `S${i + 1}`,
        fKm: spec.centerFKm + dot(q, triad.eF),
        gKm: spec.centerGKm + dot(q, triad.eG),
        sigmaSeconds: spec.sigmaSeconds,
        velocity: { f: spec.velocityFKmPerS, g: spec.velocityGKmPerS },
      });
    }
  });
  return {
    title: spec.title,
    triad,
    center: spec.centerKnown ? { fKm: spec.centerFKm, gKm: spec.centerGKm } : null,
    crossings,
    errorPath: spec.title,
  };
}
