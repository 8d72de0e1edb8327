import type { RingSolution, Solution } from '@limbus/geometry';
import { screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { FitResult } from './fit-result';
import { TEST_SOLUTION } from '@/testing/test-solution';
import { renderWithProviders } from '@/testing/test-utils';

vi.setConfig({ testTimeout: 30_000 });

// An invented ring as a solution stored before ring centre, covariance and pole sigmas existed.
const OLD_RING: RingSolution = {
  ring: 'R1',
  centerFKm: 1.25,
  centerGKm: -3.5,
  radiusKm: 1080.4,
  openingAngleDeg: 31.2,
  positionAngleDeg: 70.6,
  uncertainty: { radiusKm: 2.3, openingAngleDeg: 0.21, positionAngleDeg: 0.42 },
  poles: [
    { raDeg: 41.03, decDeg: 27.11 },
    { raDeg: 345.6, decDeg: 8.4 },
  ],
  crossings: [],
  chi2: 4.2,
  dof: 5,
};

// The same ring as a joint fit reports it: centre 1σ, pole 1σ and correlation (values by hand).
const JOINT_RING: RingSolution = {
  ...OLD_RING,
  centerFrom: 'joint',
  uncertainty: { ...OLD_RING.uncertainty, centerFKm: 0.7, centerGKm: 1.6 },
  poles: [
    { raDeg: 41.03, decDeg: 27.11, uncertainty: { raDeg: 0.35, decDeg: 0.22, correlation: 0.93 } },
    { raDeg: 345.6, decDeg: 8.4, uncertainty: { raDeg: 0.41, decDeg: 0.18, correlation: -0.88 } },
  ],
};

function render(ring: RingSolution, options: Record<string, unknown>, extra: Partial<Solution> = {}) {
  renderWithProviders(
    <FitResult solution={{ ...TEST_SOLUTION, rings: [ring], ...extra }} options={options} />,
  );
}

describe('FitResult rings', () => {
  it('FitResult shows each pole with its 1σ and correlation, and the joint centre with its 1σ', () => {
    render(JOINT_RING, { ring: { centerFrom: 'joint' } });
    const poles = screen.getByRole('table', { name: 'Pole solutions of ring R1' });
    const first = within(poles).getByText('First solution').closest('tr');
    // Rounded to two significant digits of the 1σ (value-sigma.ts).
    expect(first).toHaveTextContent('41.03 ± 0.35');
    expect(first).toHaveTextContent('27.11 ± 0.22');
    expect(first).toHaveTextContent('0.93');
    expect(screen.getByLabelText('Centre of ring R1')).toHaveTextContent(
      'Centre f = 1.25 ± 0.70 km, g = -3.5 ± 1.6 km, fitted jointly with the limb (one shared centre).',
    );
    expect(screen.getByRole('list', { name: 'Cautions' })).toHaveTextContent(/one shared centre/);
  });

  it('FitResult reads a ring stored before pole 1σ and says so', () => {
    render(OLD_RING, { ring: { centerFrom: 'limb' } });
    const poles = screen.getByRole('table', { name: 'Pole solutions of ring R1' });
    expect(within(poles).getByText('First solution').closest('tr')).toHaveTextContent('41.0327.11—');
    expect(screen.getByText(/stored before pole 1σ were computed/)).toBeInTheDocument();
    expect(screen.getByRole('list', { name: 'Cautions' })).toHaveTextContent(
      /leave out the centre's own error/,
    );
  });
});
