// The sampler's diagnostics as the solution reports them, with cautions in words when they are poor.
// docs/method.md, "Sampler diagnostics", gives the thresholds and why.

import type { SamplerDiagnostics } from '../types.js';
import type { EnsembleDiagnostics } from './ensemble-sampler.js';

/**
 * Acceptance outside this range earns a caution. The lower bound is the rule of thumb of Foreman-Mackey et
 * al., PASP 125 (2013) 306, §4 (after Gelman, Roberts & Gilks 1996); their upper bound of 0.5 is replaced:
 * the stretch move accepts 0.64–0.42 of its moves on a normal target of 3–10 dimensions (measured,
 * docs/method.md), so 0.5 would flag well-sampled fits, while above 0.75 the target is flat enough that the
 * walkers move with little regard to it.
 */
export const ACCEPTANCE_RANGE = [0.2, 0.75] as const;

/** Fewer effective samples than this, after running longer, earn a caution (docs/method.md argues it). */
export const MIN_EFFECTIVE_SAMPLES = 50;

/** The solution's form of a run's diagnostics, parameters named in the order they were sampled. */
export function samplerDiagnostics(run: EnsembleDiagnostics, names: readonly string[]): SamplerDiagnostics {
  const parameters = names.map((parameter, i) => ({
    parameter,
    autocorrelationSteps: run.autocorrelationSteps[i] as number,
    effectiveSamples: run.effectiveSamples[i] as number,
  }));
  const cautions: string[] = [];
  const acceptance = run.acceptanceFraction;
  if (acceptance < ACCEPTANCE_RANGE[0] || acceptance > ACCEPTANCE_RANGE[1])
    cautions.push(
      `The sampler accepted ${(100 * acceptance).toFixed(0)} % of its moves, outside ${100 * ACCEPTANCE_RANGE[0]}–${100 * ACCEPTANCE_RANGE[1]} %: ${
        acceptance < ACCEPTANCE_RANGE[0]
          ? 'its walkers were mostly stuck (a region cut by negative chords or bounds, or with several lobes)'
          : 'the data barely constrain the parameters within their bounds'
      }, so the sampled 1σ may be off; compare them with the linearised ones.`,
    );
  const few = parameters.filter((p) => p.effectiveSamples < MIN_EFFECTIVE_SAMPLES);
  if (few.length > 0)
    cautions.push(
      `Fewer than ${MIN_EFFECTIVE_SAMPLES} effective samples after ${run.steps} steps of ${run.walkers} walkers for ${few
        .map(
          (p) =>
            `${p.parameter} (${p.effectiveSamples.toFixed(0)}, τ = ${p.autocorrelationSteps.toFixed(0)} steps)`,
        )
        .join(
          ', ',
        )}: the 1σ of ${few.length === 1 ? 'that parameter is' : 'those parameters are'} known to worse than about 14 %.`,
    );
  return {
    walkers: run.walkers,
    burnInSteps: run.burnInSteps,
    steps: run.steps,
    acceptanceFraction: acceptance,
    parameters,
    cautions,
  };
}
