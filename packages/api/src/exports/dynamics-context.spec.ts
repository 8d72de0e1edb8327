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
