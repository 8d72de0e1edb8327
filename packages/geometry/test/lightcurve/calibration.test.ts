import { describe, expect, it } from 'vitest';

import { buildEdgeProfile } from '../../src/lightcurve/edge-profile.js';
import { fitTiming } from '../../src/lightcurve/timing.js';
import { evenTimes, gaussianSource, syntheticFlux, type SyntheticSetup } from './synthetic.js';

// Coverage of the χ²min + 1 sigmas: over 200 noise realisations of one directly integrated light curve
// (test/lightcurve/synthetic.ts), the true time must lie within ±1 sigma of the fitted one in 68 % ± 7 %
// of them (issue 6, "Checks"; 68.27 % is the Gaussian 1-sigma probability). The issue asks for ≥ 200; with
// 200 the binomial standard error is 3.3 % and ±7 % only a ~2-sigma band, so a sound fitter would fail
// one seed in twenty per quantity. With 400 it is 2.3 % (a 3-sigma band). Over 10 × 200 realisations of
// this curve (seeds 100–109) the coverage was 69.6 % (disappearance) and 66.0 % (reappearance) with
// fluxErr, 69.7 % and 66.0 % without. The seeds are fixed, so the test is repeatable.

const REALISATIONS = 400;
const setup: SyntheticSetup = {
  distanceKm: 6e9,
  wavelengthUm: 0.65,
  bandwidthUm: 0.3,
  starDiameterKm: 0.6,
  speedKmPerS: 6,
  exposureSeconds: 0.08,
  bandSlices: 40,
  discStrips: 16,
  exposureSteps: 12,
};
const cadenceSeconds = 0.1;
const times = evenTimes(0, cadenceSeconds, 160);
const TRUTH = { disappearanceSeconds: 4.5371, reappearanceSeconds: 11.0829 };
const clean = syntheticFlux(setup, { timesSeconds: times, ...TRUTH, baselineFlux: 1000, bottomFlux: 80 });
const profile = buildEdgeProfile(setup);
const noiseFlux = 60;

interface Variant {
  /** Keep only the samples before this time (a curve that ends inside the event). */
  endSeconds?: number;
  /** Limb-normal speeds of the two edges, in the curve and in the fit. */
  edgeSpeeds?: { disappearance: number; reappearance: number };
  /** Other true times. */
  truth?: { disappearanceSeconds: number; reappearanceSeconds: number };
}

function coverage(
  withErrors: boolean,
  seed: number,
  variant: Variant = {},
): { d: number; r: number; pullSpread: number } {
  const gauss = gaussianSource(seed);
  const truth = variant.truth ?? TRUTH;
  const keep = times.filter((t) => t < (variant.endSeconds ?? Infinity));
  const base =
    variant.edgeSpeeds === undefined && variant.truth === undefined
      ? clean
      : syntheticFlux(setup, {
          timesSeconds: times,
          ...truth,
          baselineFlux: 1000,
          bottomFlux: 80,
          ...(variant.edgeSpeeds === undefined ? {} : { edgeSpeedsKmPerS: variant.edgeSpeeds }),
        });
  const edgeSpeedsKmPerS =
    variant.edgeSpeeds === undefined
      ? undefined
      : {
          disappearanceKmPerS: variant.edgeSpeeds.disappearance,
          reappearanceKmPerS: variant.edgeSpeeds.reappearance,
        };
  let insideD = 0;
  let insideR = 0;
  let pullSquares = 0;
  let pulls = 0;
  for (let k = 0; k < REALISATIONS; k++) {
    const flux = base.slice(0, keep.length).map((f) => f + noiseFlux * gauss());
    const result = fitTiming({
      timesSeconds: keep,
      flux,
      ...(withErrors ? { fluxErr: flux.map(() => noiseFlux) } : {}),
      speedKmPerS: setup.speedKmPerS,
      ...(edgeSpeedsKmPerS === undefined ? {} : { edgeSpeedsKmPerS }),
      exposureSeconds: setup.exposureSeconds,
      profile,
      bottom: 'free',
    });
    const d = result.disappearance;
    const r = result.reappearance;
    if (d === null) throw new Error(`realisation ${k}: event not found`);
    const pullD = (d.timeSeconds - truth.disappearanceSeconds) / d.sigmaSeconds;
    if (Math.abs(pullD) <= 1) insideD++;
    pullSquares += Math.min(pullD * pullD, 25);
    pulls++;
    if (variant.endSeconds === undefined) {
      if (r === null) throw new Error(`realisation ${k}: reappearance not found`);
      const pullR = (r.timeSeconds - truth.reappearanceSeconds) / r.sigmaSeconds;
      if (Math.abs(pullR) <= 1) insideR++;
      pullSquares += Math.min(pullR * pullR, 25);
      pulls++;
    } else if (r !== null) throw new Error(`realisation ${k}: a reappearance after the curve's end`);
  }
  return {
    d: insideD / REALISATIONS,
    r: insideR / REALISATIONS,
    pullSpread: Math.sqrt(pullSquares / pulls),
  };
}

describe('fitTiming() calibration', () => {
  it('fitTiming() with fluxErr: truth inside ±1 sigma in 68 % ± 7 % of 400 realisations', () => {
    const c = coverage(true, 2026);
    expect(c.d).toBeGreaterThanOrEqual(0.61);
    expect(c.d).toBeLessThanOrEqual(0.75);
    expect(c.r).toBeGreaterThanOrEqual(0.61);
    expect(c.r).toBeLessThanOrEqual(0.75);
    expect(Math.abs(c.pullSpread - 1)).toBeLessThan(0.15);
  });

  it('fitTiming() with the noise from the residuals: truth inside ±1 sigma in 68 % ± 7 % of 400 realisations', () => {
    const c = coverage(false, 7);
    expect(c.d).toBeGreaterThanOrEqual(0.61);
    expect(c.d).toBeLessThanOrEqual(0.75);
    expect(c.r).toBeGreaterThanOrEqual(0.61);
    expect(c.r).toBeLessThanOrEqual(0.75);
    expect(Math.abs(c.pullSpread - 1)).toBeLessThan(0.15);
  });

  it('fitTiming() on a curve that ends inside the event: its one edge inside ±1 sigma in 68 % ± 7 % of 400', () => {
    const c = coverage(true, 31, { endSeconds: 8 });
    expect(c.d).toBeGreaterThanOrEqual(0.61);
    expect(c.d).toBeLessThanOrEqual(0.75);
    expect(Math.abs(c.pullSpread - 1)).toBeLessThan(0.15);
  });

  it('fitTiming() with each edge at its limb-normal speed (0.44 v and 0.8 v): 68 % ± 7 % of 400', () => {
    // 0.44 v: a chord at 0.9 R of a round limb, √(1 − 0.9²) = 0.436 (docs/method.md, edge speed).
    // The event lasts longer here (2.1 s to 13.9 s), so that the slowed edges' patterns do not overlap
    // inside it, which the model then integrates sample by sample (docs/method.md) — slower, not different.
    const v = setup.speedKmPerS;
    const c = coverage(true, 43, {
      edgeSpeeds: { disappearance: 0.436 * v, reappearance: 0.8 * v },
      truth: { disappearanceSeconds: 2.1371, reappearanceSeconds: 13.9829 },
    });
    expect(c.d).toBeGreaterThanOrEqual(0.61);
    expect(c.d).toBeLessThanOrEqual(0.75);
    expect(c.r).toBeGreaterThanOrEqual(0.61);
    expect(c.r).toBeLessThanOrEqual(0.75);
    expect(Math.abs(c.pullSpread - 1)).toBeLessThan(0.15);
  });
});
