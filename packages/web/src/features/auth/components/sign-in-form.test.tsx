import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { SignInForm } from './sign-in-form';
import { hasAccessToken, setAccessToken } from '@/lib/api-client';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

// The sign-in page is seen signed out.
beforeEach(() => setAccessToken(null));

afterEach(() => {
  vi.unstubAllGlobals();
  setAccessToken(null);
});

async function fillAndSubmit(email: string, password: string) {
  const user = userEvent.setup();
  await user.type(screen.getByRole('textbox', { name: /e-mail/i }), email);
  await user.type(screen.getByLabelText(/password/i), password);
  await user.click(screen.getByRole('button', { name: 'Sign in' }));
}

describe('SignInForm', () => {
  it('SignInForm submits e-mail and password, keeps the token and reports success', async () => {
    const calls = stubFetch(() =>
      jsonResponse(200, { accessToken: 'token-1', user: { id: 'u1', name: 'Tomas Reyne' } }),
    );
    const onSignedIn = vi.fn();
    renderWithProviders(<SignInForm onSignedIn={onSignedIn} />);
    await fillAndSubmit('coordinator@example.org', 'limbus-demo');
    await waitFor(() => expect(onSignedIn).toHaveBeenCalledTimes(1));
    expect(calls).toEqual([
      expect.objectContaining({
        url: '/api/auth/login',
        method: 'POST',
        body: { email: 'coordinator@example.org', password: 'limbus-demo' },
      }),
    ]);
    expect(hasAccessToken()).toBe(true);
  });

  it("SignInForm shows the server's message when the password is wrong", async () => {
    stubFetch(() =>
      jsonResponse(401, { statusCode: 401, error: 'Unauthorized', message: 'Wrong e-mail or password' }),
    );
    const onSignedIn = vi.fn();
    renderWithProviders(<SignInForm onSignedIn={onSignedIn} />);
    await fillAndSubmit('coordinator@example.org', 'not-it');
    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Sign-in failed');
    expect(alert).toHaveTextContent('Wrong e-mail or password');
    expect(onSignedIn).not.toHaveBeenCalled();
    expect(hasAccessToken()).toBe(false);
  });

  it('SignInForm names the missing fields and sends nothing when they are empty', async () => {
    const calls = stubFetch(() => jsonResponse(500, {}));
    renderWithProviders(<SignInForm onSignedIn={vi.fn()} />);
    await userEvent.setup().click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter an e-mail address')).toBeInTheDocument();
    expect(screen.getByText('Enter your password')).toBeInTheDocument();
    expect(calls).toHaveLength(0);
  });
});
