import { mkdtemp, mkdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bootTestApp, type TestApp } from '../setup';

describe('the built client served by the API', () => {
  let t: TestApp;
  let dir: string;
  beforeAll(async () => {
    dir = await mkdtemp(path.join(tmpdir(), 'limbus-web-dist-'));
    await mkdir(path.join(dir, 'assets'));
    await writeFile(path.join(dir, 'index.html'), '<!doctype html><title>Limbus test client</title>');
    await writeFile(path.join(dir, 'assets', 'app.js'), 'export const marker = 42;');
    t = await bootTestApp({ WEB_DIST_DIR: dir });
  });
  afterAll(async () => {
    await t.close();
    await rm(dir, { recursive: true, force: true });
  });

  it('GET of a client route falls back to index.html', async () => {
    for (const route of [
      '/',
      '/sign-in',
      '/events',
      '/invitations/abc',
      '/reset-password/xyz',
      '/admin/outbox',
    ]) {
      const response = await t.get(route).set('Accept', 'text/html').expect(200);
      expect(response.text).toContain('Limbus test client');
    }
  });

  it('GET of a built file serves the file itself', async () => {
    const response = await t.get('/assets/app.js').expect(200);
    expect(response.text).toBe('export const marker = 42;');
  });

  it('GET of an unknown /api route still answers 404 JSON, not index.html', async () => {
    const response = await t.get('/api/events-that-do-not-exist').set('Accept', 'text/html').expect(404);
    expect(response.body.statusCode).toBe(404);
  });
});
