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
const truth = { disappearanceSeconds: 4.5371, reappearanceSeconds: 11.0829 };
const clean = syntheticFlux(setup, { timesSeconds: times, ...truth, baselineFlux: 1000, bottomFlux: 80 });
const profile = buildEdgeProfile(setup);
const noiseFlux = 60;

function coverage(withErrors: boolean, seed: number): { d: number; r: number; pullSpread: number } {
  const gauss = gaussianSource(seed);
  let insideD = 0;
  let insideR = 0;
  let pullSquares = 0;
  for (let k = 0; k < REALISATIONS; k++) {
    const flux = clean.map((f) => f + noiseFlux * gauss());
    const result = fitTiming({
      timesSeconds: times,
      flux,
      ...(withErrors ? { fluxErr: flux.map(() => noiseFlux) } : {}),
      speedKmPerS: setup.speedKmPerS,
      exposureSeconds: setup.exposureSeconds,
      profile,
      bottom: 'free',
    });
    const d = result.disappearance;
    const r = result.reappearance;
    if (d === null || r === null) throw new Error(`realisation ${k}: event not found`);
    const pullD = (d.timeSeconds - truth.disappearanceSeconds) / d.sigmaSeconds;
    const pullR = (r.timeSeconds - truth.reappearanceSeconds) / r.sigmaSeconds;
    if (Math.abs(pullD) <= 1) insideD++;
    if (Math.abs(pullR) <= 1) insideR++;
    pullSquares += Math.min(pullD * pullD, 25) + Math.min(pullR * pullR, 25);
  }
  return {
    d: insideD / REALISATIONS,
    r: insideR / REALISATIONS,
    pullSpread: Math.sqrt(pullSquares / (2 * REALISATIONS)),
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
});
