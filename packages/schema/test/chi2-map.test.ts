import { describe, expect, expectTypeOf, it } from 'vitest';
import type { z } from 'zod';

import type { Chi2Map } from '@limbus/geometry';

import {
  chi2BandOf,
  chi2MapResultSchema,
  parseChi2MapResult,
  validateChi2MapRequest,
} from '../src/chi2-map.js';

const problems = (json: unknown) => {
  const result = validateChi2MapRequest(json);
  return result.ok ? [] : result.problems;
};

describe('validateChi2MapRequest()', () => {
  it('validateChi2MapRequest() takes two parameters, optional ranges and steps', () => {
    expect(
      problems({ x: 'centerFKm', y: 'ring R1 radiusKm', ranges: { x: { from: -3, to: 4 } }, steps: 31 }),
    ).toEqual([]);
    expect(problems({ x: 'centerFKm', y: 'centerGKm' })).toEqual([]);
  });

  it('validateChi2MapRequest() refuses, by path, an empty name, a reversed range, fractional steps and unknown keys', () => {
    expect(
      problems({ x: '', y: 'centerGKm', ranges: { y: { from: 5, to: 1 } }, steps: 7.5, colour: 'red' }).map(
        (p) => p.path,
      ),
    ).toEqual(['x', 'ranges.y.to', 'steps', 'colour']);
    expect(problems({ x: 'a', y: 'b', steps: 62 })).toEqual([
      { path: 'steps', message: 'must be 61 or less' },
    ]);
  });
});

describe('chi2MapResultSchema', () => {
  it('chi2MapResultSchema output is geometry’s Chi2Map, both ways', () => {
    expectTypeOf<z.output<typeof chi2MapResultSchema>>().toExtend<Chi2Map>();
    expectTypeOf<Chi2Map>().toExtend<z.output<typeof chi2MapResultSchema>>();
  });

  it('parseChi2MapResult() keeps empty cells and unbounded limits as null', () => {
    const axis = {
      parameter: 'centerFKm',
      unit: 'km',
      best: 1,
      sigma: 0.1,
      min: null,
      max: null,
      values: [0.9, 1.1],
    };
    const map = {
      chi2Of: 'limb',
      ring: null,
      x: axis,
      y: { ...axis, parameter: 'centerGKm' },
      profiled: ['equatorialRadiusKm'],
      chi2: [
        [3, null],
        [2.5, 4],
      ],
      bestChi2: 2.4,
      minChi2: 2.4,
      dof: 9,
      levels: [{ sigma: 1, confidence: 0.6827, deltaChi2: 2.3, segments: [[0.9, 1, 1, 1.1]] }],
      cautions: [],
    };
    expect(parseChi2MapResult(JSON.parse(JSON.stringify(map)))).toEqual(map);
  });
});

describe('chi2BandOf()', () => {
  it('chi2BandOf() counts the levels a Δχ² reaches: 0 inside 1σ, 3 beyond 3σ', () => {
    const levels = [{ deltaChi2: 2.3 }, { deltaChi2: 6.18 }, { deltaChi2: 11.83 }];
    expect([0, 2.29, 2.3, 6.2, 11.83, 40].map((d) => chi2BandOf(d, levels))).toEqual([0, 0, 1, 2, 3, 3]);
  });
});
