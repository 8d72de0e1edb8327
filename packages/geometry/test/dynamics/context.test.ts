import { describe, expect, it } from 'vitest';
import {
  bulkDensityKgM3,
  computeDynamicsContext,
  type ContextInput,
  G_SI,
  hillRadiusKm,
  massFromOrbitKg,
  meanMotionResonanceKm,
  rocheFluidKm,
  rocheRigidKm,
  semiMajorAxisKm,
  spinOrbitResonanceKm,
} from '../../src/dynamics/index.js';
import { GeometryInputError } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { seededNormal, standardDeviation } from './random.js';

// An invented body: 600 km radius, 1.7e21 kg, 7.5 h spin, one satellite known by its period only and one
// known by both period and orbit, one ring at 1900 km.
const scenario: ContextInput = {
  body: {
    massKg: 1.7e21,
    massKgSigma: 0.08e21,
    radiusKm: 600,
    radiusKmSigma: 15,
    spinPeriodHours: 7.5,
    spinPeriodHoursSigma: 0.05,
  },
  particleDensityKgM3: 900,
  particleDensityKgM3Sigma: 100,
  heliocentricDistanceAu: 41.3,
  satellites: [{ name: 'Tesk', periodDays: 9.4, periodDaysSigma: 0.02 }],
  rings: [{ ring: 'R1', radiusKm: 1900, radiusKmSigma: 6 }],
};

const HOUR = 3600;
const DAY = 86400;

/** The context's figures computed straight from the formula functions, for the cross-checks below. */
function direct(
  massKg: number,
  radiusKm: number,
  spinH: number,
  rhoP: number,
  satDays: number,
  ringKm: number,
) {
  const gm = G_SI * massKg;
  const density = bulkDensityKgM3(massKg, radiusKm);
  const satelliteKm = semiMajorAxisKm(gm, satDays * DAY);
  return {
    rocheFluidKm: rocheFluidKm(radiusKm, density, rhoP),
    rocheRigidKm: rocheRigidKm(radiusKm, density, rhoP),
    synchronousKm: spinOrbitResonanceKm(gm, spinH * HOUR, 1),
    spin3Km: spinOrbitResonanceKm(gm, spinH * HOUR, 3),
    hillKm: hillRadiusKm(gm, 41.3),
    mmr21Km: meanMotionResonanceKm(satelliteKm, 2, 1),
    ringInRocheFluid: ringKm / rocheFluidKm(radiusKm, density, rhoP),
    ringInBodyRadii: ringKm / radiusKm,
  };
}

describe('computeDynamicsContext()', () => {
  const result = computeDynamicsContext(scenario);
  const mmr21 = result.meanMotion.find((m) => m.p === 2 && m.q === 1);
  const spin3 = result.spinOrbit.find((s) => s.k === 3);
  const ring = result.ringRadii[0];

  it('computeDynamicsContext() agrees with the formula functions', () => {
    const d = direct(1.7e21, 600, 7.5, 900, 9.4, 1900);
    expectClose(result.rocheFluidKm / d.rocheFluidKm, 1, 1e-12);
    expectClose(result.rocheRigidKm / d.rocheRigidKm, 1, 1e-12);
    expectClose(result.synchronousKm / d.synchronousKm, 1, 1e-12);
    expectClose((spin3?.radiusKm ?? 0) / d.spin3Km, 1, 1e-12);
    expectClose(result.hillKm / d.hillKm, 1, 1e-12);
    expectClose((mmr21?.radiusKm ?? 0) / d.mmr21Km, 1, 1e-12);
    expectClose(ring?.inRocheFluid ?? 0, d.ringInRocheFluid, 1e-12);
    expectClose(ring?.inBodyRadii ?? 0, d.ringInBodyRadii, 1e-12);
    expect(result.spinOrbit.map((s) => s.k)).toEqual([2, 3, 4]);
    // 20 of order 1–2, and 4:1 … 8:1 and 1:4 … 1:8 (test/dynamics/resonances.test.ts).
    expect(result.meanMotion).toHaveLength(30);
  });

  it('computeDynamicsContext() first-order 1-sigma matches a seeded Monte Carlo of the formulas', () => {
    const normal = seededNormal(20261202);
    const samples: Record<keyof ReturnType<typeof direct>, number[]> = {
      rocheFluidKm: [],
      rocheRigidKm: [],
      synchronousKm: [],
      spin3Km: [],
      hillKm: [],
      mmr21Km: [],
      ringInRocheFluid: [],
      ringInBodyRadii: [],
    };
    // Relative sigmas of a few per cent, where first order is good to about a per cent of the sigma.
    for (let i = 0; i < 20_000; i++) {
      const d = direct(
        1.7e21 + 0.08e21 * normal(),
        600 + 15 * normal(),
        7.5 + 0.05 * normal(),
        900 + 100 * normal(),
        9.4 + 0.02 * normal(),
        1900 + 6 * normal(),
      );
      for (const key of Object.keys(samples) as Array<keyof typeof samples>) samples[key].push(d[key]);
    }
    const u = result.uncertainty;
    const pairs: Array<[number, number[]]> = [
      [u.rocheFluidKm, samples.rocheFluidKm],
      [u.rocheRigidKm, samples.rocheRigidKm],
      [u.synchronousKm, samples.synchronousKm],
      [u.spinOrbit.find((s) => s.k === 3)?.radiusKm ?? 0, samples.spin3Km],
      [u.hillKm, samples.hillKm],
      [u.meanMotion.find((m) => m.p === 2 && m.q === 1)?.radiusKm ?? 0, samples.mmr21Km],
      [u.ringRadii[0]?.inRocheFluid ?? 0, samples.ringInRocheFluid],
      [u.ringRadii[0]?.inBodyRadii ?? 0, samples.ringInBodyRadii],
    ];
    for (const [firstOrder, values] of pairs) {
      expect(firstOrder).toBeGreaterThan(0);
      // 20 000 samples estimate a sigma to ±0.5 % (1/√(2N)); 4 % allows for the second-order terms.
      expectClose(standardDeviation(values) / firstOrder, 1, 0.04);
    }
  });

  it('computeDynamicsContext() makes the Roche limit independent of the radius when the mass is given', () => {
    // d = k (3M / 4πρ_m)^(1/3): R cancels, a correlation a naive sum of variances would miss.
    const noMassSigma = computeDynamicsContext({
      ...scenario,
      body: { ...scenario.body, massKgSigma: 0 },
      particleDensityKgM3Sigma: 0,
    });
    expect(noMassSigma.uncertainty.rocheFluidKm).toBe(0);
    expect(noMassSigma.uncertainty.rocheFluidBodyRadii).toBeGreaterThan(0);
  });

  it("computeDynamicsContext() takes the mass from a satellite orbit by Kepler's third law", () => {
    const fromSatellite = computeDynamicsContext({
      ...scenario,
      body: { massFromSatellite: 'Ambo', radiusKm: 600, spinPeriodHours: 7.5 },
      satellites: [
        {
          name: 'Ambo',
          periodDays: 12.0,
          periodDaysSigma: 0.01,
          semiMajorAxisKm: 24_000,
          semiMajorAxisKmSigma: 120,
        },
      ],
    });
    expect(fromSatellite.massFrom).toBe('satellite');
    expectClose(fromSatellite.massKg / massFromOrbitKg(24_000, 12 * DAY), 1, 1e-12);
    // σM/M = √((3·σa/a)² + (2·σP/P)²)
    const relative = Math.hypot((3 * 120) / 24_000, (2 * 0.01) / 12);
    expectClose(fromSatellite.uncertainty.massKg / fromSatellite.massKg, relative, 1e-12);
  });

  it('computeDynamicsContext() takes the mass from density and radius', () => {
    const fromDensity = computeDynamicsContext({
      ...scenario,
      body: {
        densityKgM3: 1500,
        densityKgM3Sigma: 150,
        radiusKm: 600,
        radiusKmSigma: 15,
        spinPeriodHours: 7.5,
      },
    });
    expectClose(fromDensity.densityKgM3, 1500, 1e-9);
    expectClose(fromDensity.massKg, 1500 * (4 / 3) * Math.PI * 600e3 ** 3, 1e9);
  });

  it('computeDynamicsContext() names the field of bad input', () => {
    const fails = (input: ContextInput, path: string) => {
      try {
        computeDynamicsContext(input);
      } catch (error) {
        expect(error).toBeInstanceOf(GeometryInputError);
        expect((error as GeometryInputError).path).toBe(path);
        return;
      }
      throw new Error(`expected a GeometryInputError at ${path}`);
    };
    fails({ ...scenario, body: { ...scenario.body, densityKgM3: 1500 } }, 'body');
    fails({ ...scenario, body: { ...scenario.body, radiusKm: -1 } }, 'body.radiusKm');
    fails({ ...scenario, body: { ...scenario.body, massKgSigma: -1 } }, 'body.massKgSigma');
    fails({ ...scenario, satellites: [{ name: 'Tesk' }] }, 'satellites[0]');
    fails(
      { ...scenario, body: { massFromSatellite: 'Tesk', radiusKm: 600, spinPeriodHours: 7.5 } },
      'satellites[0]',
    );
    fails(
      { ...scenario, body: { massFromSatellite: 'Nobody', radiusKm: 600, spinPeriodHours: 7.5 } },
      'body.massFromSatellite',
    );
  });
});
