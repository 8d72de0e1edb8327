import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bootTestApp, type TestApp } from '../setup';

describe('GET /api/health', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('GET /api/health reports db, queue and storage up without signing in', async () => {
    const response = await t.get('/api/health').expect(200);
    expect(response.body).toEqual({ status: 'ok', db: 'up', queue: 'up', storage: 'up' });
  });
});

describe('GET /api/health with the object store unreachable', () => {
  let t: TestApp;
  beforeAll(async () => {
    // Port 9 (discard) on loopback: nothing listens there on a test machine.
    t = await bootTestApp({
      S3_ENDPOINT: 'http://127.0.0.1:9',
      S3_ACCESS_KEY_ID: 'x',
      S3_SECRET_ACCESS_KEY: 'x',
    });
  });
  afterAll(async () => {
    await t.close();
  });

  it('GET /api/health answers 503 degraded with storage down', async () => {
    const response = await t.get('/api/health').expect(503);
    expect(response.body).toEqual({ status: 'degraded', db: 'up', queue: 'up', storage: 'down' });
  });
});
