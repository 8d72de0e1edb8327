// A ring pole as a unit vector in the equatorial frame of the star catalogue, and how it looks from one
// event's sky plane. The pinned pole convention (docs/file-formats.md, "Solution file"):
//   p = sin B·(−s) + cos B·(sin P·e_f + cos P·e_g)
// with s the unit vector towards the star, e_f east and e_g north in the sky plane. B is the opening
// angle (positive when the pole's end leans towards the observer) and P the position angle of that end
// from north through east. Then sin B = −p·s and tan P = (p·e_f)/(p·e_g).

import { asin } from '../math.js';

export type Vec3 = readonly [number, number, number];

/** Orthonormal sky-plane triad of one event, in the equatorial frame. */
export interface SkyTriad {
  eF: Vec3;
  eG: Vec3;
  s: Vec3;
}

export function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

export function unitFromRaDec(raRad: number, decRad: number): Vec3 {
  const c = Math.cos(decRad);
  return [c * Math.cos(raRad), c * Math.sin(raRad), Math.sin(decRad)];
}

/** Right ascension in [0, 2π) and declination of a unit vector, radians. */
export function raDecFromUnit(v: Vec3): { raRad: number; decRad: number } {
  const ra = Math.atan2(v[1], v[0]);
  return { raRad: ra < 0 ? ra + 2 * Math.PI : ra, decRad: asin(v[2]) };
}

/** Opening angle B and position angle P (radians, P in (−π, π]) of the pole end p seen in a sky plane. */
export function poleAspect(p: Vec3, triad: SkyTriad): { openingRad: number; positionRad: number } {
  return { openingRad: asin(-dot(p, triad.s)), positionRad: Math.atan2(dot(p, triad.eF), dot(p, triad.eG)) };
}

/** The pole end with opening angle B and position angle P in the given sky plane (the pinned formula). */
export function poleFromAspect(openingRad: number, positionRad: number, triad: SkyTriad): Vec3 {
  const sb = Math.sin(openingRad);
  const cb = Math.cos(openingRad);
  const sp = Math.sin(positionRad);
  const cp = Math.cos(positionRad);
  const { eF, eG, s } = triad;
  return [
    -sb * s[0] + cb * (sp * eF[0] + cp * eG[0]),
    -sb * s[1] + cb * (sp * eF[1] + cp * eG[1]),
    -sb * s[2] + cb * (sp * eF[2] + cp * eG[2]),
  ];
}
