import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { ProposalsList } from './proposals-list';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

const sites = [
  {
    id: 'st-9',
    code: 'hollowmere',
    latDeg: 10.45,
    lonDeg: 62.8,
    heightM: 230,
    observerName: 'Ilse Darrow',
    notes: 'Farm track; the owner agreed.',
  },
];

describe('ProposalsList', () => {
  it('ProposalsList accepts a proposed site as planned', async () => {
    const user = userEvent.setup();
    const calls = stubFetch(() => jsonResponse(200, {}));
    renderWithProviders(<ProposalsList eventId="event-1" sites={sites} />);
    const row = screen.getByRole('row', { name: /hollowmere/ });
    expect(row).toHaveTextContent('Farm track; the owner agreed.');
    await user.click(within(row).getByRole('button', { name: 'Accept hollowmere' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]).toMatchObject({
      url: '/api/events/event-1/site-proposals/st-9/accept',
      method: 'POST',
      body: { status: 'planned' },
    });
  });

  it('ProposalsList declines a proposed site with its reason after a confirmation', async () => {
    const user = userEvent.setup();
    const calls = stubFetch(() => jsonResponse(200, {}));
    renderWithProviders(<ProposalsList eventId="event-1" sites={sites} />);
    await user.type(
      screen.getByRole('textbox', { name: 'Reason if declined (hollowmere)' }),
      'Too close to amberfield',
    );
    await user.click(screen.getByRole('button', { name: 'Decline hollowmere' }));
    const dialog = await screen.findByRole('alertdialog', { name: 'Decline the site hollowmere?' });
    expect(dialog).toHaveTextContent('with the reason “Too close to amberfield”');
    expect(calls).toEqual([]);
    await user.click(within(dialog).getByRole('button', { name: 'Decline' }));
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0]).toMatchObject({
      url: '/api/events/event-1/site-proposals/st-9/decline',
      body: { reason: 'Too close to amberfield' },
    });
  });

  it('ProposalsList says when nothing waits', () => {
    renderWithProviders(<ProposalsList eventId="event-1" sites={[]} />);
    expect(screen.getByText('No site is waiting for a decision.')).toBeVisible();
  });
});
