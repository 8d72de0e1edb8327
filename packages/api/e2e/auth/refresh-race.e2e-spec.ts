import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { RefreshToken } from '../../src/auth/entities/refresh-token.entity';
import { bootTestApp, type TestApp } from '../setup';

function refreshCookieOf(setCookie: string[] | string | undefined): string {
  const header = ([] as string[]).concat(setCookie ?? []).find((c) => c.startsWith('limbus_refresh='));
  if (!header) throw new Error('no limbus_refresh cookie');
  return header.split(';')[0] ?? '';
}

/** Status codes of `count` refreshes sent at once with one cookie, and the cookies of the 200s. */
async function refreshAtOnce(
  t: TestApp,
  cookie: string,
  count: number,
): Promise<{ statuses: number[]; cookies: string[] }> {
  const responses = await Promise.all(
    Array.from({ length: count }, () => t.post('/api/auth/refresh').set('Cookie', cookie)),
  );
  return {
    statuses: responses.map((r) => r.status),
    cookies: responses.filter((r) => r.status === 200).map((r) => refreshCookieOf(r.headers['set-cookie'])),
  };
}

describe('POST /api/auth/refresh sent several times at once with one cookie', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  async function signInCookie(email: string, password: string): Promise<string> {
    const response = await t.post('/api/auth/login').send({ email, password }).expect(200);
    return refreshCookieOf(response.headers['set-cookie']);
  }

  it('POST /api/auth/refresh ×6 at once: exactly one 200, five 401, and that whole token family revoked', async () => {
    const { user, email, password } = await t.createUser();
    // A second sign-in (another device): a family of its own, which the race must leave alone.
    const otherDevice = await signInCookie(email, password);
    const cookie = await signInCookie(email, password);

    const { statuses, cookies } = await refreshAtOnce(t, cookie, 6);
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.filter((s) => s === 401)).toHaveLength(5);

    // The winner's new token belongs to the forked family too: it must not work any more.
    const [winner] = cookies;
    if (!winner) throw new Error('no winning cookie');
    await t.post('/api/auth/refresh').set('Cookie', winner).expect(401);
    const rows = await t.orm.em.fork().find(RefreshToken, { user: user.id });
    // Two sign-ins and the winner's rotation; the five losers issued nothing.
    expect(rows).toHaveLength(3);
    expect(rows.filter((r) => r.revokedAt === null)).toHaveLength(1);

    await t.post('/api/auth/refresh').set('Cookie', otherDevice).expect(200);
  });

  it('POST /api/auth/refresh ×10 at once, five rounds: never a 500, one 200 a round, no live token left', async () => {
    const { user, email, password } = await t.createUser();
    for (let round = 0; round < 5; round++) {
      const cookie = await signInCookie(email, password);
      const { statuses } = await refreshAtOnce(t, cookie, 10);
      expect(statuses.filter((s) => s !== 200 && s !== 401)).toEqual([]);
      expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    }
    const live = await t.orm.em.fork().find(RefreshToken, { user: user.id, revokedAt: null });
    expect(live).toEqual([]);
  });

  it('POST /api/auth/refresh in sequence still rotates: each new cookie works once', async () => {
    const { email, password } = await t.createUser();
    let cookie = await signInCookie(email, password);
    for (let i = 0; i < 3; i++) {
      const response = await t.post('/api/auth/refresh').set('Cookie', cookie).expect(200);
      cookie = refreshCookieOf(response.headers['set-cookie']);
    }
    await t.post('/api/auth/refresh').set('Cookie', cookie).expect(200);
  });
});
