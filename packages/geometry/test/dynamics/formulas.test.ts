import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  hillRadiusKm,
  massFromOrbitKg,
  meanMotionRatios,
  meanMotionResonanceKm,
  orbitalPeriodSeconds,
  rocheFluidKm,
  rocheRigidKm,
  semiMajorAxisKm,
  spinOrbitResonanceKm,
} from '../../src/dynamics/index.js';
import { SECONDS_PER_DAY } from '../../src/math.js';
import { expectClose } from '../expect-close.js';

// GM of the Earth, 3.986004418e14 m³ s⁻² (IERS Conventions 2010, Table 1.1, from memory).
const GM_EARTH = 3.986004418e14;

describe('Kepler', () => {
  it("massFromOrbitKg() recovers Jupiter's mass from Io's orbit with CODATA 2018 G", () => {
    // Io: a = 421 700 km, sidereal period 1.769137786 d; Jupiter's mass 1.89813e27 kg (NASA Jupiter and
    // Io fact sheets, from memory). Io's own mass (4.7e-5 of Jupiter's) and Jupiter's J2 bias the result
    // by less than 1e-3.
    const massKg = massFromOrbitKg(421_700, 1.769137786 * SECONDS_PER_DAY);
    expectClose(massKg / 1.89813e27, 1, 1e-3);
  });

  it('spinOrbitResonanceKm() with k = 1 gives the geostationary radius for the Earth', () => {
    // Geostationary orbit radius 42 164 km for a sidereal day of 86 164.0905 s (common practice, no
    // source; e.g. any satellite-communications text, from memory).
    expectClose(spinOrbitResonanceKm(GM_EARTH, 86_164.0905, 1), 42_164, 1);
  });

  it('orbitalPeriodSeconds() inverts semiMajorAxisKm()', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e9, max: 1e21, noNaN: true }),
        fc.double({ min: 60, max: 1e9, noNaN: true }),
        (gm, p) => {
          expectClose(orbitalPeriodSeconds(gm, semiMajorAxisKm(gm, p)) / p, 1, 1e-12);
        },
      ),
    );
  });
});

describe('Roche limits', () => {
  it('rocheFluidKm() and rocheRigidKm() reproduce the Earth–Moon worked example', () => {
    // Earth R = 6378.137 km, ρ = 5513 kg/m³; Moon ρ = 3346 kg/m³ → rigid 9 492 km, fluid 18 381 km
    // (Wikipedia, "Roche limit", table "Roche limits for selected examples", from memory).
    expectClose(rocheFluidKm(6378.137, 5513, 3346), 18_381, 1);
    expectClose(rocheRigidKm(6378.137, 5513, 3346), 9_492, 1);
  });

  it('rocheFluidKm() falls at 2–4 body radii for density ratios 0.6–4', () => {
    // Rule of thumb of the trade: for typical densities the classical Roche limit lies 2–4 body radii
    // out (common practice, no source).
    fc.assert(
      fc.property(
        fc.double({ min: 300, max: 3000, noNaN: true }),
        fc.double({ min: 0.6, max: 4, noNaN: true }),
        (rho, ratio) => {
          const inRadii = rocheFluidKm(500, rho * ratio, rho) / 500;
          expect(inRadii).toBeGreaterThanOrEqual(2);
          expect(inRadii).toBeLessThanOrEqual(4);
        },
      ),
    );
  });
});

describe('resonances', () => {
  it('meanMotionRatios() lists the coprime ratios of order 1 and 2 with integers up to 8', () => {
    const labels = meanMotionRatios().map((r) => `${r.p}:${r.q}`);
    // Order 1: 2:1 … 8:7 and inverses (14); order 2 coprime: 3:1, 5:3, 7:5 and inverses (6).
    expect(labels).toEqual([
      '3:1',
      '2:1',
      '5:3',
      '3:2',
      '7:5',
      '4:3',
      '5:4',
      '6:5',
      '7:6',
      '8:7',
      '7:8',
      '6:7',
      '5:6',
      '4:5',
      '3:4',
      '5:7',
      '2:3',
      '3:5',
      '1:2',
      '1:3',
    ]);
    expect(meanMotionRatios(1, 3).map((r) => `${r.p}:${r.q}`)).toEqual(['2:1', '3:2', '2:3', '1:2']);
  });

  it('meanMotionResonanceKm() puts the particle where its mean motion is p/q of the satellite', () => {
    const gm = 1e18;
    const satelliteKm = 50_000;
    for (const { p, q } of meanMotionRatios()) {
      const ratio =
        orbitalPeriodSeconds(gm, satelliteKm) /
        orbitalPeriodSeconds(gm, meanMotionResonanceKm(satelliteKm, p, q));
      expectClose(ratio, p / q, 1e-12);
    }
  });

  it("meanMotionResonanceKm() puts Jupiter's 3:1 and 2:1 at the Kirkwood gaps", () => {
    // Jupiter a = 5.2026 AU; the 3:1 and 2:1 Kirkwood gaps of the asteroid belt lie at 2.50 AU and 3.28 AU
    // (Murray & Dermott, Solar System Dynamics, 1999, ch. 9, from memory). Keplerian, as here: the Sun
    // has no J2 worth the name, so the agreement is to a few parts in a thousand.
    const jupiterKm = 5.2026 * 149_597_870.7;
    expectClose(meanMotionResonanceKm(jupiterKm, 3, 1) / 149_597_870.7, 2.5, 0.01);
    expectClose(meanMotionResonanceKm(jupiterKm, 2, 1) / 149_597_870.7, 3.28, 0.01);
  });
});

describe('Hill radius', () => {
  it("hillRadiusKm() gives the Earth's Hill sphere of about 1.5 million km", () => {
    // Earth's Hill radius ≈ 1.5e6 km ≈ 0.01 AU (Murray & Dermott, Solar System Dynamics, 1999, §3.x,
    // from memory); a circular orbit at 1 AU.
    expectClose(hillRadiusKm(GM_EARTH, 1), 1.5e6, 0.015e6);
  });
});
