import { describe, expect, it } from 'vitest';
import { fitLimb } from '../../src/fit/limb-fit.js';
import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { fitRing } from '../../src/fit/ring-fit.js';
import { samplerDiagnostics } from '../../src/fit/sampler-diagnostics.js';
import type { LimbEllipse } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { crossingTimes, limbPoints } from './synthetic-chords.js';

// The invented limb of the calibration test.
const truth: LimbEllipse = {
  centerFKm: -8,
  centerGKm: 15,
  equatorialRadiusKm: 380,
  oblateness: 0.15,
  positionAngleDeg: 62,
};
const velocity = { f: 14, g: 9 };
const impactKm = [-320, -240, -150, -70, 10, 90, 170, 250, 320];

const run = (acceptanceFraction: number, effectiveSamples: number[]) => ({
  walkers: 24,
  burnInSteps: 150,
  steps: 1000,
  acceptanceFraction,
  autocorrelationSteps: effectiveSamples.map((n) => (24 * 1000) / n),
  effectiveSamples,
});

describe('samplerDiagnostics()', () => {
  it('samplerDiagnostics() says nothing for acceptance in 0.2–0.75 and 50 or more effective samples', () => {
    const d = samplerDiagnostics(run(0.55, [120, 50]), ['radiusKm', 'openingAngleDeg']);
    expect(d.cautions).toEqual([]);
    expect(d.parameters.map((p) => p.parameter)).toEqual(['radiusKm', 'openingAngleDeg']);
    expect(d.parameters[0]?.autocorrelationSteps).toBe(200);
  });

  it('samplerDiagnostics() cautions on acceptance outside 0.2–0.75 and names the parameters short of samples', () => {
    expect(samplerDiagnostics(run(0.12, [100]), ['a']).cautions[0]).toMatch(/accepted 12 %.*mostly stuck/);
    expect(samplerDiagnostics(run(0.81, [100]), ['a']).cautions[0]).toMatch(
      /accepted 81 %.*barely constrain/,
    );
    const few = samplerDiagnostics(run(0.5, [30, 400, 49.5]), ['centerFKm', 'centerGKm', 'oblateness']);
    expect(few.cautions).toHaveLength(1);
    expect(few.cautions[0]).toMatch(/Fewer than 50 effective samples after 1000 steps of 24 walkers/);
    expect(few.cautions[0]).toMatch(/centerFKm \(30, τ = 800 steps\), oblateness \(50, τ = 485 steps\)/);
    expect(few.cautions[0]).not.toMatch(/centerGKm/);
  });
});

describe('sampler diagnostics of the fits', () => {
  it('fitLimb() reports acceptance and effective samples per free parameter, and they measure the σ’s own scatter', () => {
    // The same nine chords fitted with 30 seeds: the reported 1σ (half the central 68.3 % of the samples)
    // scatters from seed to seed. For n independent draws of a normal, that half-width has a relative
    // standard deviation of 0.962/√n (asymptotic variance and covariance of the sample quantiles at
    // 15.87 % and 84.13 %, p(1 − p)/(n f²) and p₁(1 − p₂)/(n f₁f₂); Stuart & Ord, Kendall's Advanced Theory of
    // Statistics, vol. 1, §10.10, from memory). With n the effective sample size the scatter should be about
    // that or, because τ is measured on the values rather than on the quantile indicators, below it.
    const points = limbPoints({
      truth,
      velocity,
      impactKm,
      sigmaSeconds: 0.4,
      noise: gaussian(mulberry32(3)),
    });
    const keys = ['centerFKm', 'centerGKm', 'equatorialRadiusKm', 'oblateness', 'positionAngleDeg'] as const;
    const sigmas = keys.map(() => [] as number[]);
    const effective = keys.map(() => [] as number[]);
    for (let seed = 0; seed < 30; seed++) {
      const r = fitLimb({ points, negatives: [], fixed: {}, modelErrorKm: 0, fitTimeOffsets: [], seed });
      const d = r.sampler;
      if (!d) throw new Error('a sampled fit has diagnostics');
      // 2·max(12, 2k) walkers for k = 5 free parameters (docs/method.md, "Uncertainties").
      expect(d.walkers).toBe(24);
      expect(d.parameters.map((p) => p.parameter)).toEqual([...keys]);
      expect(d.acceptanceFraction).toBeGreaterThan(0.2);
      expect(d.acceptanceFraction).toBeLessThan(0.75);
      d.parameters.forEach((p, i) => {
        expectClose(p.effectiveSamples, (d.walkers * d.steps) / p.autocorrelationSteps, 1e-9);
        sigmas[i]?.push(r.uncertainty[keys[i] as (typeof keys)[number]]);
        effective[i]?.push(p.effectiveSamples);
      });
    }
    keys.forEach((_, i) => {
      const s = sigmas[i] as number[];
      const mean = s.reduce((a, b) => a + b, 0) / s.length;
      const relativeScatter = Math.sqrt(s.reduce((a, b) => a + (b - mean) ** 2, 0) / (s.length - 1)) / mean;
      const n = (effective[i] as number[]).reduce((a, b) => a + b, 0) / s.length;
      // The scatter of 30 seeds is itself known to about 1/√58 ≈ 13 %: 1.3 allows 2.3 of those.
      expect(relativeScatter).toBeLessThan(1.3 * (0.962 / Math.sqrt(n)));
      expect(relativeScatter).toBeGreaterThan(0.3 * (0.962 / Math.sqrt(n)));
    });
  });

  it('fitLimb() names clock offsets and leaves fixed parameters out of the diagnostics', () => {
    const points = limbPoints({
      truth,
      velocity,
      impactKm,
      sigmaSeconds: 0.4,
      noise: gaussian(mulberry32(4)),
    });
    const r = fitLimb({
      points,
      negatives: [],
      fixed: { oblateness: 0.15 },
      modelErrorKm: 0,
      fitTimeOffsets: ['S2'],
      seed: 1,
    });
    expect(r.sampler?.parameters.map((p) => p.parameter)).toEqual([
      'centerFKm',
      'centerGKm',
      'equatorialRadiusKm',
      'positionAngleDeg',
      'timeOffsetSeconds S2',
    ]);
  });

  it('fitRing() reports diagnostics of R, B and P about a given centre', () => {
    const ring: LimbEllipse = { ...truth, equatorialRadiusKm: 1200, oblateness: 1 - Math.sin(0.7) };
    const points = [-700, -380, -90, 250, 560].flatMap((h, i) => {
      const times = crossingTimes(ring, velocity, h);
      if (!times) throw new Error('misses');
      const speed = Math.hypot(velocity.f, velocity.g);
      const foot = {
        f: ring.centerFKm - (velocity.g / speed) * h,
        g: ring.centerGKm + (velocity.f / speed) * h,
      };
      return times.map((t) => ({
        station: `R${i + 1}`,
        fKm: foot.f + velocity.f * t,
        gKm: foot.g + velocity.g * t,
        sigmaSeconds: 0.2,
        velocity,
      }));
    });
    const r = fitRing({ ring: 'R1', points, center: { fKm: ring.centerFKm, gKm: ring.centerGKm }, seed: 2 });
    expect(r.sampler?.parameters.map((p) => p.parameter)).toEqual([
      'radiusKm',
      'openingAngleDeg',
      'positionAngleDeg',
    ]);
    expect(r.sampler?.steps).toBeGreaterThanOrEqual(250);
  });
});
