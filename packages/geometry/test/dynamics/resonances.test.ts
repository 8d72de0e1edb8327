import { describe, expect, it } from 'vitest';
import {
  computeDynamicsContext,
  type ContextInput,
  contextResonanceRatios,
  G_SI,
  meanMotionResonanceKm,
  NEAREST_RESONANCE_COUNT,
  semiMajorAxisKm,
  spinOrbitResonanceKm,
} from '../../src/dynamics/index.js';
import { covarianceOf, input, power, times } from '../../src/dynamics/quantity.js';
import { GeometryInputError } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { seededNormal, standardDeviation } from './random.js';

const AU_KM = 149_597_870.7;
const JUPITER_KM = 5.2026 * AU_KM;
const DAY = 86_400;
const HOUR = 3_600;

describe('contextResonanceRatios()', () => {
  it('contextResonanceRatios() adds the k:1 and 1:k ratios up to 8 to the first- and second-order ones', () => {
    const labels = contextResonanceRatios().map((r) => `${r.p}:${r.q}`);
    // 20 of order 1 and 2 with p, q ≤ 8 (docs/method.md), and 4:1 … 8:1 and 1:4 … 1:8, which they miss.
    expect(labels).toHaveLength(30);
    expect(new Set(labels).size).toBe(30);
    expect(labels.slice(0, 6)).toEqual(['8:1', '7:1', '6:1', '5:1', '4:1', '3:1']);
    expect(labels.slice(-6)).toEqual(['1:3', '1:4', '1:5', '1:6', '1:7', '1:8']);
    const sixToOne = contextResonanceRatios().find((r) => r.p === 6 && r.q === 1);
    expect(sixToOne).toEqual({ p: 6, q: 1, order: 5, side: 'inner', named: false });
  });

  it('contextResonanceRatios() lists a named p:q once, marked named, whether or not it was listed already', () => {
    const ratios = contextResonanceRatios(2, 8, [
      { p: 5, q: 2 },
      { p: 2, q: 1 },
    ]);
    expect(ratios).toHaveLength(31);
    expect(ratios.filter((r) => r.named).map((r) => `${r.p}:${r.q}`)).toEqual(['5:2', '2:1']);
    expect(ratios.find((r) => r.p === 5 && r.q === 2)?.order).toBe(3);
  });
});

describe('resonance locations', () => {
  it("meanMotionResonanceKm() puts Jupiter's 4:1, 5:2 and 7:3 at the asteroid belt's inner edge and Kirkwood gaps", () => {
    // Jupiter a = 5.2026 AU; the 4:1 resonance bounds the main belt at 2.06 AU, the 5:2 and 7:3 Kirkwood
    // gaps lie at 2.82 and 2.95 AU (Murray & Dermott, Solar System Dynamics, 1999, §9.1 and Fig. 1.x, from
    // memory). Keplerian: a = a_J (q/p)^(2/3) (ibid. eq. 2.27 applied to both orbits, from memory).
    expectClose(meanMotionResonanceKm(JUPITER_KM, 4, 1) / AU_KM, 2.06, 0.01);
    expectClose(meanMotionResonanceKm(JUPITER_KM, 5, 2) / AU_KM, 2.82, 0.01);
    expectClose(meanMotionResonanceKm(JUPITER_KM, 7, 3) / AU_KM, 2.95, 0.01);
  });

  it("spinOrbitResonanceKm() puts Haumea's 3:1 spin–orbit resonance beside its ring", () => {
    // Haumea: mass 4.006e21 kg (Ragozzine & Brown 2009, from memory), spin 3.915341 h; its ring at 2287 km
    // lies close to the 1:3 spin–orbit resonance, located at 2285 ± 8 km (Ortiz et al., Nature 550 (2017)
    // 219, from memory). 1 % covers their ±8 km and the spread of the published masses.
    const a = spinOrbitResonanceKm(G_SI * 4.006e21, 3.915341 * HOUR, 3);
    expectClose(a / 2285, 1, 0.01);
  });
});

// An invented body with one satellite known by its period only, so that the resonance radii carry the
// mass's and the period's errors, and a ring put 40 km outside the satellite's 6:1 resonance.
const massKg = 1.7e21;
const satelliteDays = 9.4;
const satelliteKm = semiMajorAxisKm(G_SI * massKg, satelliteDays * DAY);
const sixToOneKm = meanMotionResonanceKm(satelliteKm, 6, 1);
const scenario: ContextInput = {
  body: {
    massKg,
    massKgSigma: 0.08e21,
    radiusKm: 600,
    radiusKmSigma: 15,
    spinPeriodHours: 7.5,
    spinPeriodHoursSigma: 0.05,
  },
  particleDensityKgM3: 900,
  heliocentricDistanceAu: 41.3,
  satellites: [{ name: 'Tesk', periodDays: satelliteDays, periodDaysSigma: 0.02 }],
  rings: [{ ring: 'R1', radiusKm: sixToOneKm + 40, radiusKmSigma: 6 }],
  resonances: [{ p: 11, q: 2 }],
};

describe('computeDynamicsContext() resonances near a ring', () => {
  const result = computeDynamicsContext(scenario);
  const ring = result.ringResonances[0];
  const nearest = ring?.nearest[0];

  it('computeDynamicsContext() lists each ring’s nearest resonances, nearest first, with their distances', () => {
    expect(result.meanMotion).toHaveLength(31);
    expect(result.meanMotion.find((m) => m.p === 11 && m.q === 2)?.named).toBe(true);
    expect(ring?.nearest).toHaveLength(NEAREST_RESONANCE_COUNT);
    expect(nearest).toMatchObject({ kind: 'mean-motion', satellite: 'Tesk', p: 6, q: 1 });
    expectClose(nearest?.distanceKm ?? 0, 40, 1e-9);
    const distances = ring?.nearest.map((n) => Math.abs(n.distanceKm)) ?? [];
    expect(distances).toEqual([...distances].sort((a, b) => a - b));
    // Spin–orbit entries are checked against Kepler's law directly: the synchronous orbit is 1:1.
    const spin = computeDynamicsContext({ ...scenario, rings: [{ ring: 'S', radiusKm: 1000 }] });
    const sync = spin.ringResonances[0]?.nearest.find((n) => n.kind === 'spin-orbit' && n.q === 1);
    expectClose(sync?.radiusKm ?? 0, spinOrbitResonanceKm(G_SI * massKg, 7.5 * HOUR, 1), 1e-9);
  });

  it('computeDynamicsContext() distance 1-sigma carry the ring radius, mass and period errors (Monte Carlo)', () => {
    // The resonance radius written independently: a_s = (GM P²/4π²)^(1/3) (Kepler), a = a_s (1/6)^(2/3).
    const normal = seededNormal(20261204);
    const distances: number[] = [];
    const radii: number[] = [];
    for (let i = 0; i < 20_000; i++) {
      const m = massKg + 0.08e21 * normal();
      const p = (satelliteDays + 0.02 * normal()) * DAY;
      const aSatKm = Math.cbrt((G_SI * m * p * p) / (4 * Math.PI * Math.PI)) / 1000;
      const resonanceKm = aSatKm * Math.cbrt(1 / 36);
      radii.push(resonanceKm);
      distances.push(sixToOneKm + 40 + 6 * normal() - resonanceKm);
    }
    // 20 000 draws give a standard deviation to 0.5 %; first order is good to about that at 1.6 % (σ_M/3M).
    expectClose((nearest?.radiusKmSigma ?? 0) / standardDeviation(radii), 1, 0.02);
    expectClose((nearest?.distanceKmSigma ?? 0) / standardDeviation(distances), 1, 0.02);
    expectClose(nearest?.distanceInRingSigma ?? 0, 40 / 6, 1e-9);
    expectClose(nearest?.distanceInResonanceSigma ?? 0, 40 / (nearest?.radiusKmSigma ?? 1), 1e-9);
    expectClose(nearest?.distanceInSigma ?? 0, 40 / (nearest?.distanceKmSigma ?? 1), 1e-9);
  });

  it('computeDynamicsContext() gives no distance in sigma where a 1-sigma is 0', () => {
    const exact = computeDynamicsContext({
      ...scenario,
      body: { massKg, radiusKm: 600, spinPeriodHours: 7.5 },
      satellites: [{ name: 'Tesk', periodDays: satelliteDays }],
      rings: [{ ring: 'R1', radiusKm: sixToOneKm + 40 }],
    });
    expect(exact.ringResonances[0]?.nearest[0]).toMatchObject({
      distanceKmSigma: 0,
      distanceInRingSigma: null,
      distanceInResonanceSigma: null,
      distanceInSigma: null,
    });
  });

  it('computeDynamicsContext() refuses a named resonance that is 1:1, not in lowest terms or not whole', () => {
    const refusal = (resonances: Array<{ p: number; q: number }>) => {
      try {
        computeDynamicsContext({ ...scenario, resonances });
      } catch (error) {
        if (error instanceof GeometryInputError) return `${error.path}: ${error.detail}`;
      }
      return 'accepted';
    };
    expect(refusal([{ p: 3, q: 3 }])).toMatch(/^resonances\[0\]: p and q must differ/);
    expect(
      refusal([
        { p: 5, q: 2 },
        { p: 12, q: 2 },
      ]),
    ).toBe('resonances[1]: write 12:2 in lowest terms, 6:1');
    expect(refusal([{ p: 2.5, q: 1 }])).toBe('resonances[0]: p and q must be integers ≥ 1');
  });
});

describe('covarianceOf()', () => {
  it('covarianceOf() of two monomials sharing an input matches a Monte Carlo covariance', () => {
    // y₁ = x²·y and y₂ = x/z share x: cov = y₁y₂·(2·1)(σx/x)² to first order (Taylor, §9.2, from memory).
    const x = input('x', 10);
    const y = input('y', 3);
    const z = input('z', 4);
    const y1 = times(power(x, 2), y);
    const y2 = times(x, power(z, -1));
    const rel = { x: 0.01, y: 0.02, z: 0.03 };
    const normal = seededNormal(7);
    const a: number[] = [];
    const b: number[] = [];
    for (let i = 0; i < 40_000; i++) {
      const xs = 10 * (1 + 0.01 * normal());
      a.push(xs * xs * 3 * (1 + 0.02 * normal()));
      b.push(xs / (4 * (1 + 0.03 * normal())));
    }
    const mean = (v: number[]) => v.reduce((s, t) => s + t, 0) / v.length;
    const ma = mean(a);
    const mb = mean(b);
    const cov = a.reduce((s, t, i) => s + (t - ma) * ((b[i] as number) - mb), 0) / (a.length - 1);
    expectClose(covarianceOf(y1, y2, rel) / cov, 1, 0.05);
    expectClose(covarianceOf(y1, y2, rel), 300 * 2.5 * 2 * 1e-4, 1e-12);
    expect(covarianceOf(y, z, rel)).toBe(0);
  });
});
