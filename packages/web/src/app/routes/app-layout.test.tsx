import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { Route, Routes } from 'react-router-dom';
import { AppLayout } from './app-layout';
import { paths } from '@/config/paths';
import { forgetSessionHint, setAccessToken } from '@/lib/api-client';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => {
  vi.unstubAllGlobals();
  forgetSessionHint();
});

const ME = {
  id: 'u1',
  email: 'observer@example.org',
  name: 'Ilse Marwood',
  isAdmin: false,
  teams: [{ id: 't1', name: 'Outer Belt Timing Group', roles: ['observer'] }],
  noticeOptOuts: [],
};

function renderLayout() {
  return renderWithProviders(
    <Routes>
      <Route element={<AppLayout />}>
        <Route path="/" element={<p>Inside</p>} />
      </Route>
      <Route path={paths.signIn} element={<p>Sign-in page</p>} />
    </Routes>,
  );
}

describe('AppLayout', () => {
  it('AppLayout signing out goes to the sign-in page without asking for the account again', async () => {
    const calls = stubFetch(({ url }) => {
      if (url === '/api/me') return jsonResponse(200, ME);
      if (url === '/api/auth/logout') return new Response(null, { status: 204 });
      return jsonResponse(404, { statusCode: 404, message: `no stub for ${url}` });
    });
    renderLayout();
    await screen.findByText('Inside');
    await userEvent.setup().click(screen.getByRole('button', { name: 'Sign out' }));
    await screen.findByText('Sign-in page');
    // Give a stray refetch the time it would need to reach fetch.
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(calls.map((c) => c.url)).toEqual(['/api/me', '/api/auth/logout']);
  });

  it('AppLayout offers Events, Bodies and Team, the Outbox to admins only, and the account page', async () => {
    let me = ME;
    stubFetch(() => jsonResponse(200, me));
    const first = renderLayout();
    const nav = await screen.findByRole('navigation', { name: 'Main' });
    expect(
      within(nav)
        .getAllByRole('link')
        .map((link) => link.textContent),
    ).toEqual(['Events', 'Bodies', 'Team']);
    expect(within(screen.getByRole('banner')).getByRole('link', { name: 'Account' })).toHaveAttribute(
      'href',
      paths.account,
    );
    first.unmount();

    me = { ...ME, isAdmin: true };
    renderLayout();
    const adminNav = await screen.findByRole('navigation', { name: 'Main' });
    expect(
      within(adminNav)
        .getAllByRole('link')
        .map((link) => link.textContent),
    ).toEqual(['Events', 'Bodies', 'Team', 'Outbox']);
  });

  it('AppLayout sends a signed-out visitor to the sign-in page without asking the server', async () => {
    setAccessToken(null);
    const calls = stubFetch(() => jsonResponse(401, { statusCode: 401, message: 'Unauthorized' }));
    renderLayout();
    await screen.findByText('Sign-in page');
    expect(calls).toEqual([]);
  });

  it('AppLayout after a reload refreshes the session first and then loads the account', async () => {
    setAccessToken(null);
    document.cookie = 'limbus_session=1; Path=/';
    const calls = stubFetch(({ url }) => {
      if (url === '/api/auth/refresh') return jsonResponse(200, { accessToken: 'restored' });
      if (url === '/api/me') return jsonResponse(200, ME);
      return jsonResponse(404, { statusCode: 404, message: `no stub for ${url}` });
    });
    renderLayout();
    await screen.findByText('Inside');
    expect(calls.map((c) => `${c.method} ${c.url} ${c.authorization ?? '-'}`)).toEqual([
      'POST /api/auth/refresh -',
      'GET /api/me Bearer restored',
    ]);
  });
});
