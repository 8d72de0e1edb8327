import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bootTestApp, type TestApp } from '../setup';

/** Set-Cookie lines by cookie name, attributes split, e.g. { value: '1', Path: '/', SameSite: 'Strict' }. */
function cookiesOf(setCookie: string[] | string | undefined): Map<string, Record<string, string | true>> {
  const cookies = new Map<string, Record<string, string | true>>();
  for (const line of ([] as string[]).concat(setCookie ?? [])) {
    const [pair = '', ...attributes] = line.split(';').map((part) => part.trim());
    const eq = pair.indexOf('=');
    const fields: Record<string, string | true> = { value: pair.slice(eq + 1) };
    for (const attribute of attributes) {
      const at = attribute.indexOf('=');
      if (at < 0) fields[attribute] = true;
      else fields[attribute.slice(0, at)] = attribute.slice(at + 1);
    }
    cookies.set(pair.slice(0, eq), fields);
  }
  return cookies;
}

const REFRESH = 'limbus_refresh';
const HINT = 'limbus_session';

describe('the session hint cookie limbus_session', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  async function signIn(): Promise<{ cookie: string; setCookie: string[] }> {
    const { email, password } = await t.createUser();
    const response = await t.post('/api/auth/login').send({ email, password }).expect(200);
    const setCookie = ([] as string[]).concat(response.headers['set-cookie'] ?? []);
    const refresh = cookiesOf(setCookie).get(REFRESH);
    return { cookie: `${REFRESH}=${String(refresh?.value)}`, setCookie };
  }

  it('POST /api/auth/login sets limbus_session=1 readable by scripts, site-wide, with the refresh cookie’s lifetime', async () => {
    const { setCookie } = await signIn();
    const cookies = cookiesOf(setCookie);
    const hint = cookies.get(HINT);
    expect(hint).toEqual({
      value: '1',
      'Max-Age': String(t.config.refreshTokenTtlSeconds),
      Path: '/',
      Expires: expect.any(String),
      SameSite: 'Strict',
    });
    expect(hint?.HttpOnly).toBeUndefined();
    expect(hint?.Secure).toBeUndefined();
    expect(cookies.get(REFRESH)?.['Max-Age']).toBe(hint?.['Max-Age']);
    expect(cookies.get(REFRESH)?.HttpOnly).toBe(true);
  });

  it('POST /api/auth/refresh sets limbus_session again with the rotated refresh cookie', async () => {
    const { cookie } = await signIn();
    const response = await t.post('/api/auth/refresh').set('Cookie', cookie).expect(200);
    const cookies = cookiesOf(response.headers['set-cookie']);
    expect(cookies.get(HINT)).toMatchObject({ value: '1', Path: '/', SameSite: 'Strict' });
    expect(cookies.get(REFRESH)?.value).not.toBe(cookie.slice(REFRESH.length + 1));
  });

  it('POST /api/auth/logout clears limbus_session and limbus_refresh', async () => {
    const { cookie } = await signIn();
    const response = await t.post('/api/auth/logout').set('Cookie', cookie).expect(204);
    const cookies = cookiesOf(response.headers['set-cookie']);
    expect(cookies.get(HINT)).toMatchObject({
      value: '',
      Path: '/',
      Expires: 'Thu, 01 Jan 1970 00:00:00 GMT',
    });
    expect(cookies.get(REFRESH)).toMatchObject({
      value: '',
      Path: '/api/auth',
      Expires: 'Thu, 01 Jan 1970 00:00:00 GMT',
    });
  });

  it('POST /api/auth/refresh that fails with 401 clears both cookies: without a cookie, with an unknown or a reused one', async () => {
    const { cookie } = await signIn();
    await t.post('/api/auth/refresh').set('Cookie', cookie).expect(200);
    for (const sent of [null, `${REFRESH}=made-up`, cookie]) {
      const request = t.post('/api/auth/refresh');
      const response = await (sent === null ? request : request.set('Cookie', sent)).expect(401);
      const cookies = cookiesOf(response.headers['set-cookie']);
      expect(cookies.get(HINT)).toMatchObject({ value: '', Expires: 'Thu, 01 Jan 1970 00:00:00 GMT' });
      expect(cookies.get(REFRESH)).toMatchObject({ value: '', Expires: 'Thu, 01 Jan 1970 00:00:00 GMT' });
    }
  });
});

describe('the session hint cookie over https', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp({ LIMBUS_PUBLIC_URL: 'https://limbus.example.org' });
  });
  afterAll(async () => {
    await t.close();
  });

  it('POST /api/auth/login marks limbus_session Secure, like the refresh cookie, when the public URL is https', async () => {
    const { email, password } = await t.createUser();
    const response = await t.post('/api/auth/login').send({ email, password }).expect(200);
    const cookies = cookiesOf(response.headers['set-cookie']);
    expect(cookies.get(HINT)?.Secure).toBe(true);
    expect(cookies.get(REFRESH)?.Secure).toBe(true);
    expect(cookies.get(HINT)?.HttpOnly).toBeUndefined();
  });
});
