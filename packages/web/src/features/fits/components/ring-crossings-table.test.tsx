import type { RingSolution } from '@limbus/geometry';
import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { RingCrossingsTable } from './ring-crossings-table';
import { renderWithProviders } from '@/testing/test-utils';

// An invented ring crossed at two stations: one dip made from a timing (with its products), one timed by eye.
const RING: RingSolution = {
  ring: 'R1',
  centerFKm: 0,
  centerGKm: 0,
  radiusKm: 1100,
  openingAngleDeg: 33,
  positionAngleDeg: 35,
  uncertainty: { radiusKm: 2, openingAngleDeg: 0.8, positionAngleDeg: 0.5 },
  poles: [
    { raDeg: 1, decDeg: 2 },
    { raDeg: 3, decDeg: 4 },
  ],
  crossings: [
    {
      fKm: 900,
      gKm: 10,
      station: 'harrow-moss',
      radialWidthKm: 6.234,
      radialWidthKmSigma: 0.412,
      dip: {
        lowerLimit: false,
        apparentOpacity: { value: 0.6, sigma: 0.021 },
        apparentOpticalDepth: { value: 0.916, sigma: 0.052 },
        normalOpticalDepth: { value: 0.499, sigma: 0.03 },
        equivalentWidthKm: { value: 3.6, sigma: 0.14 },
        normalEquivalentWidthKm: { value: 2.04, sigma: 0.15 },
        equivalentDepthKm: { value: 5.5, sigma: 0.3 },
        normalEquivalentDepthKm: { value: 3.11, sigma: 0.23 },
      },
    },
    { fKm: -900, gKm: -10, station: 'quillmoor', radialWidthKm: 5.1, radialWidthKmSigma: 0.8 },
  ],
  chi2: 1,
  dof: 1,
};

describe('RingCrossingsTable', () => {
  it('RingCrossingsTable lists each crossing’s radial width and dip products ± 1σ', () => {
    renderWithProviders(<RingCrossingsTable ring={RING} />);
    const table = screen.getByRole('table', { name: 'Crossings of ring R1' });
    const [, first, second] = within(table).getAllByRole('row');
    expect(first).toHaveTextContent('harrow-moss');
    expect(first).toHaveTextContent('6.23 ± 0.41');
    expect(first).toHaveTextContent('0.916 ± 0.052');
    expect(first).toHaveTextContent('0.499 ± 0.030');
    expect(first).toHaveTextContent('3.60 ± 0.14 / 2.04 ± 0.15');
    expect(second).toHaveTextContent('5.10 ± 0.80');
    expect(second).toHaveTextContent('—');
    expect(screen.getByText(/gives its radial width only/)).toBeInTheDocument();
  });

  it('RingCrossingsTable says where the dip products only bound the ring from below', () => {
    const first = RING.crossings[0];
    if (first?.dip === undefined) throw new Error('fixture');
    const limited = { ...first, dip: { ...first.dip, lowerLimit: true, apparentOpticalDepth: null } };
    renderWithProviders(<RingCrossingsTable ring={{ ...RING, crossings: [limited] }} />);
    const table = screen.getByRole('table', { name: 'Crossings of ring R1' });
    expect(table).toHaveTextContent('harrow-moss (lower limits)');
    expect(table).toHaveTextContent('opaque');
    expect(screen.getByText(/At harrow-moss the dip was not resolved/)).toBeInTheDocument();
  });
});
