import { screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { FitView } from './fit-view';
import { TEST_SOLUTION } from '@/testing/test-solution';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

// Fluent forms re-render on every keystroke; on a loaded machine a test takes seconds in jsdom.
vi.setConfig({ testTimeout: 30_000 });

const FIT = {
  id: 'f1',
  state: 'solved',
  reviewState: 'none',
  progress: 100,
  error: null,
  solution: TEST_SOLUTION,
  createdBy: { id: 'u1', name: 'Iris Tallow' },
  createdAt: '2029-05-18T10:00:00.000Z',
  finishedAt: '2029-05-18T10:00:04.000Z',
  options: { limb: { fixed: { oblateness: 0.082 } }, ring: { centerFrom: 'limb' } },
  dataSha256: 'b'.repeat(64),
  inputMatchesEvent: true,
};

describe('FitView', () => {
  it('FitView shows each limb parameter with its 1σ and unit, χ² with degrees of freedom, and the astrometry', async () => {
    stubFetch(() => jsonResponse(200, { ...FIT, options: {} }));
    renderWithProviders(<FitView fitId="f1" />);
    const table = await screen.findByRole('table', { name: 'Limb parameters' });
    const radius = within(table).getByText('Equatorial radius').closest('tr');
    // Each value rounded to its σ's second significant digit (value-sigma.ts).
    expect(radius).toHaveTextContent('121.4 ± 1.8');
    expect(radius).toHaveTextContent('km');
    expect(within(table).getByText('Oblateness').closest('tr')).toHaveTextContent('0.082 ± 0.011');
    expect(within(table).getByText('Clock offset, brackenmoor').closest('tr')).toHaveTextContent(
      '0.210 ± 0.050',
    );
    expect(screen.getByText(/χ² = 3.10 for 2 degrees of freedom/)).toBeInTheDocument();
    expect(screen.getByText('every negative chord is clear of the limb')).toBeInTheDocument();
    expect(screen.getByLabelText('Astrometric offset')).toHaveTextContent('Δα cos δ = 12.30 ± 0.60 mas');
    expect(screen.getByText('by Iris Tallow')).toBeInTheDocument();
    expect(screen.queryByText('Based on older data')).not.toBeInTheDocument();
  });

  it('FitView warns that a fit ran on older data when the event changed since', async () => {
    stubFetch(() => jsonResponse(200, { ...FIT, reviewState: 'approved', inputMatchesEvent: false }));
    renderWithProviders(<FitView fitId="f1" />);
    expect(await screen.findByText('Based on older data')).toBeInTheDocument();
    expect(screen.getByText(/Run the fit again before relying on it/)).toBeInTheDocument();
    expect(screen.getByText('based on older data')).toBeInTheDocument();
  });

  it('FitView marks a fixed parameter as fixed, without a sigma, and names it among the cautions', async () => {
    stubFetch(() => jsonResponse(200, FIT));
    renderWithProviders(<FitView fitId="f1" />);
    const row = (await screen.findByText('Oblateness')).closest('tr');
    expect(row).toHaveTextContent('0.0820');
    expect(row).not.toHaveTextContent('±');
    expect(row).toHaveTextContent('fixed');
    expect(screen.getByRole('list', { name: 'Cautions' })).toHaveTextContent(
      'Oblateness was fixed at 0.082, not fitted',
    );
  });

  it('FitView shows a progress bar while the fit runs', async () => {
    stubFetch(() => jsonResponse(200, { ...FIT, state: 'running', progress: 40, solution: null }));
    renderWithProviders(<FitView fitId="f1" />);
    const bar = await screen.findByRole('progressbar', { name: 'Fit progress' });
    expect(bar).toHaveAttribute('aria-valuenow', '40');
    expect(screen.getByText('Running: 40 %')).toBeInTheDocument();
    expect(screen.queryByRole('table', { name: 'Limb parameters' })).not.toBeInTheDocument();
  });

  it('FitView says an approved fit is frozen', async () => {
    stubFetch(() => jsonResponse(200, { ...FIT, reviewState: 'approved' }));
    renderWithProviders(<FitView fitId="f1" />);
    expect(await screen.findByText('Approved and frozen')).toBeInTheDocument();
  });

  it('FitView refuses a solution that is not limbus-solution/1 and says why', async () => {
    stubFetch(() => jsonResponse(200, { ...FIT, solution: { ...TEST_SOLUTION, format: 'other/2' } }));
    renderWithProviders(<FitView fitId="f1" />);
    expect(await screen.findByRole('alert')).toHaveTextContent('Could not load the fit');
  });
});
