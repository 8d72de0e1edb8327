import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import { SendBriefing } from './send-briefing';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

const stations = [
  { code: 'amberfield', observerId: 'u-1' },
  { code: 'brackenhill', observerId: 'u-2' },
  { code: 'cindervale', observerId: 'u-1' },
  { code: 'planned-1', observerId: null },
];

describe('SendBriefing', () => {
  it('SendBriefing names how many observers it reaches and sends only after the confirmation', async () => {
    const user = userEvent.setup();
    const calls = stubFetch(() =>
      jsonResponse(201, {
        sent: [
          { userId: 'u-1', name: 'Ilse Darrow', stations: ['amberfield', 'cindervale'] },
          { userId: 'u-2', name: 'Tomas Quell', stations: ['brackenhill'] },
        ],
        withoutObserver: ['planned-1'],
        failed: [],
      }),
    );
    renderWithProviders(<SendBriefing eventId="event-1" stations={stations} />);
    await user.click(screen.getByRole('button', { name: 'Send the briefing to every observer' }));
    const dialog = await screen.findByRole('alertdialog', { name: 'Send the briefing to 2 observers?' });
    expect(dialog).toHaveTextContent('1 station without an observer account (planned-1) gets none.');
    expect(calls).toEqual([]);
    await user.click(within(dialog).getByRole('button', { name: 'Send to 2 observers' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).toBeNull());
    expect(calls).toHaveLength(1);
    expect(calls[0]).toMatchObject({ url: '/api/events/event-1/briefings', method: 'POST' });
    expect(screen.queryByRole('alert')).toBeNull();
    expect(screen.getByRole('status')).toHaveTextContent(
      'Briefing sent to Ilse Darrow (amberfield, cindervale); Tomas Quell (brackenhill). Not reached, no observer account: planned-1.',
    );
  });

  it('SendBriefing sends nothing when the cancel is chosen, and offers nothing without observers', async () => {
    const user = userEvent.setup();
    const calls = stubFetch(() => jsonResponse(201, { sent: [], withoutObserver: [], failed: [] }));
    const { unmount } = renderWithProviders(<SendBriefing eventId="event-1" stations={stations} />);
    await user.click(screen.getByRole('button', { name: 'Send the briefing to every observer' }));
    await user.click(within(await screen.findByRole('alertdialog')).getByRole('button', { name: 'Cancel' }));
    expect(calls).toEqual([]);
    unmount();
    renderWithProviders(
      <SendBriefing eventId="event-1" stations={[{ code: 'planned-1', observerId: null }]} />,
    );
    expect(screen.queryByRole('button', { name: 'Send the briefing to every observer' })).toBeNull();
    expect(screen.getByText(/no briefing can be sent/)).toBeVisible();
  });

  it('SendBriefing names the observers whose e-mail the mail server refused', async () => {
    const user = userEvent.setup();
    stubFetch(() =>
      jsonResponse(201, {
        sent: [{ userId: 'u-2', name: 'Tomas Quell', stations: ['brackenhill'] }],
        withoutObserver: [],
        failed: [{ userId: 'u-1', name: 'Ilse Darrow', reason: 'mailbox unavailable' }],
      }),
    );
    renderWithProviders(<SendBriefing eventId="event-1" stations={stations} />);
    await user.click(screen.getByRole('button', { name: 'Send the briefing to every observer' }));
    await user.click(
      within(await screen.findByRole('alertdialog')).getByRole('button', { name: /^Send to/ }),
    );
    expect(await screen.findByRole('alert')).toHaveTextContent(
      'The mail server did not take the briefing of Ilse Darrow (mailbox unavailable): send it again later.',
    );
  });
});
