import { describe, expect, it } from 'vitest';
import { integratedAutocorrelationTime } from '../../src/fit/autocorrelation.js';
import { chainDiagnostics, runEnsemble } from '../../src/fit/ensemble-sampler.js';
import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { expectClose } from '../expect-close.js';

/** walkers independent AR(1) chains x_t = φ x_{t−1} + e_t, started from their stationary distribution. */
function ar1Chains(phi: number, steps: number, walkers: number, seed: number): Float64Array[] {
  const normal = gaussian(mulberry32(seed));
  return Array.from({ length: walkers }, () => {
    const chain = new Float64Array(steps);
    let x = normal() / Math.sqrt(1 - phi * phi);
    for (let t = 0; t < steps; t++) {
      x = phi * x + normal();
      chain[t] = x;
    }
    return chain;
  });
}

describe('integratedAutocorrelationTime()', () => {
  // An AR(1) process has ρ(t) = φ^|t|, so τ = 1 + 2 Σ φ^t = (1 + φ)/(1 − φ) (Sokal 1997, §3, from memory;
  // any time-series text, e.g. Box & Jenkins, Time Series Analysis, ch. 3, from memory). The windowed
  // estimator's relative standard deviation is about √(2(2M + 1)/N) for a chain of N steps (Sokal 1997,
  // eq. 3.19, from memory), smaller by √W when the autocovariance is averaged over W independent walkers:
  // with M ≈ 5τ, for τ = 19, N = 4000, W = 32 it is 5.5 %. The tolerances are 3σ. (Subtracting the mean of
  // all N·W values lowers τ by a fraction ≈ 10τ/(NW) < 0.3 %, negligible here.)
  const cases = [
    { phi: 0, steps: 4000, tolerance: 0.04 },
    { phi: 0.5, steps: 4000, tolerance: 0.07 },
    { phi: 0.9, steps: 4000, tolerance: 0.17 },
    { phi: 0.97, steps: 16_000, tolerance: 0.16 },
  ];
  for (const { phi, steps, tolerance } of cases) {
    it(`recovers τ = (1 + φ)/(1 − φ) of an AR(1) process with φ = ${phi}`, () => {
      const expected = (1 + phi) / (1 - phi);
      for (const seed of [1, 2, 3]) {
        const chains = ar1Chains(phi, steps, 32, seed * 1000 + Math.round(phi * 100));
        const tau = integratedAutocorrelationTime(steps, 32, (s, w) => chains[w]?.[s] as number);
        expectClose(tau / expected, 1, tolerance);
      }
    });
  }

  it('is 1 for a parameter that never moves, and refuses a chain of one step', () => {
    expect(integratedAutocorrelationTime(100, 4, () => 3)).toBe(1);
    expect(() => integratedAutocorrelationTime(1, 4, () => 0)).toThrow(/at least 2 steps/);
  });

  it('chainDiagnostics() reads runEnsemble’s buffer walker by walker (ESS = walkers × steps / τ)', () => {
    // Two AR(1) parameters with φ = 0.5 and 0.8, interleaved as the sampler stores them.
    const walkers = 16;
    const steps = 3000;
    const a = ar1Chains(0.5, steps, walkers, 11);
    const b = ar1Chains(0.8, steps, walkers, 12);
    const buffer = new Float64Array(steps * walkers * 2);
    for (let s = 0; s < steps; s++)
      for (let w = 0; w < walkers; w++) {
        buffer[(s * walkers + w) * 2] = a[w]?.[s] as number;
        buffer[(s * walkers + w) * 2 + 1] = b[w]?.[s] as number;
      }
    const d = chainDiagnostics(buffer, walkers, 2);
    expectClose((d.autocorrelationSteps[0] as number) / 3, 1, 0.1);
    expectClose((d.autocorrelationSteps[1] as number) / 9, 1, 0.15);
    expectClose(
      d.effectiveSamples[1] as number,
      (walkers * steps) / (d.autocorrelationSteps[1] as number),
      1e-9,
    );
  });
});

describe('runEnsemble() diagnostics', () => {
  const logNormal = (p: Float64Array): number => -0.5 * p.reduce((s, x) => s + x * x, 0);

  it('reports the acceptance of the stretch move on a 2-D normal within the published range', () => {
    const uniform = mulberry32(5);
    const normal = gaussian(uniform);
    const initial = Array.from({ length: 32 }, () => Float64Array.from([normal(), normal()]));
    const run = runEnsemble({ logProbability: logNormal, initial, steps: 1000, burnIn: 200, uniform });
    // Foreman-Mackey et al. 2013, §4: 0.2–0.5 is the usual range; for a = 2 in two dimensions the stretch
    // move accepts somewhat more (Goodman & Weare 2010, §5, from memory).
    expect(run.diagnostics.acceptanceFraction).toBeGreaterThan(0.4);
    expect(run.diagnostics.acceptanceFraction).toBeLessThan(0.9);
    expect(run.diagnostics.steps).toBe(1000);
    expect(run.diagnostics.walkers).toBe(32);
  });

  it('runs longer when a parameter has too few effective samples, up to maxSteps', () => {
    // A narrow, strongly correlated 6-D normal started in a tiny ball: τ of tens of steps (Goodman & Weare
    // 2010, §5 report τ of 20–80 for such targets, from memory), so 20 steps of 12 walkers are far below
    // 200 effective samples.
    const dim = 6;
    const logP = (p: Float64Array): number => {
      let s = 0;
      for (let i = 0; i < dim; i++) {
        const x = p[i] as number;
        const y = i > 0 ? (p[i - 1] as number) : 0;
        s += (x - 0.9 * y) ** 2 / 0.01;
      }
      return -0.5 * s;
    };
    const make = () => {
      const uniform = mulberry32(8);
      const normal = gaussian(uniform);
      const initial = Array.from({ length: 12 }, () =>
        Float64Array.from({ length: dim }, () => 1e-3 * normal()),
      );
      return { uniform, initial };
    };
    const short = make();
    const fixed = runEnsemble({ logProbability: logP, ...short, steps: 20, burnIn: 10 });
    expect(fixed.diagnostics.steps).toBe(20);
    const longer = make();
    const extended = runEnsemble({
      logProbability: logP,
      ...longer,
      steps: 20,
      burnIn: 10,
      minEffectiveSamples: 200,
      maxSteps: 160,
    });
    // Doubled from 20 until 200 effective samples or 160 steps: 40, 80, 160.
    expect([40, 80, 160]).toContain(extended.diagnostics.steps);
    expect(extended.samples.length).toBe(extended.diagnostics.steps * 12 * dim);
    expect(extended.logProbabilities.length).toBe(extended.diagnostics.steps * 12);
    // The first 20 kept steps are the same chain: the run was continued, not restarted.
    expect(Array.from(extended.samples.subarray(0, 20 * 12 * dim))).toEqual(Array.from(fixed.samples));
    if (extended.diagnostics.steps < 160)
      expect(Math.min(...extended.diagnostics.effectiveSamples)).toBeGreaterThanOrEqual(200);
  });
});
