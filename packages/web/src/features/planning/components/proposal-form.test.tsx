import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { ProposalForm } from './proposal-form';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

async function fill(user: ReturnType<typeof userEvent.setup>, values: Record<string, string>) {
  for (const [name, value] of Object.entries(values)) {
    const box = screen.getByRole('textbox', { name: new RegExp(`^${name.replace(/[()]/g, '\\$&')}`) });
    await user.clear(box);
    await user.type(box, value);
  }
}

describe('ProposalForm', () => {
  it('ProposalForm sends an observer’s own site, with notes, and says it waits for a coordinator', async () => {
    const user = userEvent.setup();
    const calls = stubFetch(() => jsonResponse(201, { id: 'st-9' }));
    renderWithProviders(<ProposalForm eventId="event-1" />);
    await fill(user, {
      'Station id': 'hollowmere',
      'Latitude (°)': '10.45',
      'Longitude (°, east positive)': '62.8',
      'Height (m above the ellipsoid)': '230',
      Notes: 'Farm track; the owner agreed.',
    });
    await user.click(screen.getByRole('button', { name: 'Propose this site' }));
    await waitFor(() => expect(screen.getByText(/Proposed hollowmere/)).toBeVisible());
    expect(calls[0]).toMatchObject({
      url: '/api/events/event-1/site-proposals',
      method: 'POST',
      body: {
        code: 'hollowmere',
        latDeg: 10.45,
        lonDeg: 62.8,
        heightM: 230,
        notes: 'Farm track; the owner agreed.',
      },
    });
  });

  it('ProposalForm refuses a latitude beyond 90° on its field, and shows the server’s refusal on the station id, keeping what was typed', async () => {
    const user = userEvent.setup();
    const calls = stubFetch(() =>
      jsonResponse(400, {
        message: 'Invalid',
        issues: [{ path: 'code', message: 'station id already used in this event' }],
      }),
    );
    renderWithProviders(<ProposalForm eventId="event-1" />);
    await fill(user, {
      'Station id': 'amberfield',
      'Latitude (°)': '95',
      'Longitude (°, east positive)': '62.8',
      'Height (m above the ellipsoid)': '230',
    });
    await user.click(screen.getByRole('button', { name: 'Propose this site' }));
    expect(await screen.findByText('latitude must be within ±90°')).toBeVisible();
    expect(calls).toEqual([]);
    await fill(user, { 'Latitude (°)': '10.45' });
    await user.click(screen.getByRole('button', { name: 'Propose this site' }));
    expect(await screen.findByText('station id already used in this event')).toBeVisible();
    expect(screen.getByRole('textbox', { name: /^Station id/ })).toHaveValue('amberfield');
    expect(screen.queryByRole('alert', { name: /not proposed/ })).toBeNull();
  });
});
