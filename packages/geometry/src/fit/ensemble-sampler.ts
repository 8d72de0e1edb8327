// Affine-invariant ensemble sampler with the stretch move: Goodman & Weare, "Ensemble samplers with affine
// invariance", Comm. App. Math. Comp. Sci. 5 (2010) 65–80, §3 (serial walker updates, stretch scale a = 2).
// Diagnostics after Foreman-Mackey, Hogg, Lang & Goodman, "emcee: the MCMC hammer", PASP 125 (2013) 306,
// §4: the acceptance fraction and, per parameter, the integrated autocorrelation time τ and the effective
// sample size walkers × steps / τ (autocorrelation.ts). docs/method.md, "Sampler diagnostics".

import { integratedAutocorrelationTime } from './autocorrelation.js';

export interface EnsembleOptions {
  logProbability(x: Float64Array): number;
  initial: Float64Array[];
  /** Kept steps of the first run, after burn-in. */
  steps: number;
  burnIn: number;
  uniform: () => number;
  /**
   * Run longer while a parameter has fewer effective samples than this: the kept steps are doubled, the
   * chain continuing from where it stopped, until every parameter has them or `maxSteps` is reached.
   * Absent: exactly `steps` kept steps.
   */
  minEffectiveSamples?: number;
  maxSteps?: number;
}

export interface EnsembleDiagnostics {
  walkers: number;
  burnInSteps: number;
  /** Kept steps per walker, after any extension. */
  steps: number;
  /** Accepted over proposed moves in the kept steps. */
  acceptanceFraction: number;
  /** Integrated autocorrelation time of each parameter, in steps of the ensemble. */
  autocorrelationSteps: number[];
  /** walkers × steps / τ per parameter. */
  effectiveSamples: number[];
}

export interface EnsembleSamples {
  /** Production samples, walker by walker within each step, dim values each, in one buffer. */
  samples: Float64Array;
  logProbabilities: Float64Array;
  acceptanceFraction: number;
  diagnostics: EnsembleDiagnostics;
}

const STRETCH = 2;

/** τ and effective sample size of every parameter of an ensemble chain laid out as runEnsemble's buffer. */
export function chainDiagnostics(
  samples: Float64Array,
  walkers: number,
  dim: number,
): { autocorrelationSteps: number[]; effectiveSamples: number[] } {
  const steps = Math.floor(samples.length / (walkers * dim));
  const autocorrelationSteps = Array.from({ length: dim }, (_, d) =>
    integratedAutocorrelationTime(steps, walkers, (s, w) => samples[(s * walkers + w) * dim + d] as number),
  );
  return {
    autocorrelationSteps,
    effectiveSamples: autocorrelationSteps.map((tau) => (walkers * steps) / tau),
  };
}

export function runEnsemble(options: EnsembleOptions): EnsembleSamples {
  const walkers = options.initial.map((x) => new Float64Array(x));
  const logP = walkers.map((x) => options.logProbability(x));
  const n = walkers.length;
  const dim = walkers[0]?.length ?? 0;
  const maxSteps = Math.max(options.steps, options.maxSteps ?? options.steps);
  // One buffer rather than 10⁴ small arrays: allocation and collection were a third of a fit's time.
  let samples = new Float64Array(options.steps * n * dim);
  let logProbabilities = new Float64Array(options.steps * n);
  let kept = 0;
  let accepted = 0;
  let proposed = 0;
  const trial = new Float64Array(dim);
  const advance = (count: number, keep: boolean): void => {
    for (let step = 0; step < count; step++) {
      for (let k = 0; k < n; k++) {
        let j = Math.floor(options.uniform() * (n - 1));
        if (j >= k) j++;
        // z drawn from g(z) ∝ 1/√z on [1/a, a] (Goodman & Weare eq. 9) by inverting its distribution.
        const z = ((STRETCH - 1) * options.uniform() + 1) ** 2 / STRETCH;
        const xk = walkers[k] as Float64Array;
        const xj = walkers[j] as Float64Array;
        for (let d = 0; d < dim; d++)
          trial[d] = (xj[d] as number) + z * ((xk[d] as number) - (xj[d] as number));
        const lp = options.logProbability(trial);
        const logAccept = (dim - 1) * Math.log(z) + lp - (logP[k] as number);
        const move = lp > -Infinity && Math.log(options.uniform()) < logAccept;
        if (move) {
          xk.set(trial);
          logP[k] = lp;
        }
        if (keep) {
          proposed++;
          if (move) accepted++;
          samples.set(xk, kept * dim);
          logProbabilities[kept++] = logP[k] as number;
        }
      }
    }
  };
  advance(options.burnIn, false);
  advance(options.steps, true);
  let steps = options.steps;
  let chain = chainDiagnostics(samples, n, dim);
  const wanted = options.minEffectiveSamples;
  while (wanted !== undefined && steps < maxSteps && Math.min(...chain.effectiveSamples) < wanted) {
    const more = Math.min(steps, maxSteps - steps);
    const grown = new Float64Array((steps + more) * n * dim);
    grown.set(samples);
    samples = grown;
    const grownLogP = new Float64Array((steps + more) * n);
    grownLogP.set(logProbabilities);
    logProbabilities = grownLogP;
    advance(more, true);
    steps += more;
    chain = chainDiagnostics(samples, n, dim);
  }
  const acceptanceFraction = proposed === 0 ? 0 : accepted / proposed;
  return {
    samples,
    logProbabilities,
    acceptanceFraction,
    diagnostics: { walkers: n, burnInSteps: options.burnIn, steps, acceptanceFraction, ...chain },
  };
}
