import { describe, expect, it } from 'vitest';
import { comparisonFigureFileName, comparisonFigureUrl } from './download-comparison-figure';

describe('comparisonFigureUrl', () => {
  it('comparisonFigureUrl() asks for the dpi only for PNG and names the joint pole when there is one', () => {
    expect(
      comparisonFigureUrl('b 1', { format: 'pdf', widthMm: 180, dpi: 300, selection: 'all', jointId: null }),
    ).toBe('/api/bodies/b%201/comparison/figure?format=pdf&widthMm=180&fits=all');
    expect(
      comparisonFigureUrl('b1', {
        format: 'png',
        widthMm: 88,
        dpi: 600,
        selection: 'latest-approved',
        jointId: 'j1',
      }),
    ).toBe('/api/bodies/b1/comparison/figure?format=png&widthMm=88&fits=latest-approved&dpi=600&jointId=j1');
    expect(
      comparisonFigureFileName({ format: 'png', widthMm: 88, dpi: 600, selection: 'all', jointId: null }),
    ).toBe('limbus-comparison-88mm-600dpi.png');
  });
});
