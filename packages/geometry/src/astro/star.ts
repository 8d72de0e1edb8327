// The star's geocentric direction at an instant, and the sky-plane basis it defines.
//   Proper motion: the linear space-motion model of the Hipparcos Catalogue, ESA SP-1200 (1997), vol. 1,
//   sec. 1.2.8, u(t) ∝ u0 + Δt (p μα* + q μδ), radial velocity (perspective acceleration) neglected:
//   < 0.1 mas over decades for any star an occultation would use.
//   Parallax: u ∝ u0 − ϖ · b_E/AU with b_E the Earth's barycentric position (astronomy-engine), which gives
//   the classical parallax factors Δα* = ϖ(X sin α − Y cos α), Δδ = ϖ(X cos α sin δ + Y sin α sin δ −
//   Z cos δ) (Explanatory Supplement to the Astronomical Almanac, stellar parallax; from memory).
// No aberration or light deflection: the body's ephemeris is astrometric too, and both shift alike
// (common practice, no source).
import { AstroTime, BaryState, Body } from 'astronomy-engine';
import { DAYS_PER_JULIAN_YEAR, DEG, MAS_PER_RAD, SECONDS_PER_DAY } from '../math.js';
import type { StarInput } from '../types.js';
import { add, fromRaDec, scale, sub, toRaDec, unit, type Vec3 } from './vec3.js';

export interface SkyPlaneBasis {
  /** East on the sky plane: (−sin α*, cos α*, 0). */
  eF: Vec3;
  /** North on the sky plane: (−sin δ* cos α*, −sin δ* sin α*, cos δ*). */
  eG: Vec3;
  /** Unit vector from the geocentre towards the star. */
  s: Vec3;
}

/** Local east and north unit vectors at a direction (radians). */
export function eastNorth(raRad: number, decRad: number): { east: Vec3; north: Vec3 } {
  const sa = Math.sin(raRad);
  const ca = Math.cos(raRad);
  const sd = Math.sin(decRad);
  const cd = Math.cos(decRad);
  return { east: [-sa, ca, 0], north: [-sd * ca, -sd * sa, cd] };
}

/** The Earth's barycentric position in au, J2000 mean equator axes, at a TT instant. */
export function earthBarycentricAu(ttSeconds: number): Vec3 {
  const v = BaryState(Body.Earth, AstroTime.FromTerrestrialTime(ttSeconds / SECONDS_PER_DAY));
  return [v.x, v.y, v.z];
}

/** TT seconds since J2000.0 of a Julian epoch such as 2016.0 (TDB taken as TT: < 2 ms). */
export function julianEpochToTtSeconds(jyear: number): number {
  return (jyear - 2000) * DAYS_PER_JULIAN_YEAR * SECONDS_PER_DAY;
}

/** Geocentric unit vector to the star (ICRS axes) at a TT instant. */
export function starDirection(star: StarInput, ttSeconds: number): Vec3 {
  const ra = star.raDeg * DEG;
  const dec = star.decDeg * DEG;
  const { east, north } = eastNorth(ra, dec);
  const years =
    (ttSeconds - julianEpochToTtSeconds(star.catalogEpochJyear)) / (DAYS_PER_JULIAN_YEAR * SECONDS_PER_DAY);
  const motion = add(
    scale(east, star.pmRaCosDecMasPerYear / MAS_PER_RAD),
    scale(north, star.pmDecMasPerYear / MAS_PER_RAD),
  );
  const moved = add(fromRaDec(ra, dec), scale(motion, years));
  const withParallax =
    star.parallaxMas === 0
      ? moved
      : sub(moved, scale(earthBarycentricAu(ttSeconds), star.parallaxMas / MAS_PER_RAD));
  return unit(withParallax);
}

export function skyPlaneBasis(s: Vec3): SkyPlaneBasis {
  const { raRad, decRad } = toRaDec(s);
  const { east, north } = eastNorth(raRad, decRad);
  return { eF: east, eG: north, s };
}
