import { describe, expect, it } from 'vitest';

import { validateSolutionFile } from '../src/index.js';

const ellipse = {
  centerFKm: 3.2,
  centerGKm: -11.5,
  equatorialRadiusKm: 212,
  oblateness: 0.08,
  positionAngleDeg: 37,
};
const sampler = {
  walkers: 24,
  burnInSteps: 150,
  steps: 250,
  acceptanceFraction: 0.55,
  parameters: [{ parameter: 'centerFKm', autocorrelationSteps: 61.5, effectiveSamples: 97.6 }],
  cautions: [],
};
const limb = {
  ...ellipse,
  equivalentRadiusKm: 203.3,
  uncertainty: { ...ellipse, equivalentRadiusKm: 1.5 },
  chi2: 3.1,
  dof: 4,
  radialResidualsKm: [],
  negativeChordsClear: true,
  timeOffsets: [],
  band: [],
};
const solution = {
  format: 'limbus-solution/1',
  chords: [],
  limb,
  rings: [],
  astrometry: null,
  engine: { version: '0.1.0', inputSha256: 'ab'.repeat(32), seed: 1 },
};

describe('validateSolutionFile() sampler diagnostics', () => {
  it('validateSolutionFile() keeps the limb’s sampler diagnostics and reads a limb stored without them', () => {
    const withSampler = { ...solution, limb: { ...limb, sigmaMethod: 'sampled', sampler } };
    expect(validateSolutionFile(JSON.parse(JSON.stringify(withSampler)))).toEqual({
      ok: true,
      solution: withSampler,
    });
    const old = validateSolutionFile(solution);
    expect(old.ok && old.solution.limb?.sampler).toBeUndefined();
  });

  it('validateSolutionFile() refuses an acceptance above 1 and a τ of 0, by path', () => {
    const bad = {
      ...solution,
      limb: {
        ...limb,
        sampler: {
          ...sampler,
          acceptanceFraction: 1.2,
          parameters: [{ parameter: 'centerFKm', autocorrelationSteps: 0, effectiveSamples: 97.6 }],
        },
      },
    };
    const result = validateSolutionFile(bad);
    expect(result.ok).toBe(false);
    if (!result.ok)
      expect(result.problems.map((p) => p.path)).toEqual([
        'limb.sampler.acceptanceFraction',
        'limb.sampler.parameters[0].autocorrelationSteps',
      ]);
  });
});
