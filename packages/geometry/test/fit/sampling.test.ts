import { describe, expect, it } from 'vitest';
import { centralSigma } from '../../src/fit/ellipse-fit.js';
import { runEnsemble } from '../../src/fit/ensemble-sampler.js';
import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { expectClose } from '../expect-close.js';

describe('sampling tools', () => {
  it('mulberry32() is deterministic per seed and uniform on [0, 1)', () => {
    const a = mulberry32(12345);
    const b = mulberry32(12345);
    const draws = Array.from({ length: 20_000 }, () => a());
    expect(draws.slice(0, 5)).toEqual(Array.from({ length: 5 }, () => b()));
    expect(Math.min(...draws)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...draws)).toBeLessThan(1);
    // Mean 1/2 and variance 1/12 of the uniform distribution; 20 000 draws give a standard error of
    // 0.002 on the mean (common practice, no source).
    const mean = draws.reduce((s, x) => s + x, 0) / draws.length;
    const variance = draws.reduce((s, x) => s + (x - mean) ** 2, 0) / draws.length;
    expectClose(mean, 0.5, 0.01);
    expectClose(variance, 1 / 12, 0.003);
  });

  it('centralSigma() gives σ for normal deviates and the half-width of the central 68.3 % in general', () => {
    const normal = gaussian(mulberry32(7));
    const values = Float64Array.from({ length: 100_000 }, () => 3 * normal());
    // Standard error of a quantile-based σ from 10⁵ normal draws is about 0.4 % (common practice, no source).
    expectClose(centralSigma(values), 3, 0.05);
    // 0, 1, …, 100: the 15.87 % and 84.13 % points by linear interpolation are 15.865… and 84.134….
    const ramp = Float64Array.from({ length: 101 }, (_, i) => 100 - i);
    expectClose(centralSigma(ramp), 0.6826894921370859 * 50, 1e-9);
  });

  it('runEnsemble() samples a correlated 2-D normal with the right spread and correlation', () => {
    // Target: σx = 2, σy = 0.5, correlation 0.8. logp = −½ xᵀ Σ⁻¹ x.
    const sx = 2;
    const sy = 0.5;
    const rho = 0.8;
    const logProbability = (p: Float64Array): number => {
      const x = (p[0] as number) / sx;
      const y = (p[1] as number) / sy;
      return -(x * x - 2 * rho * x * y + y * y) / (2 * (1 - rho * rho));
    };
    const uniform = mulberry32(99);
    const normal = gaussian(uniform);
    const initial = Array.from({ length: 32 }, () => Float64Array.from([0.01 * normal(), 0.01 * normal()]));
    const run = runEnsemble({ logProbability, initial, steps: 2000, burnIn: 300, uniform });
    const n = run.logProbabilities.length;
    const xs = Float64Array.from({ length: n }, (_, i) => run.samples[2 * i] as number);
    const ys = Float64Array.from({ length: n }, (_, i) => run.samples[2 * i + 1] as number);
    const mean = (v: Float64Array) => v.reduce((s, x) => s + x, 0) / v.length;
    const mx = mean(xs);
    const my = mean(ys);
    const cov = xs.reduce((s, x, i) => s + (x - mx) * ((ys[i] as number) - my), 0) / n;
    expectClose(centralSigma(xs), sx, 0.1 * sx);
    expectClose(centralSigma(ys), sy, 0.1 * sy);
    expectClose(cov / (centralSigma(xs) * centralSigma(ys)), rho, 0.05);
    // Goodman & Weare (2010) report acceptance of roughly 0.3–0.7 for the stretch move in low dimension.
    expect(run.acceptanceFraction).toBeGreaterThan(0.3);
    expect(run.acceptanceFraction).toBeLessThan(0.9);
  });
});
