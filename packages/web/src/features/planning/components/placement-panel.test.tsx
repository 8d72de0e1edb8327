import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { testPlacement } from '../testing/test-placement';
import { PlacementPanel } from './placement-panel';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

describe('PlacementPanel', () => {
  it('PlacementPanel asks for sites, states the night and star-up condition, and makes a suggestion a planned station', async () => {
    const user = userEvent.setup();
    const calls = stubFetch((call) =>
      call.method === 'POST' ? jsonResponse(201, { id: 'new-station' }) : jsonResponse(200, testPlacement()),
    );
    renderWithProviders(<PlacementPanel eventId="event-1" />);
    const sites = screen.getByRole('textbox', { name: /How many more sites/ });
    await user.clear(sites);
    await user.type(sites, '2');
    await user.click(screen.getByRole('checkbox', { name: 'Cover the rings too' }));
    await user.click(screen.getByRole('button', { name: 'Suggest sites' }));

    const table = await screen.findByRole('table', { name: 'Suggested sites' });
    const query = new URL(calls[0]?.url ?? '', 'http://limbus.test');
    expect(query.pathname).toBe('/api/events/event-1/placement');
    expect(query.searchParams.get('sites')).toBe('2');
    expect(query.searchParams.get('ringsToo')).toBe('true');
    expect(query.searchParams.has('region')).toBe(false);
    const criteria = screen.getByText(
      /the Sun more than 12° below the horizon and the star more than 20° above it/,
    );
    expect(criteria).toHaveTextContent('Largest gap now 153.5 km, after these sites 76.8 km');
    expect(criteria).toHaveTextContent('nearest chord: now 76.8 km, after these sites 38.4 km.');
    // The offset carries the path's 1σ; a suggestion without a ground point says why and offers nothing.
    expect(within(table).getByText('−34 ± 20 km')).toBeVisible();
    expect(within(table).getByText('Over the sea along the whole offset line.')).toBeVisible();
    expect(within(table).getAllByRole('button', { name: /^Make a planned station/ })).toHaveLength(1);

    const code = within(table).getByRole('textbox', { name: /^Station id for the site at −34 km/ });
    await user.clear(code);
    await user.type(code, 'saltmarsh');
    await user.click(within(table).getByRole('button', { name: 'Make a planned station saltmarsh' }));
    await waitFor(() => expect(within(table).getByRole('status')).toHaveTextContent('Planned as saltmarsh'));
    const post = calls.find((c) => c.method === 'POST');
    expect(post?.url).toBe('/api/events/event-1/stations');
    expect(post?.body).toEqual({
      code: 'saltmarsh',
      latDeg: 9.7412,
      lonDeg: 62.3055,
      heightM: 0,
      status: 'planned',
      observerId: null,
    });
  });

  it('PlacementPanel refuses a count or a region the route would refuse, on their fields, without asking', async () => {
    const user = userEvent.setup();
    const calls = stubFetch(() => jsonResponse(200, testPlacement()));
    renderWithProviders(<PlacementPanel eventId="event-1" />);
    const sites = screen.getByRole('textbox', { name: /How many more sites/ });
    await user.clear(sites);
    await user.type(sites, '0');
    await user.type(screen.getByRole('textbox', { name: 'Latitude from (°)' }), '5');
    await user.click(screen.getByRole('button', { name: 'Suggest sites' }));
    expect(await screen.findByText('sites must be at least 1')).toBeVisible();
    expect(screen.getByText('give all four bounds of the region, or none')).toBeVisible();
    expect(calls).toEqual([]);
  });

  it('PlacementPanel shows the server’s refusal of the region on the region', async () => {
    const user = userEvent.setup();
    stubFetch(() =>
      jsonResponse(400, {
        message: 'Invalid query',
        issues: [{ path: 'region', message: 'latMin must be below latMax' }],
      }),
    );
    renderWithProviders(<PlacementPanel eventId="event-1" />);
    for (const [name, value] of [
      ['Latitude from (°)', '15'],
      ['Latitude to (°)', '25'],
      ['Longitude from (°, east positive)', '170'],
      ['Longitude to (°, east positive)', '-170'],
    ] as const)
      await user.type(screen.getByRole('textbox', { name }), value);
    await user.click(screen.getByRole('button', { name: 'Suggest sites' }));
    expect(await screen.findByText('latMin must be below latMax')).toBeVisible();
  });
});
