import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ellipseFrame, pathClearance } from '../../src/fit/ellipse.js';
import { type LimbFitInput, fitLimb, limbChi2, limbChi2Function } from '../../src/fit/limb-fit.js';
import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { GeometryInputError, LIMB_PARAMETERS } from '../../src/types.js';
import type { LimbEllipse } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { limbPoints, negativePath } from './synthetic-chords.js';

// An invented body: 520 km across-track semi-axis, moderately oblate, pole at 35°.
const truth: LimbEllipse = {
  centerFKm: 12,
  centerGKm: -30,
  equatorialRadiusKm: 520,
  oblateness: 0.12,
  positionAngleDeg: 35,
};
const velocity = { f: 18, g: -6 };
const impactKm = [-400, -300, -180, -60, 40, 150, 260, 350, 430];

function input(overrides: Partial<LimbFitInput> = {}): LimbFitInput {
  return { points: [], negatives: [], fixed: {}, modelErrorKm: 0, fitTimeOffsets: [], seed: 1, ...overrides };
}

function noisyPoints(seed: number, sigmaSeconds = 0.3) {
  return limbPoints({ truth, velocity, impactKm, sigmaSeconds, noise: gaussian(mulberry32(seed)) });
}

function expectFails(call: () => unknown, path: string, detail: RegExp): void {
  try {
    call();
  } catch (err) {
    expect(err).toBeInstanceOf(GeometryInputError);
    expect((err as GeometryInputError).path).toBe(path);
    expect((err as GeometryInputError).detail).toMatch(detail);
    return;
  }
  expect.unreachable('expected a GeometryInputError');
}

describe('fitLimb()', () => {
  it('fitLimb() recovers the ellipse exactly from noise-free chord ends', () => {
    const points = limbPoints({ truth, velocity, impactKm, sigmaSeconds: 0.3 });
    const r = fitLimb(input({ points }));
    expectClose(r.ellipse.centerFKm, truth.centerFKm, 1e-5);
    expectClose(r.ellipse.centerGKm, truth.centerGKm, 1e-5);
    expectClose(r.ellipse.equatorialRadiusKm, truth.equatorialRadiusKm, 1e-5);
    expectClose(r.ellipse.oblateness, truth.oblateness, 1e-8);
    expectClose(r.ellipse.positionAngleDeg, truth.positionAngleDeg, 1e-6);
    expectClose(r.equivalentRadiusKm, 520 * Math.sqrt(0.88), 1e-5);
    expectClose(r.chi2, 0, 1e-9);
    expect(r.dof).toBe(18 - 5);
    for (const res of r.residuals) expectClose(res.residualKm, 0, 1e-6);
  });

  it('fitLimb() recovers the ellipse within 2 sigma from noisy chords and reports a sane χ²', () => {
    const r = fitLimb(input({ points: noisyPoints(7) }));
    for (const name of LIMB_PARAMETERS) {
      expect(r.uncertainty[name]).toBeGreaterThan(0);
      expectClose(r.ellipse[name], truth[name], 2 * r.uncertainty[name]);
    }
    expect(r.uncertainty.equivalentRadiusKm).toBeGreaterThan(0);
    // χ² of 13 degrees of freedom lies in [5.0, 22.4] with 95 % probability (χ² table, 13 dof).
    expect(r.chi2).toBeGreaterThan(5.0);
    expect(r.chi2).toBeLessThan(22.4);
    expect(r.band).toHaveLength(64);
  });

  it('fitLimb() sampled sigmas agree with the linearised ones within 20 % on a well-conditioned case', () => {
    const r = fitLimb(input({ points: noisyPoints(11) }));
    for (const name of LIMB_PARAMETERS) {
      expectClose(r.uncertainty[name] / r.linearisedSigma[name], 1, 0.2);
    }
  });

  it('fitLimb() gives identical output for the same input and seed', () => {
    const points = noisyPoints(3);
    expect(fitLimb(input({ points, seed: 42 }))).toEqual(fitLimb(input({ points, seed: 42 })));
    expect(fitLimb(input({ points, seed: 43 })).uncertainty).not.toEqual(
      fitLimb(input({ points, seed: 42 })).uncertainty,
    );
  });

  it('fitLimb() reports P in [0, 180) when the pole lies near 180°', () => {
    const tilted = { ...truth, positionAngleDeg: 179.5 };
    const points = limbPoints({ truth: tilted, velocity, impactKm, sigmaSeconds: 0.3 });
    const r = fitLimb(input({ points }));
    expect(r.ellipse.positionAngleDeg).toBeGreaterThanOrEqual(0);
    expect(r.ellipse.positionAngleDeg).toBeLessThan(180);
    expectClose(r.ellipse.positionAngleDeg, 179.5, 1e-6);
    expect(r.uncertainty.positionAngleDeg).toBeLessThan(10);
  });

  it('fitLimb() with fixed parameters keeps them, reports sigma 0 and gains a degree of freedom each', () => {
    const r = fitLimb(input({ points: noisyPoints(5), fixed: { oblateness: 0.12, positionAngleDeg: 35 } }));
    expect(r.ellipse.oblateness).toBe(0.12);
    expectClose(r.ellipse.positionAngleDeg, 35, 1e-12);
    expect(r.uncertainty.oblateness).toBe(0);
    expect(r.uncertainty.positionAngleDeg).toBe(0);
    expect(r.linearisedSigma.oblateness).toBe(0);
    expect(r.dof).toBe(18 - 3);
    expect(r.uncertainty.equatorialRadiusKm).toBeGreaterThan(0);
  });

  it('fitLimb() on a round body keeps ε ≥ 0 and reports P as poorly known rather than failing', () => {
    const round = { ...truth, oblateness: 0 };
    const points = limbPoints({
      truth: round,
      velocity,
      impactKm,
      sigmaSeconds: 0.3,
      noise: gaussian(mulberry32(2)),
    });
    const r = fitLimb(input({ points }));
    expect(r.ellipse.oblateness).toBeGreaterThanOrEqual(0);
    expectClose(r.ellipse.oblateness, 0, 3 * r.uncertainty.oblateness);
    // An angle spread evenly over 180° has a standard deviation of 180°/√12 ≈ 52° (uniform distribution).
    expect(r.uncertainty.positionAngleDeg).toBeGreaterThan(10);
    expect(r.linearisedSigma.positionAngleDeg).toBeLessThanOrEqual(180 / Math.sqrt(12) + 1e-9);
    const fixedRound = fitLimb(input({ points, fixed: { oblateness: 0 } }));
    expectClose(fixedRound.linearisedSigma.positionAngleDeg, 180 / Math.sqrt(12), 1e-9);
    expectClose(fixedRound.ellipse.equatorialRadiusKm, 520, 3 * fixedRound.uncertainty.equatorialRadiusKm);
  });

  it('fitLimb() never ends above the χ² of the true ellipse (no local minimum taken for the best fit)', () => {
    fc.assert(
      fc.property(
        fc.record({
          equatorialRadiusKm: fc.double({ min: 100, max: 1000, noNaN: true }),
          oblateness: fc.double({ min: 0, max: 0.4, noNaN: true }),
          positionAngleDeg: fc.double({ min: 0, max: 180, maxExcluded: true, noNaN: true }),
          directionRad: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
          // Percent of the half-width across the track: 3 to 9 distinct chords, anywhere on the body.
          impacts: fc.uniqueArray(fc.integer({ min: -95, max: 95 }), { minLength: 3, maxLength: 9 }),
          noiseSeed: fc.integer({ min: 1, max: 2 ** 31 }),
        }),
        (c) => {
          const body = { centerFKm: 0, centerGKm: 0, ...c };
          const v = { f: 15 * Math.cos(c.directionRad), g: 15 * Math.sin(c.directionRad) };
          const p = (c.positionAngleDeg * Math.PI) / 180;
          const n = { f: -Math.sin(c.directionRad), g: Math.cos(c.directionRad) };
          const b = c.equatorialRadiusKm * (1 - c.oblateness);
          const halfWidthKm = Math.hypot(
            c.equatorialRadiusKm * (n.f * Math.cos(p) - n.g * Math.sin(p)),
            b * (n.f * Math.sin(p) + n.g * Math.cos(p)),
          );
          const impactKm = c.impacts.map((x) => (x / 100) * halfWidthKm);
          const points = limbPoints({
            truth: body,
            velocity: v,
            impactKm,
            sigmaSeconds: 0.2,
            noise: gaussian(mulberry32(c.noiseSeed)),
          });
          const fitInput = input({ points });
          const r = fitLimb(fitInput);
          expect(r.chi2).toBeLessThanOrEqual(limbChi2(body, fitInput) + 1e-6);
        },
      ),
      { numRuns: 25, seed: 20261202 },
    );
  });

  it('fitLimb() refuses fewer points than free parameters, naming the counts', () => {
    const points = noisyPoints(1).slice(0, 4);
    expectFails(() => fitLimb(input({ points })), 'chords', /fewer points \(4\) than free parameters \(5\)/);
  });

  it('fitLimb() refuses points that all lie on one line', () => {
    // Two chords along the same track: four points on one straight line.
    const points = limbPoints({ truth, velocity, impactKm: [100, 100, 100], sigmaSeconds: 0.3 });
    expectFails(() => fitLimb(input({ points })), 'chords', /one straight line/);
  });

  it('fitLimb() refuses a clock offset for a station it does not know', () => {
    expectFails(
      () => fitLimb(input({ points: noisyPoints(1), fitTimeOffsets: ['S1', 'nowhere'] })),
      'fit.limb.fitTimeOffsets[1]',
      /"nowhere"/,
    );
  });

  it('fitLimb() keeps a negative chord outside the limb even where the positive chords would cross it', () => {
    // The negative track runs 4 km inside the true limb, so the unconstrained fit must cross it.
    const speed = Math.hypot(velocity.f, velocity.g);
    const normal = { f: -velocity.g / speed, g: velocity.f / speed };
    const p = (truth.positionAngleDeg * Math.PI) / 180;
    const a = truth.equatorialRadiusKm;
    const b = a * (1 - truth.oblateness);
    const nu = normal.f * Math.cos(p) - normal.g * Math.sin(p);
    const nw = normal.f * Math.sin(p) + normal.g * Math.cos(p);
    // Half-width of the ellipse across the track: support function √(a²n_u² + b²n_w²) (common practice, no source).
    const halfWidthKm = Math.hypot(a * nu, b * nw);
    const negative = negativePath({ truth, velocity }, halfWidthKm - 4, 'N1');
    const points = noisyPoints(9, 0.05);
    const free = fitLimb(input({ points }));
    expect(pathClearance(negative.pathKm, ellipseFrame(free.ellipse))).toBeLessThan(1);

    const r = fitLimb(input({ points, negatives: [negative] }));
    expect(r.negativeChordsClear).toBe(true);
    expect(pathClearance(negative.pathKm, ellipseFrame(r.ellipse))).toBeGreaterThanOrEqual(1);
    for (const e of r.band) expect(pathClearance(negative.pathKm, ellipseFrame(e))).toBeGreaterThanOrEqual(1);
    expect(r.chi2).toBeGreaterThan(free.chi2);
  });

  it('fitLimb() recovers a station clock offset of −δ when its times are late by δ', () => {
    const shift = { S4: 0.8 };
    const exact = limbPoints({ truth, velocity, impactKm, sigmaSeconds: 0.05, clockShiftSeconds: shift });
    const r0 = fitLimb(input({ points: exact, fitTimeOffsets: ['S4'] }));
    expectClose(r0.timeOffsets[0]?.seconds ?? NaN, -0.8, 1e-6);
    expect(r0.dof).toBe(18 - 6);

    const noisy = limbPoints({
      truth,
      velocity,
      impactKm,
      sigmaSeconds: 0.05,
      clockShiftSeconds: shift,
      noise: gaussian(mulberry32(21)),
    });
    const r = fitLimb(input({ points: noisy, fitTimeOffsets: ['S4'] }));
    const offset = r.timeOffsets[0];
    expect(offset?.station).toBe('S4');
    expect(offset?.sigma).toBeGreaterThan(0);
    expectClose(offset?.seconds ?? NaN, -0.8, offset?.sigma ?? 0);
  });

  it('limbChi2() is zero on the true ellipse and grows away from it', () => {
    const points = limbPoints({ truth, velocity, impactKm, sigmaSeconds: 0.3 });
    expectClose(limbChi2(truth, input({ points })), 0, 1e-12);
    const chi2 = limbChi2Function(input({ points }));
    expect(chi2({ ...truth, equatorialRadiusKm: 530 })).toBeGreaterThan(1);
  });
});
