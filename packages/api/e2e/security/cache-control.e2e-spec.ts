import { mkdir, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bootTestApp, type TestApp } from '../setup';

describe('Cache-Control of the answers', () => {
  let t: TestApp;
  let webDist: string;
  let token: string;
  let email: string;
  let password: string;
  beforeAll(async () => {
    // A client build of its own, so the static files are there whatever the shared dist/ holds.
    webDist = await mkdtemp(path.join(tmpdir(), 'limbus-cache-web-'));
    await mkdir(path.join(webDist, 'assets'));
    await writeFile(path.join(webDist, 'index.html'), '<!doctype html><title>Limbus</title>');
    await writeFile(path.join(webDist, 'assets', 'app-1a2b3c.js'), 'console.log(1);');
    t = await bootTestApp({ WEB_DIST_DIR: webDist });
    ({ email, password } = await t.createUser());
    token = await t.signIn(email, password);
  });
  afterAll(async () => {
    await t.close();
    await rm(webDist, { recursive: true, force: true });
  });

  it('GET /api/me, /api/teams and an unknown API route answer Cache-Control: no-store', async () => {
    for (const url of ['/api/me', '/api/teams']) {
      const response = await t.get(url).set('Authorization', `Bearer ${token}`).expect(200);
      expect(response.headers['cache-control']).toBe('no-store');
    }
    const refused = await t.get('/api/me').expect(401);
    expect(refused.headers['cache-control']).toBe('no-store');
    const missing = await t.get('/api/no-such-route').set('Authorization', `Bearer ${token}`).expect(404);
    expect(missing.headers['cache-control']).toBe('no-store');
  });

  it('POST /api/auth/login, /refresh and /password-reset answer Cache-Control: no-store', async () => {
    const login = await t.post('/api/auth/login').send({ email, password }).expect(200);
    expect(login.headers['cache-control']).toBe('no-store');
    const refresh = await t.post('/api/auth/refresh').expect(401);
    expect(refresh.headers['cache-control']).toBe('no-store');
    const reset = await t.post('/api/auth/password-reset').send({ email }).expect(202);
    expect(reset.headers['cache-control']).toBe('no-store');
  });

  it('GET of a client file and of a client route keep the static server caching, not no-store', async () => {
    const asset = await t.get('/assets/app-1a2b3c.js').expect(200);
    // express.static's and sendFile's own default (serve-static README: cacheControl, maxAge 0).
    expect(asset.headers['cache-control']).toBe('public, max-age=0');
    const page = await t.get('/events/some-event').set('Accept', 'text/html').expect(200);
    expect(page.headers['cache-control']).toBe('public, max-age=0');
  });
});
