import { describe, expect, it } from 'vitest';

import { buildEdgeProfile } from '../../src/lightcurve/edge-profile.js';
import { fitTiming } from '../../src/lightcurve/timing.js';
import { expectClose } from '../expect-close.js';
import { evenTimes, gaussianSource, syntheticFlux, type SyntheticSetup } from './synthetic.js';

// Dips are synthesised as the issue defines them — the same diffracted, smoothed well scaled by its
// opacity — by the independent generator in test/lightcurve/synthetic.ts.

const setup: SyntheticSetup = {
  distanceKm: 6e9,
  wavelengthUm: 0.65,
  bandwidthUm: 0.3,
  starDiameterKm: 0.4,
  speedKmPerS: 8,
  exposureSeconds: 0.1,
  bandSlices: 40,
  discStrips: 16,
  exposureSteps: 16,
};
const times = evenTimes(0, 0.1, 400);
const main = {
  disappearanceSeconds: 18.3117,
  reappearanceSeconds: 24.6042,
  baselineFlux: 1000,
  bottomFlux: 50,
};
const profile = buildEdgeProfile(setup);
const fit = (
  flux: number[],
  extra: { markedDips?: Array<{ startSeconds: number; endSeconds: number }> } = {},
) =>
  fitTiming({
    timesSeconds: times,
    flux,
    fluxErr: flux.map(() => 25),
    speedKmPerS: setup.speedKmPerS,
    exposureSeconds: setup.exposureSeconds,
    profile,
    bottom: 'free',
    ...extra,
  });

describe('fitTiming() dips', () => {
  it('fitTiming() measures a resolved ring dip: times within 3 sigma, opacity, optical depth, equivalent width', () => {
    const ring = { startSeconds: 9.4321, endSeconds: 10.9876, opacity: 0.4 };
    const clean = syntheticFlux(setup, { timesSeconds: times, ...main, dips: [ring] });
    const gauss = gaussianSource(11);
    const result = fit(clean.map((f) => f + 25 * gauss()));
    expect(result.dips).toHaveLength(1);
    const dip = result.dips[0];
    if (dip === undefined) throw new Error('dip not found');
    expect(dip.marked).toBe(false);
    expect(Math.abs(dip.start.timeSeconds - ring.startSeconds)).toBeLessThan(3 * dip.start.sigmaSeconds);
    expect(Math.abs(dip.end.timeSeconds - ring.endSeconds)).toBeLessThan(3 * dip.end.sigmaSeconds);
    // Opacity of a 1.56 s dip (15 samples at 25/950 per sample): σ ≈ 25/(950·√15) ≈ 0.007.
    expectClose(dip.apparentOpacity, ring.opacity, 0.025);
    expectClose(dip.apparentOpticalDepth ?? NaN, -Math.log(1 - dip.apparentOpacity), 1e-12);
    const durationSeconds = dip.end.timeSeconds - dip.start.timeSeconds;
    expectClose(dip.equivalentWidthKm, dip.apparentOpacity * setup.speedKmPerS * durationSeconds, 1e-9);
    expectClose(
      dip.equivalentWidthKm,
      ring.opacity * setup.speedKmPerS * (ring.endSeconds - ring.startSeconds),
      0.3,
    );
    expect(dip.significance).toBeGreaterThan(20);
    // The main times are unaffected by the dip.
    if (result.disappearance === null || result.reappearance === null) throw new Error('event not found');
    expect(Math.abs(result.disappearance.timeSeconds - main.disappearanceSeconds)).toBeLessThan(
      3 * result.disappearance.sigmaSeconds,
    );
    expectClose(result.baselineFlux, 1000, 6);
  });

  it('fitTiming() recovers the equivalent width of an opaque dip shorter than one exposure', () => {
    // 40 ms of full opacity inside 100 ms exposures: start and end are degenerate, their product with the
    // opacity (the removed light) is not. The exposure then spans both of the dip's edges, which is the
    // case the model integrates directly rather than as a product of averages.
    const ring = { startSeconds: 30.2137, endSeconds: 30.2537, opacity: 1 };
    const clean = syntheticFlux(setup, { timesSeconds: times, ...main, dips: [ring] });
    const gauss = gaussianSource(23);
    const result = fit(clean.map((f) => f + 10 * gauss()));
    expect(result.dips).toHaveLength(1);
    const dip = result.dips[0];
    if (dip === undefined) throw new Error('dip not found');
    const truthKm = ring.opacity * setup.speedKmPerS * (ring.endSeconds - ring.startSeconds);
    expectClose(dip.equivalentWidthKm, truthKm, 0.25 * truthKm);
    expect(dip.start.timeSeconds).toBeGreaterThan(29.9);
    expect(dip.end.timeSeconds).toBeLessThan(30.6);
  });

  it('fitTiming() finds no dip in 20 noise realisations of a curve without one (6-sigma threshold)', () => {
    const clean = syntheticFlux(setup, { timesSeconds: times, ...main });
    const gauss = gaussianSource(99);
    for (let k = 0; k < 20; k++) {
      const result = fit(clean.map((f) => f + 25 * gauss()));
      expect(result.dips).toEqual([]);
    }
  });

  it('fitTiming() reports a dip marked by hand, flagged as marked, even where there is nothing', () => {
    const clean = syntheticFlux(setup, { timesSeconds: times, ...main });
    const gauss = gaussianSource(5);
    const result = fit(
      clean.map((f) => f + 25 * gauss()),
      { markedDips: [{ startSeconds: 33.0, endSeconds: 34.0 }] },
    );
    expect(result.dips).toHaveLength(1);
    const dip = result.dips[0];
    if (dip === undefined) throw new Error('marked dip missing');
    expect(dip.marked).toBe(true);
    expect(dip.significance).toBeLessThan(6);
    expect(dip.equivalentWidthKm).toBeLessThan(0.2);
  });
});
