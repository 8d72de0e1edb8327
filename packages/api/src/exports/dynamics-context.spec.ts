import { describe, expect, it } from 'vitest';
import type { RingFitAgainstContext } from '../dynamics/dynamics-view';
import { dynamicsCaption, dynamicsRows } from './dynamics-context';
import { tableCsv } from './table';
import { exampleProvenance } from '../../e2e/exports/example-fixture';

// Invented ratios; what is under test is that each one is carried with its own 1-sigma and read the right way.
const RING: RingFitAgainstContext = {
  fitId: 'f1',
  ring: 'R1',
  radiusKm: 2010,
  radiusKmSigma: 8,
  inBodyRadii: 3.589,
  inRocheFluid: 1.21,
  inRocheRigid: 2.33,
  inSynchronous: 0.97,
  uncertainty: { inBodyRadii: 0.066, inRocheFluid: 0.052, inRocheRigid: 0.1, inSynchronous: 0.012 },
  nearestResonances: [],
};

// An invented resonance 12 km inside the ring: 2010 − 1998 km, σ √(8² + 5²) = 9.43 km.
const NEAR = {
  kind: 'mean-motion' as const,
  satellite: 'Oru',
  p: 6,
  q: 1,
  radiusKm: 1998,
  radiusKmSigma: 5,
  distanceKm: 12,
  distanceKmSigma: Math.hypot(8, 5),
  distanceInRingSigma: 12 / 8,
  distanceInResonanceSigma: 12 / 5,
  distanceInSigma: 12 / Math.hypot(8, 5),
};

describe('dynamicsRows', () => {
  it('dynamicsRows() gives four derived rows per ring, each with its own 1-sigma and no unit', () => {
    const rows = dynamicsRows([RING, { ...RING, ring: 'R2', inRocheFluid: 0.8 }]);
    expect(rows.map((r) => `${r.group}/${r.parameter}`)).toEqual([
      'ring R1 context/radiusInBodyRadii',
      'ring R1 context/radiusOverRocheFluid',
      'ring R1 context/radiusOverRocheRigid',
      'ring R1 context/radiusOverSynchronous',
      'ring R2 context/radiusInBodyRadii',
      'ring R2 context/radiusOverRocheFluid',
      'ring R2 context/radiusOverRocheRigid',
      'ring R2 context/radiusOverSynchronous',
    ]);
    expect(rows[1]).toEqual({
      group: 'ring R1 context',
      parameter: 'radiusOverRocheFluid',
      value: 1.21,
      sigma: 0.052,
      unit: '',
      status: 'derived',
    });
    expect(rows[3]?.sigma).toBe(0.012);
    expect(tableCsv(rows, exampleProvenance)).toMatch(
      /ring R1 context,radiusOverRocheRigid,2\.33,0\.1,,derived/,
    );
  });

  it('dynamicsRows() and dynamicsCaption() give nothing when no context is stored', () => {
    expect(dynamicsRows([])).toEqual([]);
    expect(dynamicsCaption([])).toBe('');
  });
});

describe('dynamicsCaption', () => {
  it('dynamicsCaption() rounds each ratio to its 1-sigma and says on which side of each Roche limit the ring is', () => {
    expect(dynamicsCaption([RING])).toBe(
      'Against the body context stored for the event, ring R1 lies at 3.589 ± 0.066 body radii, ' +
        '1.210 ± 0.052 of the fluid Roche limit (outside) and 2.33 ± 0.10 of the rigid one (outside).',
    );
    expect(dynamicsCaption([{ ...RING, inRocheFluid: 0.95, inRocheRigid: 0.5 }])).toMatch(
      /0\.950 ± 0\.052 of the fluid Roche limit \(inside\) and 0\.50 ± 0\.10 of the rigid one \(inside\)/,
    );
  });
});

describe('the nearest resonance in the exports', () => {
  it('dynamicsRows() and dynamicsCaption() add the nearest resonance with its distance and both 1-sigma', () => {
    const ring = { ...RING, nearestResonances: [NEAR, { ...NEAR, p: 7, distanceKm: -40 }] };
    const rows = dynamicsRows([ring]);
    expect(rows).toHaveLength(5);
    expect(rows[4]).toEqual({
      group: 'ring R1 context',
      parameter: 'distanceKm to 6:1 with Oru',
      value: 12,
      sigma: Math.hypot(8, 5),
      unit: 'km',
      status: 'derived',
    });
    expect(dynamicsCaption([ring])).toMatch(
      /Its nearest resonance is the 6:1 with Oru at 1998\.0 ± 5\.0 km, 12\.0 ± 9\.4 km outside it \(1\.3σ\)\.$/,
    );
    expect(
      dynamicsCaption([
        { ...RING, nearestResonances: [{ ...NEAR, kind: 'spin-orbit', satellite: null, p: 1, q: 3 }] },
      ]),
    ).toMatch(/the 1:3 spin–orbit at/);
  });
});
