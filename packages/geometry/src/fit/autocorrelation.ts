// Integrated autocorrelation time of an ensemble's chains and the effective sample size it gives.
//
// The estimator is the windowed one of Sokal, "Monte Carlo methods in statistical mechanics: foundations and
// new algorithms" (Cargèse lectures, 1996/1997), §3: τ(M) = 1 + 2 Σ_{t=1}^{M} ρ̂(t), the window M the
// smallest with M ≥ c·τ(M), c = 5; the autocovariance is averaged over the walkers before it is normalised
// and summed, as emcee does (Foreman-Mackey, Hogg, Lang & Goodman, PASP 125 (2013) 306; emcee 3's
// `autocorr.integrated_time`, from memory). Ĉ(t) = (1/N) Σ_i d_i d_{i+t} is the biased estimator, whose
// (1 − t/N) factor keeps the sum's variance bounded (Sokal, §3). The deviations d are taken from the mean
// over every walker and step, not from each walker's own mean as emcee does: after burn-in the walkers
// sample one distribution, and a walker's own mean over N steps lowers every ρ̂(t) by about τ/N, so τ by a
// fraction ≈ 2Mτ/N ≈ 10τ/N — half of τ for the 250-step chains of a fit (docs/method.md, "Sampler
// diagnostics", gives the measurements).

/** Sokal's window factor c: the window is the smallest M with M ≥ c·τ(M). */
export const AUTOCORRELATION_WINDOW_FACTOR = 5;

/**
 * τ of one parameter from an ensemble chain: value(step, walker) gives the parameter of that walker at
 * that step. Steps count the whole ensemble's sweeps. Returns at least 1 (τ of independent draws).
 */
export function integratedAutocorrelationTime(
  steps: number,
  walkers: number,
  value: (step: number, walker: number) => number,
  windowFactor = AUTOCORRELATION_WINDOW_FACTOR,
): number {
  if (!(steps >= 2 && walkers >= 1)) throw new Error('autocorrelation needs at least 2 steps and 1 walker');
  let mean = 0;
  for (let w = 0; w < walkers; w++) for (let s = 0; s < steps; s++) mean += value(s, w);
  mean /= steps * walkers;
  let c0 = 0;
  const chains = Array.from({ length: walkers }, (_, w) => {
    const chain = Float64Array.from({ length: steps }, (_, s) => value(s, w) - mean);
    for (let s = 0; s < steps; s++) c0 += (chain[s] as number) ** 2;
    return chain;
  });
  // A parameter that never moves has no autocorrelation to measure: its draws are all the same one.
  if (!(c0 > 0)) return 1;
  let tau = 1;
  for (let lag = 1; lag < steps; lag++) {
    let c = 0;
    for (const chain of chains)
      for (let s = 0; s + lag < steps; s++) c += (chain[s] as number) * (chain[s + lag] as number);
    tau += (2 * c) / c0;
    if (lag >= windowFactor * tau) break;
  }
  return Math.max(tau, 1);
}
