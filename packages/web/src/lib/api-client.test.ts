import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import {
  ApiError,
  apiBlob,
  apiRequest,
  forgetSessionHint,
  hasAccessToken,
  hasSessionHint,
  setAccessToken,
} from './api-client';
import { z } from 'zod';
import { jsonResponse, stubFetch } from '@/testing/test-utils';

const meSchema = z.object({ name: z.string() });

// Every case here starts signed out (vitest.setup.ts signs component tests in) and sets what it needs.
beforeEach(() => setAccessToken(null));

afterEach(() => {
  vi.unstubAllGlobals();
  setAccessToken(null);
  forgetSessionHint();
});

/** What the server sets beside the refresh cookie at sign-in (readable by the page, no secret). */
function setSessionHint(): void {
  document.cookie = 'limbus_session=1; Path=/; SameSite=Strict';
}

describe('apiRequest', () => {
  it('apiRequest() sends the in-memory access token as a bearer token', async () => {
    setAccessToken('token-a');
    const calls = stubFetch(() => jsonResponse(200, { name: 'Ilse Darrow' }));
    await expect(apiRequest('/api/me', { schema: meSchema })).resolves.toEqual({ name: 'Ilse Darrow' });
    expect(calls.map((c) => c.authorization)).toEqual(['Bearer token-a']);
  });

  it('apiRequest() refreshes once on 401 and retries with the new token', async () => {
    setAccessToken('expired');
    const calls = stubFetch((call) => {
      if (call.url === '/api/auth/refresh') return jsonResponse(200, { accessToken: 'fresh', user: {} });
      return call.authorization === 'Bearer fresh'
        ? jsonResponse(200, { name: 'Noor Calder' })
        : jsonResponse(401, { statusCode: 401, message: 'Unauthorized' });
    });
    await expect(apiRequest('/api/me', { schema: meSchema })).resolves.toEqual({ name: 'Noor Calder' });
    expect(calls.map((c) => `${c.method} ${c.url} ${c.authorization ?? '-'}`)).toEqual([
      'GET /api/me Bearer expired',
      'POST /api/auth/refresh Bearer expired',
      'GET /api/me Bearer fresh',
    ]);
  });

  it('apiRequest() shares one refresh between concurrent 401s', async () => {
    setAccessToken('expired');
    const calls = stubFetch((call) => {
      if (call.url === '/api/auth/refresh') return jsonResponse(200, { accessToken: 'fresh' });
      return call.authorization === 'Bearer fresh'
        ? jsonResponse(200, { name: 'x' })
        : jsonResponse(401, { message: 'Unauthorized' });
    });
    await Promise.all([
      apiRequest('/api/me', { schema: meSchema }),
      apiRequest('/api/teams', { schema: meSchema }),
    ]);
    expect(calls.filter((c) => c.url === '/api/auth/refresh')).toHaveLength(1);
  });

  it('apiRequest() gives up after a failed refresh, drops the token and reports 401', async () => {
    setAccessToken('expired');
    const calls = stubFetch(() => jsonResponse(401, { statusCode: 401, message: 'Unauthorized' }));
    const error = await apiRequest('/api/me', { schema: meSchema }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect((error as ApiError).status).toBe(401);
    expect(calls.map((c) => c.url)).toEqual(['/api/me', '/api/auth/refresh']);
    expect(hasAccessToken()).toBe(false);
  });

  it('apiRequest() sends nothing without a token or session cookie and answers 401 itself', async () => {
    const calls = stubFetch(() => jsonResponse(200, { name: 'nobody' }));
    const error = await apiRequest('/api/me', { schema: meSchema }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 401, message: 'Sign-in required' });
    await expect(apiBlob('/api/fits/f1/figure')).rejects.toMatchObject({ status: 401 });
    expect(calls).toEqual([]);
  });

  it('apiRequest() with the session cookie but no token refreshes first, then sends', async () => {
    setSessionHint();
    const calls = stubFetch((call) =>
      call.url === '/api/auth/refresh'
        ? jsonResponse(200, { accessToken: 'restored' })
        : jsonResponse(200, { name: 'Ilse Darrow' }),
    );
    await expect(apiRequest('/api/me', { schema: meSchema })).resolves.toEqual({ name: 'Ilse Darrow' });
    expect(calls.map((c) => `${c.method} ${c.url} ${c.authorization ?? '-'}`)).toEqual([
      'POST /api/auth/refresh -',
      'GET /api/me Bearer restored',
    ]);
  });

  it('apiRequest() with a stale session cookie stops after the refused refresh', async () => {
    setSessionHint();
    const calls = stubFetch(() => jsonResponse(401, { statusCode: 401, message: 'Unauthorized' }));
    await expect(apiRequest('/api/me', { schema: meSchema })).rejects.toMatchObject({
      status: 401,
      message: 'Sign-in required',
    });
    expect(calls.map((c) => c.url)).toEqual(['/api/auth/refresh']);
  });

  it('apiRequest() sends an anonymous request without a session and does not refresh on its 401', async () => {
    const calls = stubFetch(() =>
      jsonResponse(401, { statusCode: 401, message: 'Wrong e-mail or password' }),
    );
    await expect(
      apiRequest('/api/auth/login', {
        method: 'POST',
        body: { email: 'a@b.c', password: 'x' },
        anonymous: true,
      }),
    ).rejects.toThrow('Wrong e-mail or password');
    expect(calls.map((c) => `${c.url} ${c.authorization ?? '-'}`)).toEqual(['/api/auth/login -']);
  });

  it('forgetSessionHint() removes the session cookie', () => {
    setSessionHint();
    expect(hasSessionHint()).toBe(true);
    forgetSessionHint();
    expect(hasSessionHint()).toBe(false);
  });

  it('apiRequest() turns error JSON into an ApiError with status, message and path-named issues', async () => {
    stubFetch(() =>
      jsonResponse(400, {
        statusCode: 400,
        error: 'Bad Request',
        message: 'Validation failed',
        issues: [{ path: 'password', message: 'Too short' }],
      }),
    );
    const error = await apiRequest('/api/auth/password-reset/confirm', {
      method: 'POST',
      body: {},
      anonymous: true,
    }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 400,
      message: 'Validation failed',
      issues: [{ path: 'password', message: 'Too short' }],
    });
  });

  it('apiRequest() reports a non-JSON failure by its status', async () => {
    setAccessToken('token-a');
    stubFetch(() => new Response('<html>Bad gateway</html>', { status: 502, statusText: 'Bad Gateway' }));
    await expect(apiRequest('/api/me')).rejects.toMatchObject({
      status: 502,
      message: 'Request failed (502 Bad Gateway)',
    });
  });

  it('apiRequest() rejects a response that does not match the schema', async () => {
    setAccessToken('token-a');
    stubFetch(() => jsonResponse(200, { name: 42 }));
    await expect(apiRequest('/api/me', { schema: meSchema })).rejects.toThrow(
      /Unexpected response from GET \/api\/me/,
    );
  });
});
