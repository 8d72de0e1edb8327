// Affine-invariant ensemble sampler with the stretch move: Goodman & Weare, "Ensemble samplers with affine
// invariance", Comm. App. Math. Comp. Sci. 5 (2010) 65–80, §3 (serial walker updates, stretch scale a = 2).

export interface EnsembleOptions {
  logProbability(x: Float64Array): number;
  initial: Float64Array[];
  steps: number;
  burnIn: number;
  uniform: () => number;
}

export interface EnsembleSamples {
  /** Production samples, walker by walker within each step, dim values each, in one buffer. */
  samples: Float64Array;
  logProbabilities: Float64Array;
  acceptanceFraction: number;
}

const STRETCH = 2;

export function runEnsemble(options: EnsembleOptions): EnsembleSamples {
  const walkers = options.initial.map((x) => new Float64Array(x));
  const logP = walkers.map((x) => options.logProbability(x));
  const n = walkers.length;
  const dim = walkers[0]?.length ?? 0;
  // One buffer rather than 10⁴ small arrays: allocation and collection were a third of a fit's time.
  const samples = new Float64Array(options.steps * n * dim);
  const logProbabilities = new Float64Array(options.steps * n);
  let kept = 0;
  let accepted = 0;
  let proposed = 0;
  const trial = new Float64Array(dim);
  for (let step = 0; step < options.burnIn + options.steps; step++) {
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
      proposed++;
      if (lp > -Infinity && Math.log(options.uniform()) < logAccept) {
        xk.set(trial);
        logP[k] = lp;
        accepted++;
      }
      if (step >= options.burnIn) {
        samples.set(xk, kept * dim);
        logProbabilities[kept++] = logP[k] as number;
      }
    }
  }
  return { samples, logProbabilities, acceptanceFraction: proposed === 0 ? 0 : accepted / proposed };
}
