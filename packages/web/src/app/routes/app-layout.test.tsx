import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { Route, Routes } from 'react-router-dom';
import { AppLayout } from './app-layout';
import { paths } from '@/config/paths';
import { jsonResponse, renderWithProviders, stubFetch } from '@/testing/test-utils';

afterEach(() => vi.unstubAllGlobals());

const ME = {
  id: 'u1',
  email: 'observer@example.org',
  name: 'Ilse Marwood',
  isAdmin: false,
  teams: [{ id: 't1', name: 'Outer Belt Timing Group', roles: ['observer'] }],
};

describe('AppLayout', () => {
  it('signing out goes to the sign-in page without asking for the account again', async () => {
    const calls = stubFetch(({ url }) => {
      if (url === '/api/me') return jsonResponse(200, ME);
      if (url === '/api/auth/logout') return new Response(null, { status: 204 });
      return jsonResponse(404, { statusCode: 404, message: `no stub for ${url}` });
    });
    renderWithProviders(
      <Routes>
        <Route element={<AppLayout />}>
          <Route path="/" element={<p>Inside</p>} />
        </Route>
        <Route path={paths.signIn} element={<p>Sign-in page</p>} />
      </Routes>,
    );
    await screen.findByText('Inside');
    await userEvent.setup().click(screen.getByRole('button', { name: 'Sign out' }));
    await screen.findByText('Sign-in page');
    // Give a stray refetch the time it would need to reach fetch.
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(calls.map((c) => c.url)).toEqual(['/api/me', '/api/auth/logout']);
  });
});
