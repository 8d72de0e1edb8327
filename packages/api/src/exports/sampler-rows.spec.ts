import type { RingSolution, SamplerDiagnostics, Solution } from '@limbus/geometry';
import { describe, expect, it } from 'vitest';
import { samplerRows } from './sampler-rows';

const sampler: SamplerDiagnostics = {
  walkers: 24,
  burnInSteps: 150,
  steps: 250,
  acceptanceFraction: 0.55,
  parameters: [{ parameter: 'radiusKm', autocorrelationSteps: 60, effectiveSamples: 100 }],
  cautions: [],
};

describe('samplerRows()', () => {
  it('samplerRows() lists acceptance, walkers, steps and each parameter’s τ and effective samples', () => {
    const ring = (label: string): RingSolution => ({
      ring: label,
      centerFKm: 0,
      centerGKm: 0,
      radiusKm: 1000,
      openingAngleDeg: 30,
      positionAngleDeg: 10,
      uncertainty: { radiusKm: 1, openingAngleDeg: 0.1, positionAngleDeg: 0.1 },
      poles: [
        { raDeg: 1, decDeg: 2 },
        { raDeg: 3, decDeg: 4 },
      ],
      crossings: [],
      chi2: 1,
      dof: 2,
    });
    const solution: Solution = {
      format: 'limbus-solution/1',
      chords: [],
      limb: null,
      // A ring fitted jointly (linearised) has no sampler and adds no rows.
      rings: [{ ...ring('R1'), sampler }, ring('R2')],
      astrometry: null,
      engine: { version: '0', inputSha256: '0'.repeat(64), seed: 1 },
    };
    expect(samplerRows(solution).map((r) => [r.group, r.parameter, r.value, r.sigma, r.status])).toEqual([
      ['sampler ring R1', 'acceptanceFraction', 0.55, null, 'derived'],
      ['sampler ring R1', 'walkers', 24, null, 'derived'],
      ['sampler ring R1', 'steps', 250, null, 'derived'],
      ['sampler ring R1', 'autocorrelationSteps radiusKm', 60, null, 'derived'],
      ['sampler ring R1', 'effectiveSamples radiusKm', 100, null, 'derived'],
    ]);
  });
});
