import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { InvitationView, MemberView } from '@limbus/schema/views';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { TeamPage, type TeamPageProps } from './team-page';
import { jsonResponse, renderWithProviders, stubFetch, type RecordedCall } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

const TEAM = '/api/teams/t1';

const MEMBERS: MemberView[] = [
  {
    userId: 'u-coord',
    name: 'Tomas Reyne',
    email: 'coordinator@example.org',
    roles: ['coordinator'],
    joinedAt: '2029-01-02T10:00:00.000Z',
  },
  {
    userId: 'u-obs',
    name: 'Ilse Darrow',
    email: 'observer@example.org',
    roles: ['observer', 'reviewer'],
    joinedAt: '2029-01-03T10:00:00.000Z',
  },
];

function invitation(overrides: Partial<InvitationView> = {}): InvitationView {
  return {
    id: 'i1',
    email: 'wren.tallis@example.org',
    roles: ['observer', 'reviewer'],
    invitedBy: { id: 'u-coord', name: 'Tomas Reyne' },
    createdAt: '2029-09-07T21:38:00.000Z',
    lastSentAt: '2029-09-07T21:38:00.000Z',
    expiresAt: '2029-09-14T21:38:00.000Z',
    expired: false,
    ...overrides,
  };
}

function renderPage(overrides: Partial<TeamPageProps> = {}) {
  return renderWithProviders(
    <TeamPage
      teamId="t1"
      teamName="Outer Belt Timing Group"
      canManage
      currentUserId="u-coord"
      onOwnMembershipChanged={vi.fn()}
      {...overrides}
    />,
  );
}

/** The server's answers by method and path; anything else is a 404 the test will notice. */
function stubTeam(routes: Record<string, (call: RecordedCall) => Response>): RecordedCall[] {
  return stubFetch((call) => {
    const handler = routes[`${call.method} ${call.url}`];
    return handler
      ? handler(call)
      : jsonResponse(404, { statusCode: 404, message: `no stub for ${call.url}` });
  });
}

describe('TeamPage', () => {
  it('TeamPage lists the members with e-mail and roles, and an observer sees no invite controls', async () => {
    const calls = stubTeam({ [`GET ${TEAM}/members`]: () => jsonResponse(200, MEMBERS) });
    renderPage({ canManage: false, currentUserId: 'u-obs' });
    const table = await screen.findByRole('table', { name: 'Members of Outer Belt Timing Group' });
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(3);
    expect(rows[1]).toHaveTextContent('Tomas Reyne');
    expect(rows[1]).toHaveTextContent('coordinator@example.org');
    expect(rows[2]).toHaveTextContent('Ilse Darrow (you)');
    expect(rows[2]).toHaveTextContent('observer, reviewer');
    expect(screen.queryByRole('textbox', { name: /E-mail/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Send invitation' })).not.toBeInTheDocument();
    expect(screen.queryByRole('checkbox')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /^Remove/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('table', { name: 'Pending invitations' })).not.toBeInTheDocument();
    expect(calls.map((c) => `${c.method} ${c.url}`)).toEqual([`GET ${TEAM}/members`]);
  });

  it('TeamPage lets a coordinator invite with two roles and then lists the pending invitation', async () => {
    let invitations: InvitationView[] = [];
    const calls = stubTeam({
      [`GET ${TEAM}/members`]: () => jsonResponse(200, MEMBERS),
      [`GET ${TEAM}/invitations`]: () => jsonResponse(200, invitations),
      [`POST ${TEAM}/invitations`]: () => {
        invitations = [invitation()];
        return jsonResponse(201, { id: 'i1' });
      },
    });
    const user = userEvent.setup();
    renderPage();
    expect(await screen.findByText(/No open invitations/)).toBeInTheDocument();
    await user.type(screen.getByRole('textbox', { name: /E-mail/ }), 'Wren.Tallis@example.org');
    const roles = screen.getByRole('group', { name: 'Roles' });
    expect(within(roles).getByRole('checkbox', { name: 'observer' })).toBeChecked();
    await user.click(within(roles).getByRole('checkbox', { name: 'reviewer' }));
    await user.click(screen.getByRole('button', { name: 'Send invitation' }));

    expect(await screen.findByRole('status')).toHaveTextContent('Invitation sent to wren.tallis@example.org');
    expect(calls.find((c) => c.method === 'POST')?.body).toEqual({
      email: 'wren.tallis@example.org',
      roles: ['observer', 'reviewer'],
    });
    const pending = await screen.findByRole('table', { name: 'Pending invitations' });
    const row = within(pending).getAllByRole('row')[1];
    expect(row).toHaveTextContent('wren.tallis@example.org');
    expect(row).toHaveTextContent('observer, reviewer');
    expect(row).toHaveTextContent('Tomas Reyne');
    expect(row).toHaveTextContent('2029-09-07 21:38:00 UTC');
    expect(row).toHaveTextContent('2029-09-14 21:38:00 UTC');
    expect(within(row as HTMLElement).queryByText('expired')).not.toBeInTheDocument();
  });

  it("TeamPage shows the server's 409 on the e-mail field and keeps what was typed", async () => {
    const message = 'observer@example.org is already a member (observer, reviewer)';
    stubTeam({
      [`GET ${TEAM}/members`]: () => jsonResponse(200, MEMBERS),
      [`GET ${TEAM}/invitations`]: () => jsonResponse(200, []),
      [`POST ${TEAM}/invitations`]: () => jsonResponse(409, { statusCode: 409, message }),
    });
    const user = userEvent.setup();
    renderPage();
    const email = await screen.findByRole('textbox', { name: /E-mail/ });
    await user.type(email, 'observer@example.org');
    const roles = screen.getByRole('group', { name: 'Roles' });
    await user.click(within(roles).getByRole('checkbox', { name: 'modeller' }));
    await user.click(screen.getByRole('button', { name: 'Send invitation' }));
    await waitFor(() => expect(email).toHaveAccessibleDescription(message));
    expect(email).toHaveValue('observer@example.org');
    expect(within(roles).getByRole('checkbox', { name: 'observer' })).toBeChecked();
    expect(within(roles).getByRole('checkbox', { name: 'modeller' })).toBeChecked();
  });

  it('TeamPage refuses an invitation without a role before asking the server', async () => {
    const calls = stubTeam({
      [`GET ${TEAM}/members`]: () => jsonResponse(200, MEMBERS),
      [`GET ${TEAM}/invitations`]: () => jsonResponse(200, []),
    });
    const user = userEvent.setup();
    renderPage();
    await user.type(await screen.findByRole('textbox', { name: /E-mail/ }), 'someone@example.org');
    await user.click(
      within(screen.getByRole('group', { name: 'Roles' })).getByRole('checkbox', { name: 'observer' }),
    );
    await user.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect(await screen.findByText('choose at least one role')).toBeInTheDocument();
    expect(calls.filter((c) => c.method === 'POST')).toEqual([]);
  });

  it('TeamPage resends and revokes an invitation through their routes, each after confirming', async () => {
    const calls = stubTeam({
      [`GET ${TEAM}/members`]: () => jsonResponse(200, MEMBERS),
      [`GET ${TEAM}/invitations`]: () => jsonResponse(200, [invitation({ expired: true })]),
      [`POST ${TEAM}/invitations/i1/resend`]: () => jsonResponse(200, invitation()),
      [`DELETE ${TEAM}/invitations/i1`]: () => new Response(null, { status: 204 }),
    });
    const user = userEvent.setup();
    renderPage();
    const pending = await screen.findByRole('table', { name: 'Pending invitations' });
    expect(within(pending).getByText('expired')).toBeInTheDocument();

    await user.click(
      screen.getByRole('button', { name: 'Resend the invitation to wren.tallis@example.org' }),
    );
    const resendDialog = await screen.findByRole('alertdialog', {
      name: 'Resend the invitation to wren.tallis@example.org?',
    });
    expect(calls.some((c) => c.url.endsWith('/resend'))).toBe(false);
    await user.click(within(resendDialog).getByRole('button', { name: 'Resend' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());

    await user.click(
      screen.getByRole('button', { name: 'Revoke the invitation to wren.tallis@example.org' }),
    );
    const revokeDialog = await screen.findByRole('alertdialog', {
      name: 'Revoke the invitation to wren.tallis@example.org?',
    });
    await user.click(within(revokeDialog).getByRole('button', { name: 'Revoke' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());

    expect(calls.filter((c) => c.method !== 'GET').map((c) => `${c.method} ${c.url}`)).toEqual([
      `POST ${TEAM}/invitations/i1/resend`,
      `DELETE ${TEAM}/invitations/i1`,
    ]);
  });

  it("TeamPage saves a member's roles and shows the last-coordinator 409 on that member's row", async () => {
    const message = 'The team would be left without a coordinator';
    const onOwnMembershipChanged = vi.fn();
    const calls = stubTeam({
      [`GET ${TEAM}/members`]: () => jsonResponse(200, MEMBERS),
      [`GET ${TEAM}/invitations`]: () => jsonResponse(200, []),
      [`PATCH ${TEAM}/members/u-coord`]: () => jsonResponse(409, { statusCode: 409, message }),
      [`PATCH ${TEAM}/members/u-obs`]: () => jsonResponse(200, { ...MEMBERS[1], roles: ['observer'] }),
    });
    const user = userEvent.setup();
    renderPage({ onOwnMembershipChanged });

    const own = await screen.findByRole('group', { name: 'Roles of Tomas Reyne' });
    const save = screen.getByRole('button', { name: 'Save roles of Tomas Reyne' });
    expect(save).toBeDisabled();
    await user.click(within(own).getByRole('checkbox', { name: 'coordinator' }));
    await user.click(within(own).getByRole('checkbox', { name: 'modeller' }));
    await user.click(save);
    const row = screen.getByRole('row', { name: /Tomas Reyne/ });
    expect(await within(row).findByRole('alert')).toHaveTextContent(message);
    expect(screen.getByRole('row', { name: /Ilse Darrow/ })).not.toHaveTextContent(message);
    expect(onOwnMembershipChanged).not.toHaveBeenCalled();

    const other = screen.getByRole('group', { name: 'Roles of Ilse Darrow' });
    await user.click(within(other).getByRole('checkbox', { name: 'reviewer' }));
    await user.click(screen.getByRole('button', { name: 'Save roles of Ilse Darrow' }));
    await waitFor(() =>
      expect(calls.filter((c) => c.method === 'PATCH').map((c) => [c.url, c.body])).toEqual([
        [`${TEAM}/members/u-coord`, { roles: ['modeller'] }],
        [`${TEAM}/members/u-obs`, { roles: ['observer'] }],
      ]),
    );
  });

  it('TeamPage removes a member after a confirmation that names them, and shows a refusal there', async () => {
    const message = 'Tomas Reyne is the last coordinator of the team';
    const calls = stubTeam({
      [`GET ${TEAM}/members`]: () => jsonResponse(200, MEMBERS),
      [`GET ${TEAM}/invitations`]: () => jsonResponse(200, []),
      [`DELETE ${TEAM}/members/u-coord`]: () => jsonResponse(409, { statusCode: 409, message }),
      [`DELETE ${TEAM}/members/u-obs`]: () => new Response(null, { status: 204 }),
    });
    const user = userEvent.setup();
    renderPage();

    await user.click(await screen.findByRole('button', { name: 'Remove Tomas Reyne' }));
    const refused = await screen.findByRole('alertdialog', {
      name: 'Remove Tomas Reyne from Outer Belt Timing Group?',
    });
    await user.click(within(refused).getByRole('button', { name: 'Remove' }));
    expect(await within(refused).findByRole('alert')).toHaveTextContent(message);
    await user.click(within(refused).getByRole('button', { name: 'Cancel' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());

    await user.click(screen.getByRole('button', { name: 'Remove Ilse Darrow' }));
    const dialog = await screen.findByRole('alertdialog', {
      name: 'Remove Ilse Darrow from Outer Belt Timing Group?',
    });
    expect(dialog).toHaveTextContent('observer@example.org');
    await user.click(within(dialog).getByRole('button', { name: 'Remove' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).not.toBeInTheDocument());
    expect(calls.filter((c) => c.method === 'DELETE').map((c) => c.url)).toEqual([
      `${TEAM}/members/u-coord`,
      `${TEAM}/members/u-obs`,
    ]);
  });
});
