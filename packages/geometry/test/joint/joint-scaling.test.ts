import { describe, expect, it } from 'vitest';

import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { fitJointPole, formatDeltaChi2 } from '../../src/joint/joint-fit.js';
import { jointPoleDocument } from '../../src/joint/document.js';
import { expectClose } from '../expect-close.js';
import { syntheticRingEvent, type SyntheticEventSpec } from './synthetic-rings.js';

// Two invented events of one ring (pole RA 41°, Dec +27°, radius 390 km) seen along star directions 35°
// apart, as in joint-fit.test.ts.
const SPECS: SyntheticEventSpec[] = [
  {
    title: 'event A',
    starRaDeg: 250,
    starDecDeg: -21,
    centerFKm: 12,
    centerGKm: -30,
    centerKnown: true,
    velocityFKmPerS: 22,
    velocityGKmPerS: -4,
    pathOffsetsKm: [-300, -170, -40, 90, 210, 330],
    sigmaSeconds: 0.2,
  },
  {
    title: 'event B',
    starRaDeg: 285,
    starDecDeg: -22,
    centerFKm: -5,
    centerGKm: 8,
    centerKnown: true,
    velocityFKmPerS: 18,
    velocityGKmPerS: 6,
    pathOffsetsKm: [-280, -120, 30, 150, 260],
    sigmaSeconds: 0.2,
  },
];

/** The events with timing noise of trueSigma seconds while each crossing states statedSigma. */
function events(trueSigma: number, statedSigma: number) {
  const normal = gaussian(mulberry32(808));
  return SPECS.map((spec) => {
    const e = syntheticRingEvent({ ...spec, sigmaSeconds: trueSigma }, 41, 27, 390, normal);
    return { ...e, crossings: e.crossings.map((c) => ({ ...c, sigmaSeconds: statedSigma })) };
  });
}

describe('fitJointPole() scaling', () => {
  it('fitJointPole() scales the 1-sigma by √(χ²/dof) above 1, as restating the timing sigmas would', () => {
    // Noise three times the stated sigma: χ²/dof ≈ 9. Scaling every σt by c leaves the best fit where it is
    // and multiplies (JᵀJ)⁻¹ by c², so the scaled 1-sigma must equal those of the same crossings restated
    // with σt·√(χ²/dof), whose χ²/dof is then exactly 1 (Bevington & Robinson, 3rd ed., §8.1, from memory).
    const loose = fitJointPole(events(0.6, 0.2));
    expect(loose.reducedChi2).not.toBeNull();
    expect(loose.reducedChi2!).toBeGreaterThan(4);
    expectClose(loose.sigmaScale, Math.sqrt(loose.reducedChi2!), 1e-12);
    const restated = fitJointPole(events(0.6, 0.2 * loose.sigmaScale));
    expectClose(restated.reducedChi2!, 1, 1e-6);
    expectClose(restated.sigmaScale, 1, 1e-9);
    expectClose(loose.uncertainty.raDeg, restated.uncertainty.raDeg, 1e-4 * restated.uncertainty.raDeg);
    expectClose(loose.uncertainty.decDeg, restated.uncertainty.decDeg, 1e-4 * restated.uncertainty.decDeg);
    expectClose(loose.radiusSigmaKm, restated.radiusSigmaKm, 1e-4 * restated.radiusSigmaKm);
    expectClose(loose.pole.raDeg, restated.pole.raDeg, 1e-6);
    expect(loose.notes[0]).toMatch(/multiplied by √\(χ²\/dof\) = \d+\.\d\d/);
    // The family difference is judged in the same inflated units.
    expectClose(
      loose.familyDeltaChi2 / loose.reducedChi2!,
      restated.familyDeltaChi2,
      1e-3 * restated.familyDeltaChi2,
    );
    expect(loose.ambiguityResolved).toBe(restated.ambiguityResolved);
  });

  it('fitJointPole() leaves the 1-sigma alone when χ²/dof is at most 1', () => {
    const fit = fitJointPole(events(0.1, 0.2));
    expect(fit.reducedChi2!).toBeLessThan(1);
    expect(fit.sigmaScale).toBe(1);
    expect(fit.notes[0]).toMatch(/not rescaled/);
  });

  it('jointPoleDocument() of one event says both poles remain, with a Δχ² of 0.0, never −0.0', () => {
    const one = fitJointPole([syntheticRingEvent(SPECS[0]!, 41, 27, 390)]);
    const doc = jointPoleDocument('R1', one);
    expect(doc.ambiguityResolved).toBe(false);
    expect(Math.abs(doc.familyDeltaChi2)).toBeLessThan(1e-6);
    expect(doc.notes.at(-1)).toBe(
      "The other pole family's best χ² differs by 0.0, not more than 9: both poles remain possible.",
    );
    expect(doc.uncertainty.correlation).toBeGreaterThanOrEqual(-1);
    expect(doc.format).toBe('limbus-joint/1');
  });
});

describe('formatDeltaChi2()', () => {
  it('formatDeltaChi2() signs and rounds: one decimal below 1000, whole numbers above, no −0.0', () => {
    // Rounding half away from zero at the stated decimal (common practice, no source).
    expect(formatDeltaChi2(381.46)).toBe('+381.5');
    expect(formatDeltaChi2(-0.34)).toBe('−0.3');
    expect(formatDeltaChi2(-1e-10)).toBe('0.0');
    expect(formatDeltaChi2(0.04)).toBe('0.0');
    expect(formatDeltaChi2(12345.6)).toBe('+12346');
    expect(formatDeltaChi2(-2287795.1)).toBe('−2287795');
  });
});
