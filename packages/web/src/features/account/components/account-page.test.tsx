import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { NOTICE_KIND_LABELS, NOTICE_KINDS } from '@limbus/schema/team';
import type { MeView } from '@limbus/schema/views';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { AccountPage } from './account-page';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

const ME: MeView = {
  id: 'u1',
  email: 'coordinator@example.org',
  name: 'Tomas Reyne',
  isAdmin: false,
  teams: [{ id: 't1', name: 'Outer Belt Timing Group', roles: ['coordinator', 'reviewer'] }],
  noticeOptOuts: ['fit-finished'],
};

describe('AccountPage', () => {
  it('AccountPage shows the name, address, teams and roles, and which notices are received', () => {
    stubFetch(() => jsonResponse(500, {}));
    renderWithProviders(<AccountPage me={ME} onSaved={vi.fn()} />);
    expect(screen.getByText(/Tomas Reyne · coordinator@example.org/)).toBeInTheDocument();
    const teams = screen.getByRole('table', { name: 'Your teams' });
    expect(within(teams).getByRole('row', { name: /Outer Belt Timing Group/ })).toHaveTextContent(
      'coordinator, reviewer',
    );
    const notices = screen.getByRole('group', { name: 'Send me an e-mail when' });
    expect(within(notices).getAllByRole('checkbox')).toHaveLength(NOTICE_KINDS.length);
    expect(
      within(notices).getByRole('checkbox', { name: NOTICE_KIND_LABELS['fit-finished'] }),
    ).not.toBeChecked();
    expect(
      within(notices).getByRole('checkbox', { name: NOTICE_KIND_LABELS['report-decided'] }),
    ).toBeChecked();
    expect(screen.getByText(/Invitations and password-reset links are always sent/)).toBeInTheDocument();
  });

  it('AccountPage sends the unticked kinds as the opt-out list and says when they are saved', async () => {
    const saved: MeView = { ...ME, noticeOptOuts: ['fit-finished', 'report-decided'] };
    const calls = stubFetch(() => jsonResponse(200, saved));
    const onSaved = vi.fn();
    const user = userEvent.setup();
    renderWithProviders(<AccountPage me={ME} onSaved={onSaved} />);
    await user.click(screen.getByRole('checkbox', { name: NOTICE_KIND_LABELS['report-decided'] }));
    await user.click(screen.getByRole('button', { name: 'Save notice settings' }));
    expect(await screen.findByRole('status')).toHaveTextContent('Notice settings saved.');
    expect(calls.map((c) => [c.method, c.url, c.body])).toEqual([
      ['PUT', '/api/me/notices', { optOut: ['fit-finished', 'report-decided'] }],
    ]);
    expect(onSaved).toHaveBeenCalledWith(saved);
  });

  it('AccountPage sends an empty opt-out list when every notice is ticked again', async () => {
    const calls = stubFetch(() => jsonResponse(200, { ...ME, noticeOptOuts: [] }));
    const user = userEvent.setup();
    renderWithProviders(<AccountPage me={ME} onSaved={vi.fn()} />);
    await user.click(screen.getByRole('checkbox', { name: NOTICE_KIND_LABELS['fit-finished'] }));
    await user.click(screen.getByRole('button', { name: 'Save notice settings' }));
    await screen.findByRole('status');
    expect(calls.map((c) => c.body)).toEqual([{ optOut: [] }]);
  });
});
