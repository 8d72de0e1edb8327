import { describe, expect, it } from 'vitest';
import { earthBarycentricAu, eastNorth, skyPlaneBasis, starDirection } from '../../src/astro/star.js';
import { dot, fromRaDec, norm, toRaDec } from '../../src/astro/vec3.js';
import { DEG, MAS_PER_RAD } from '../../src/math.js';
import { isoToTtSeconds } from '../../src/time/scales.js';
import type { StarInput } from '../../src/types.js';
import { expectClose } from '../expect-close.js';

const STAR: StarInput = {
  raDeg: 187.25,
  decDeg: -12.4,
  catalogEpochJyear: 2016,
  pmRaCosDecMasPerYear: 0,
  pmDecMasPerYear: 0,
  parallaxMas: 0,
};
const EVENT_TT = isoToTtSeconds('2028-03-14T02:10:00', 'TT');

/** Angle between two directions; atan2 of cross and dot keeps precision at small angles, unlike acos. */
function separationMas(a: readonly [number, number, number], b: readonly [number, number, number]): number {
  const cross = Math.hypot(a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]);
  return Math.atan2(cross, dot(a, b)) * MAS_PER_RAD;
}

describe('star direction', () => {
  it('starDirection() returns the catalogue position at the catalogue epoch without parallax', () => {
    const s = starDirection(STAR, isoToTtSeconds('2016-01-01T12:00:00', 'TT'));
    expectClose(separationMas(s, fromRaDec(STAR.raDeg * DEG, STAR.decDeg * DEG)), 0, 1e-6);
  });

  it('starDirection() moves the star by μ·Δt along the stated direction', () => {
    // Linear proper motion: 12.2 yr × (30, −40) mas/yr → 610 mas at position angle atan2(30, −40)
    // (Hipparcos Catalogue, ESA SP-1200, vol. 1, sec. 1.2.8; second-order terms ~1e-9 mas here).
    const star = { ...STAR, pmRaCosDecMasPerYear: 30, pmDecMasPerYear: -40 };
    const years = (EVENT_TT - (2016 - 2000) * 365.25 * 86_400) / (365.25 * 86_400);
    const s = starDirection(star, EVENT_TT);
    const s0 = fromRaDec(STAR.raDeg * DEG, STAR.decDeg * DEG);
    const { east, north } = eastNorth(STAR.raDeg * DEG, STAR.decDeg * DEG);
    expectClose(separationMas(s, s0), 50 * years, 1e-6);
    expectClose(dot(s, east) * MAS_PER_RAD, 30 * years, 1e-5);
    expectClose(dot(s, north) * MAS_PER_RAD, -40 * years, 1e-5);
  });

  it('starDirection() applies the classical parallax factors', () => {
    // Explanatory Supplement to the Astronomical Almanac, stellar parallax (from memory):
    // Δα cos δ = ϖ(X sin α − Y cos α), Δδ = ϖ(X cos α sin δ + Y sin α sin δ − Z cos δ), (X, Y, Z) the
    // Earth's barycentric position in au.
    const parallaxMas = 2.5;
    const s = starDirection({ ...STAR, parallaxMas }, EVENT_TT);
    const a = STAR.raDeg * DEG;
    const d = STAR.decDeg * DEG;
    const [x, y, z] = earthBarycentricAu(EVENT_TT);
    const { raRad, decRad } = toRaDec(s);
    expectClose(
      (raRad - a) * Math.cos(d) * MAS_PER_RAD,
      parallaxMas * (x * Math.sin(a) - y * Math.cos(a)),
      1e-6,
    );
    expectClose(
      (decRad - d) * MAS_PER_RAD,
      parallaxMas * (x * Math.cos(a) * Math.sin(d) + y * Math.sin(a) * Math.sin(d) - z * Math.cos(d)),
      1e-6,
    );
  });

  it('starDirection() traces a parallax circle of radius ϖ·|b_E| for a star at the ecliptic pole', () => {
    // The north ecliptic pole is at α = 18h, δ = 90° − ε (ε = 23.4393°, J2000; common practice, no source).
    // The Earth stays within 0.983–1.017 au of the barycentre (orbital eccentricity 0.0167, from memory).
    const pole: StarInput = { ...STAR, raDeg: 270, decDeg: 90 - 23.4393, parallaxMas: 100 };
    const base = fromRaDec(pole.raDeg * DEG, pole.decDeg * DEG);
    for (let month = 0; month < 12; month++) {
      const tt = EVENT_TT + month * 30.4 * 86_400;
      const shift = separationMas(starDirection(pole, tt), base);
      expect(shift).toBeGreaterThan(100 * 0.975);
      expect(shift).toBeLessThan(100 * 1.025);
    }
  });

  it('skyPlaneBasis() is right-handed and orthonormal with e_f east and e_g north', () => {
    const s = fromRaDec(40 * DEG, 25 * DEG);
    const { eF, eG } = skyPlaneBasis(s);
    expectClose(dot(eF, eG), 0, 1e-15);
    expectClose(dot(eF, s), 0, 1e-15);
    expectClose(dot(eG, s), 0, 1e-15);
    expectClose(norm(eF), 1, 1e-15);
    expectClose(norm(eG), 1, 1e-15);
    // e_f × e_g = s: east, north and the line of sight form a right-handed triad on the sky.
    expectClose(eF[1] * eG[2] - eF[2] * eG[1], s[0], 1e-15);
    expectClose(eF[2] * eG[0] - eF[0] * eG[2], s[1], 1e-15);
    expectClose(eF[0] * eG[1] - eF[1] * eG[0], s[2], 1e-15);
    expectClose(eF[0], -Math.sin(40 * DEG), 1e-15);
    expectClose(eG[2], Math.cos(25 * DEG), 1e-15);
  });
});
