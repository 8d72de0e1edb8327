import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { FitsList } from './fits-list';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

vi.setConfig({ testTimeout: 30_000 });

// Two invented fits of one event: an approved one run before a chord changed, and a newer one.
const FITS = [
  {
    id: 'f1',
    state: 'solved',
    reviewState: 'approved',
    progress: 100,
    createdBy: { id: 'u1', name: 'Iris Tallow' },
    createdAt: '2029-05-18T10:00:00.000Z',
    dataSha256: 'a'.repeat(64),
    inputMatchesEvent: false,
  },
  {
    id: 'f2',
    state: 'solved',
    reviewState: 'none',
    progress: 100,
    createdBy: { id: 'u1', name: 'Iris Tallow' },
    createdAt: '2029-05-19T08:30:00.000Z',
    dataSha256: 'b'.repeat(64),
    inputMatchesEvent: true,
  },
];

function rowOf(started: string): HTMLElement {
  const row = screen.getByRole('cell', { name: started }).closest('tr');
  if (row === null) throw new Error(`no row for ${started}`);
  return row;
}

describe('FitsList', () => {
  it('FitsList lists the newest fit first and badges the one based on older data', async () => {
    stubFetch(() => jsonResponse(200, FITS));
    const onSelect = vi.fn();
    renderWithProviders(<FitsList eventId="e1" selectedFitId="f2" onSelect={onSelect} />);
    const table = await screen.findByRole('table', { name: 'Fits' });
    const rows = within(table).getAllByRole('row');
    expect(rows[1]).toHaveTextContent('2029-05-19 08:30:00 UTC');
    expect(within(rowOf('2029-05-18 10:00:00 UTC')).getByText('based on older data')).toBeInTheDocument();
    expect(within(rowOf('2029-05-19 08:30:00 UTC')).queryByText('based on older data')).toBeNull();
    expect(within(rowOf('2029-05-19 08:30:00 UTC')).getByText('current')).toBeInTheDocument();
    await userEvent
      .setup()
      .click(screen.getByRole('button', { name: 'Open fit of 2029-05-18 10:00:00 UTC' }));
    expect(onSelect).toHaveBeenCalledWith('f1');
  });
});
