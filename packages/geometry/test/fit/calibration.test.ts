import { describe, expect, it } from 'vitest';
import { fitLimb } from '../../src/fit/limb-fit.js';
import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { LIMB_PARAMETERS } from '../../src/types.js';
import type { LimbEllipse } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { limbPoints } from './synthetic-chords.js';

// Coverage check of the reported 1-sigma: for a correct 1-sigma the truth lies within it in 68.3 % of
// noise realisations (normal distribution, e.g. Bevington & Robinson, Data Reduction and Error Analysis,
// 3rd ed., Table C.2). With 200 realisations the binomial spread of that fraction is √(0.683·0.317/200)
// ≈ 3.3 %, so ±7 % is about two standard deviations. The mean of χ²/ν is 1 with spread √(2/ν)/√200
// ≈ 0.028 for ν = 13 (Bevington & Robinson §11.1), well inside ±0.1.

const truth: LimbEllipse = {
  centerFKm: -8,
  centerGKm: 15,
  equatorialRadiusKm: 380,
  oblateness: 0.15,
  positionAngleDeg: 62,
};
const velocity = { f: 14, g: 9 };
const impactKm = [-320, -240, -150, -70, 10, 90, 170, 250, 320];
const REALISATIONS = 200;

describe('fitLimb() calibration', () => {
  it('fitLimb() 1-sigma covers the truth 68 % ± 7 % of the time and χ²/dof averages 1 ± 0.1', () => {
    const noise = gaussian(mulberry32(20261201));
    const inside = new Map<string, number>([...LIMB_PARAMETERS, 'equivalentRadiusKm'].map((n) => [n, 0]));
    const count = (name: string) => inside.set(name, (inside.get(name) ?? 0) + 1);
    const trueEquivalent = truth.equatorialRadiusKm * Math.sqrt(1 - truth.oblateness);
    let reducedChi2 = 0;
    for (let i = 0; i < REALISATIONS; i++) {
      const points = limbPoints({ truth, velocity, impactKm, sigmaSeconds: 0.4, noise });
      const r = fitLimb({ points, negatives: [], fixed: {}, modelErrorKm: 0, fitTimeOffsets: [], seed: i });
      for (const name of LIMB_PARAMETERS) {
        const diff =
          name === 'positionAngleDeg'
            ? ((((r.ellipse[name] - truth[name]) % 180) + 270) % 180) - 90
            : r.ellipse[name] - truth[name];
        if (Math.abs(diff) <= r.uncertainty[name]) count(name);
      }
      if (Math.abs(r.equivalentRadiusKm - trueEquivalent) <= r.uncertainty.equivalentRadiusKm) {
        count('equivalentRadiusKm');
      }
      reducedChi2 += r.chi2 / r.dof;
    }
    const names = [...LIMB_PARAMETERS, 'equivalentRadiusKm'];
    const fractions = names.map((name) => (inside.get(name) ?? 0) / REALISATIONS);
    console.log('coverage', names.join(' '), fractions.join(' '), 'mean χ²/dof', reducedChi2 / REALISATIONS);
    expect(fractions).toHaveLength(6);
    for (const fraction of fractions) expectClose(fraction, 0.683, 0.07);
    expectClose(reducedChi2 / REALISATIONS, 1, 0.1);
  });
});
