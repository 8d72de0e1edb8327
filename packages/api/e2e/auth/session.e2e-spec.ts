import { createHmac } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RefreshToken } from '../../src/auth/entities/refresh-token.entity';
import { sha256Hex } from '../../src/common/tokens';
import { bootTestApp, type TestApp } from '../setup';

function refreshCookieOf(setCookie: string[] | string | undefined): string {
  const header = ([] as string[]).concat(setCookie ?? []).find((c) => c.startsWith('limbus_refresh='));
  if (!header) throw new Error('no limbus_refresh cookie');
  return header.split(';')[0] ?? '';
}

/** HS256 JWT signed by hand (RFC 7519 section 3.1 layout), so the test does not trust our own signer. */
function signJwt(claims: Record<string, unknown>, secret: string): string {
  const part = (value: object) => Buffer.from(JSON.stringify(value)).toString('base64url');
  const unsigned = `${part({ alg: 'HS256', typ: 'JWT' })}.${part(claims)}`;
  return `${unsigned}.${createHmac('sha256', secret).update(unsigned).digest('base64url')}`;
}

describe('access tokens', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp({ ACCESS_TOKEN_TTL_SECONDS: '3' });
  });
  afterAll(async () => {
    await t.close();
  });

  it('GET /api/me accepts a fresh token and refuses it once ACCESS_TOKEN_TTL_SECONDS has passed', async () => {
    const { email, password } = await t.createUser();
    const token = await t.signIn(email, password);
    await t.get('/api/me').set('Authorization', `Bearer ${token}`).expect(200);
    // JWT exp has one-second resolution: after 4.1 s a 3 s token is expired whatever the rounding. A 1 s
    // token could expire before the first call on a loaded machine (signed at x.9 s, checked at x+1.0 s).
    await new Promise((resolve) => setTimeout(resolve, 4100));
    const response = await t.get('/api/me').set('Authorization', `Bearer ${token}`).expect(401);
    expect(response.body.statusCode).toBe(401);
  });

  it('GET /api/me refuses a correctly signed token whose exp is in the past', async () => {
    const { user } = await t.createUser();
    const now = Math.floor(Date.now() / 1000);
    const valid = signJwt({ sub: user.id, iat: now, exp: now + 60 }, t.config.jwtSecret);
    const expired = signJwt({ sub: user.id, iat: now - 120, exp: now - 60 }, t.config.jwtSecret);
    await t.get('/api/me').set('Authorization', `Bearer ${valid}`).expect(200);
    await t.get('/api/me').set('Authorization', `Bearer ${expired}`).expect(401);
  });

  it('GET /api/me refuses a token signed with another secret, and no token at all', async () => {
    const { user } = await t.createUser();
    const now = Math.floor(Date.now() / 1000);
    const forged = signJwt({ sub: user.id, exp: now + 60 }, 'another-secret-another-secret-another');
    await t.get('/api/me').set('Authorization', `Bearer ${forged}`).expect(401);
    await t.get('/api/me').expect(401);
  });
});

describe('POST /api/auth/refresh and /api/auth/logout', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  async function signInCookie(): Promise<{ cookie: string; userId: string }> {
    const { user, email, password } = await t.createUser();
    const response = await t.post('/api/auth/login').send({ email, password }).expect(200);
    return { cookie: refreshCookieOf(response.headers['set-cookie']), userId: user.id };
  }

  it('POST /api/auth/refresh rotates the cookie, returns a working access token and stores only hashes', async () => {
    const { cookie, userId } = await signInCookie();
    const response = await t.post('/api/auth/refresh').set('Cookie', cookie).expect(200);
    const next = refreshCookieOf(response.headers['set-cookie']);
    expect(next).not.toBe(cookie);
    expect(response.body.user.id).toBe(userId);
    await t.get('/api/me').set('Authorization', `Bearer ${response.body.accessToken}`).expect(200);

    const raw = cookie.slice('limbus_refresh='.length);
    const rows = await t.orm.em
      .fork()
      .find(RefreshToken, { user: userId }, { orderBy: { createdAt: 'asc' } });
    expect(rows).toHaveLength(2);
    expect(rows.some((r) => r.tokenHash === raw)).toBe(false);
    const old = rows.find((r) => r.tokenHash === sha256Hex(raw));
    expect(old?.revokedAt).toBeInstanceOf(Date);
  });

  it('POST /api/auth/refresh with a rotated-out cookie fails and ends the newer session too', async () => {
    const { cookie } = await signInCookie();
    const rotated = await t.post('/api/auth/refresh').set('Cookie', cookie).expect(200);
    const next = refreshCookieOf(rotated.headers['set-cookie']);
    await t.post('/api/auth/refresh').set('Cookie', cookie).expect(401);
    await t.post('/api/auth/refresh').set('Cookie', next).expect(401);
  });

  it('POST /api/auth/refresh without a cookie answers 401', async () => {
    await t.post('/api/auth/refresh').expect(401);
    await t.post('/api/auth/refresh').set('Cookie', 'limbus_refresh=made-up').expect(401);
  });

  it('POST /api/auth/logout answers 204, clears the cookie and revokes the token', async () => {
    const { cookie } = await signInCookie();
    const response = await t.post('/api/auth/logout').set('Cookie', cookie).expect(204);
    expect(String(response.headers['set-cookie'])).toMatch(/limbus_refresh=;.*Expires=Thu, 01 Jan 1970/);
    await t.post('/api/auth/refresh').set('Cookie', cookie).expect(401);
  });
});
