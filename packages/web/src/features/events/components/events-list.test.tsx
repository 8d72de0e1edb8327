import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { EventsList } from './events-list';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

describe('EventsList', () => {
  it('EventsList shows the empty view while the events endpoint answers 404', async () => {
    stubFetch(() => jsonResponse(404, { statusCode: 404, message: 'Cannot GET /api/events' }));
    renderWithProviders(<EventsList teamId="t1" teamName="Outer Belt Timing Group" />);
    expect(await screen.findByText('No events yet')).toBeInTheDocument();
  });

  it("EventsList lists only the current team's events", async () => {
    stubFetch(() =>
      jsonResponse(200, [
        {
          id: 'e1',
          title: 'Occultation of a 14th-magnitude star, night one',
          teamId: 't1',
          eventDate: '2029-05-17T03:12:30.000Z',
          star: { raDeg: 210.1, decDeg: -12.3 },
          counts: { stations: 6, chords: 5, reports: 2, fits: 1 },
          latestFit: { id: 'f1', state: 'done' },
        },
        { id: 'e2', title: 'Other team event', teamId: 't2' },
      ]),
    );
    renderWithProviders(<EventsList teamId="t1" teamName="Outer Belt Timing Group" />);
    expect(await screen.findByText('Occultation of a 14th-magnitude star, night one')).toBeInTheDocument();
    expect(screen.queryByText('Other team event')).not.toBeInTheDocument();
    const row = screen.getByRole('row', { name: /night one/ });
    expect(row).toHaveTextContent('2029-05-17');
    expect(row).toHaveTextContent('done');
  });

  it('EventsList says what failed and retries on request', async () => {
    let attempts = 0;
    stubFetch(() => {
      attempts += 1;
      return attempts === 1
        ? jsonResponse(500, { statusCode: 500, message: 'Database down' })
        : jsonResponse(200, []);
    });
    renderWithProviders(<EventsList teamId="t1" teamName={null} />);
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Could not load events');
    expect(alert).toHaveTextContent('Database down');
    await userEvent.setup().click(screen.getByRole('button', { name: 'Retry' }));
    expect(await screen.findByText('No events yet')).toBeInTheDocument();
  });
});
