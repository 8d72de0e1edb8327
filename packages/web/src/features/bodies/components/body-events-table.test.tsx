import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { BodyEventsTable } from './body-events-table';
import { NIGHT_ONE, NIGHT_TWO } from './test-body';
import { renderWithProviders } from '@/testing/test-utils';

describe('BodyEventsTable', () => {
  it("BodyEventsTable shows each event's approved limb ± 1σ with units in the headers, and flags a fit on older data", () => {
    renderWithProviders(<BodyEventsTable events={[NIGHT_ONE, NIGHT_TWO]} />);
    const table = screen.getByRole('table', { name: 'Events and approved fits' });
    const headers = within(table)
      .getAllByRole('columnheader')
      .map((h) => h.textContent);
    expect(headers).toEqual(
      expect.arrayContaining([
        'Date (UTC)',
        'Equatorial radius (km)',
        'Oblateness',
        'Position angle (°)',
        'χ² / dof',
        'Ring radii (km)',
      ]),
    );
    const [, one, two] = within(table).getAllByRole('row') as HTMLElement[];
    expect(within(one!).getByRole('link', { name: NIGHT_ONE.title })).toHaveAttribute('href', '/events/e1');
    expect(one).toHaveTextContent('2031-07-02 20:14:07 UTC');
    // σ to two significant digits, the value to the same place (common practice, no source).
    expect(one).toHaveTextContent('402.3 ± 1.8');
    expect(one).toHaveTextContent('0.101 ± 0.012');
    expect(one).toHaveTextContent('35.24 ± 0.31');
    expect(one).toHaveTextContent('8.42 / 11');
    expect(one).toHaveTextContent('R1: 1080.0 ± 2.3');
    expect(within(one!).getAllByText('based on older data')).toHaveLength(2);
    expect(within(one!).getByRole('link', { name: '2031-07-04 09:30:00 UTC' })).toHaveAttribute(
      'href',
      '/events/e1?section=fits&fit=f2',
    );
    expect(two).toHaveTextContent('Solved, in review');
    expect(two).toHaveTextContent('none');
    expect(two).not.toHaveTextContent('based on older data');
  });

  it('BodyEventsTable says so when the body has no events', () => {
    renderWithProviders(<BodyEventsTable events={[]} />);
    expect(screen.getByText('No events of this body yet.')).toBeInTheDocument();
  });
});
