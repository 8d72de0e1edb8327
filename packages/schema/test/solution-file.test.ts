import { describe, expect, expectTypeOf, it } from 'vitest';
import type { z } from 'zod';

import type { Solution } from '@limbus/geometry';

import { solutionFileSchema, validateSolutionFile } from '../src/index.js';

function sampleSolution(): Solution {
  const ellipse = {
    centerFKm: 3.2,
    centerGKm: -11.5,
    equatorialRadiusKm: 212,
    oblateness: 0.08,
    positionAngleDeg: 37,
  };
  return {
    format: 'limbus-solution/1',
    chords: [
      {
        station: 'north-ridge',
        type: 'positive',
        points: [
          { fKm: -180.1, gKm: 40.2, event: 'disappearance', sigmaKm: 1.2 },
          { fKm: 175.3, gKm: 38.9, event: 'reappearance', sigmaKm: 1.2 },
        ],
        path: [
          { fKm: -400, gKm: 41 },
          { fKm: 400, gKm: 37 },
        ],
        velocityKmPerS: { f: 21.4, g: -0.3 },
      },
    ],
    limb: {
      ...ellipse,
      equivalentRadiusKm: 203.3,
      uncertainty: { ...ellipse, equivalentRadiusKm: 1.5 },
      chi2: 3.1,
      dof: 4,
      radialResidualsKm: [{ station: 'north-ridge', event: 'disappearance', residualKm: 0.4 }],
      negativeChordsClear: true,
      timeOffsets: [],
      band: [ellipse],
    },
    rings: [],
    astrometry: {
      referenceTimeUtc: '2028-03-14T02:14:20Z',
      raOffsetCosDecMas: 12.5,
      decOffsetMas: -3.25,
      uncertainty: { raOffsetCosDecMas: 0.5, decOffsetMas: 0.6 },
    },
    engine: { version: '0.1.0', inputSha256: 'ab'.repeat(32), seed: 1 },
  };
}

describe('validateSolutionFile()', () => {
  it('validateSolutionFile() accepts a well-formed solution unchanged', () => {
    const result = validateSolutionFile(JSON.parse(JSON.stringify(sampleSolution())));
    expect(result).toEqual({ ok: true, solution: sampleSolution() });
  });

  it('validateSolutionFile() accepts a solution without limb or astrometry (no positive chord)', () => {
    const solution = { ...sampleSolution(), limb: null, astrometry: null };
    expect(validateSolutionFile(solution).ok).toBe(true);
  });

  it('validateSolutionFile() refuses wrong format, missing fields and a malformed hash, by path', () => {
    const bad: Record<string, unknown> = { ...sampleSolution(), format: 'limbus-solution/0' };
    delete bad.rings;
    bad.engine = { version: '0.1.0', inputSha256: 'xyz', seed: 1.5 };
    const result = validateSolutionFile(bad);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.problems.map((p) => p.path)).toEqual([
      'format',
      'rings',
      'engine.inputSha256',
      'engine.seed',
    ]);
  });

  it('validateSolutionFile() reads a ring stored before centre sigmas, covariances and pole sigmas', () => {
    const ring = {
      ring: 'R1',
      centerFKm: 3.2,
      centerGKm: -11.5,
      radiusKm: 1080,
      openingAngleDeg: 31,
      positionAngleDeg: 70,
      uncertainty: { radiusKm: 2.3, openingAngleDeg: 0.2, positionAngleDeg: 0.4 },
      poles: [
        { raDeg: 41, decDeg: 27 },
        { raDeg: 345, decDeg: 8 },
      ],
      crossings: [],
      chi2: 1.2,
      dof: 3,
    };
    const result = validateSolutionFile({ ...sampleSolution(), rings: [ring] });
    expect(result.ok).toBe(true);
    if (result.ok) expect(result.solution.rings[0]?.uncertainty.centerFKm).toBeUndefined();
  });

  it('validateSolutionFile() keeps covariances, centre and pole sigmas, and refuses a non-square covariance', () => {
    const names = ['centerFKm', 'centerGKm', 'radiusKm', 'openingAngleDeg', 'positionAngleDeg'];
    const matrix = names.map((_, i) => names.map((__, j) => (i === j ? 1 : 0)));
    const ring = {
      ring: 'R1',
      centerFrom: 'joint',
      centerFKm: 3.2,
      centerGKm: -11.5,
      radiusKm: 1080,
      openingAngleDeg: 31,
      positionAngleDeg: 70,
      uncertainty: {
        radiusKm: 2.3,
        openingAngleDeg: 0.2,
        positionAngleDeg: 0.4,
        centerFKm: 0.3,
        centerGKm: 0.4,
      },
      covariance: { parameters: names, matrix },
      poles: [
        { raDeg: 41, decDeg: 27, uncertainty: { raDeg: 0.3, decDeg: 0.2, correlation: -0.5 } },
        { raDeg: 345, decDeg: 8, uncertainty: { raDeg: 0.4, decDeg: 0.1, correlation: 0.5 } },
      ],
      crossings: [],
      chi2: 1.2,
      dof: 3,
    };
    const good = { ...sampleSolution(), rings: [ring] };
    expect(validateSolutionFile(JSON.parse(JSON.stringify(good)))).toEqual({ ok: true, solution: good });
    const bad = { ...good, rings: [{ ...ring, covariance: { parameters: names, matrix: matrix.slice(1) } }] };
    const result = validateSolutionFile(bad);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems.map((p) => p.path)).toEqual(['rings[0].covariance']);
  });

  it('validateSolutionFile() schema output type is geometry Solution, both ways', () => {
    expectTypeOf<z.output<typeof solutionFileSchema>>().toExtend<Solution>();
    expectTypeOf<Solution>().toExtend<z.output<typeof solutionFileSchema>>();
  });
});
