import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { PublicInvitationView } from '@limbus/schema/views';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { AcceptInvitation, rolesText } from './accept-invitation';
import { setAccessToken } from '@/lib/api-client';
import { jsonResponse, renderWithProviders, stubFetch, type RecordedCall } from '@/testing/test-utils';

// Someone opening an e-mailed link is usually signed out.
beforeEach(() => setAccessToken(null));
afterEach(() => vi.unstubAllGlobals());

const INVITATION: PublicInvitationView = {
  email: 'wren.tallis@example.org',
  teamName: 'Outer Belt Timing Group',
  roles: ['observer', 'reviewer'],
  role: 'observer',
  expiresAt: '2029-09-14T21:38:00.000Z',
  existingAccount: false,
};

function stubInvitation(
  invitation: PublicInvitationView,
  accept: (call: RecordedCall) => Response = () => jsonResponse(200, { accessToken: 'new-session' }),
): RecordedCall[] {
  return stubFetch((call) =>
    call.url === '/api/invitations/tok-1/accept' ? accept(call) : jsonResponse(200, invitation),
  );
}

describe('AcceptInvitation', () => {
  it('AcceptInvitation names the team, every role and the expiry in UTC, and asks a new address for name and password', async () => {
    const calls = stubInvitation(INVITATION);
    const onAccepted = vi.fn();
    const user = userEvent.setup();
    renderWithProviders(<AcceptInvitation token="tok-1" onAccepted={onAccepted} />);
    expect(await screen.findByRole('form', { name: 'Accept the invitation' })).toHaveTextContent(
      'You are invited to join Outer Belt Timing Group as observer and reviewer with the address ' +
        'wren.tallis@example.org. The invitation expires 2029-09-14 21:38:00 UTC.',
    );
    await user.click(screen.getByRole('button', { name: 'Join Outer Belt Timing Group' }));
    expect(await screen.findByText('name must not be empty')).toBeInTheDocument();
    await user.type(screen.getByRole('textbox', { name: /Your name/ }), 'Wren Tallis');
    await user.type(screen.getByLabelText(/^Password/), 'first-password-1');
    await user.click(screen.getByRole('button', { name: 'Join Outer Belt Timing Group' }));
    await waitFor(() => expect(onAccepted).toHaveBeenCalledTimes(1));
    expect(calls.map((c) => [c.method, c.url, c.authorization, c.body])).toEqual([
      ['GET', '/api/invitations/tok-1', null, undefined],
      ['POST', '/api/invitations/tok-1/accept', null, { name: 'Wren Tallis', password: 'first-password-1' }],
    ]);
  });

  it('AcceptInvitation asks an existing account only for its password', async () => {
    const calls = stubInvitation({ ...INVITATION, existingAccount: true });
    const onAccepted = vi.fn();
    const user = userEvent.setup();
    renderWithProviders(<AcceptInvitation token="tok-1" onAccepted={onAccepted} />);
    expect(
      await screen.findByText('You already have an account: enter its password to join.'),
    ).toBeInTheDocument();
    expect(screen.queryByRole('textbox', { name: /Your name/ })).not.toBeInTheDocument();
    await user.type(screen.getByLabelText(/^Password of your account/), 'limbus-demo');
    await user.click(screen.getByRole('button', { name: 'Join Outer Belt Timing Group' }));
    await waitFor(() => expect(onAccepted).toHaveBeenCalledTimes(1));
    expect(calls[1]?.body).toEqual({ password: 'limbus-demo' });
  });

  it("AcceptInvitation shows an existing account's refused password on the password field", async () => {
    const message = 'This address already has an account: enter its current password';
    stubInvitation({ ...INVITATION, existingAccount: true }, () =>
      jsonResponse(401, { statusCode: 401, message }),
    );
    const onAccepted = vi.fn();
    const user = userEvent.setup();
    renderWithProviders(<AcceptInvitation token="tok-1" onAccepted={onAccepted} />);
    const password = await screen.findByLabelText(/^Password of your account/);
    await user.type(password, 'not-the-password');
    await user.click(screen.getByRole('button', { name: 'Join Outer Belt Timing Group' }));
    await waitFor(() => expect(password).toHaveAccessibleDescription(message));
    expect(onAccepted).not.toHaveBeenCalled();
  });
});

describe('rolesText', () => {
  it('rolesText() lists one, two or more roles as a sentence would', () => {
    expect(rolesText(['observer'])).toBe('observer');
    expect(rolesText(['observer', 'reviewer'])).toBe('observer and reviewer');
    expect(rolesText(['coordinator', 'observer', 'reviewer'])).toBe('coordinator, observer and reviewer');
  });
});
