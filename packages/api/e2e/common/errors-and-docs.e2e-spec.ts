import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bootTestApp, type TestApp } from '../setup';

describe('errors and the OpenAPI document', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('an unknown /api route answers 404 JSON without a stack', async () => {
    const response = await t.get('/api/no-such-thing').expect(404).expect('Content-Type', /json/);
    expect(response.body).toEqual({ statusCode: 404, error: 'Not Found', message: 'No such route' });
    expect(response.text).not.toMatch(/at .*\.(ts|js):\d+/);
  });

  it('malformed JSON answers 400 JSON without a stack', async () => {
    const response = await t
      .post('/api/auth/login')
      .set('Content-Type', 'application/json')
      .send('{"email":')
      .expect(400);
    expect(response.body.statusCode).toBe(400);
    expect(response.body.error).toBe('Bad Request');
    expect(response.text).not.toContain('node_modules');
  });

  it('a body over 1 MB answers 413', async () => {
    const response = await t
      .post('/api/auth/login')
      .send({ email: 'a@example.org', password: 'x'.repeat(1_100_000) })
      .expect(413);
    expect(response.body.statusCode).toBe(413);
  });

  it('GET /api/docs-json lists the routes of this issue and GET /api/docs serves the UI', async () => {
    const response = await t.get('/api/docs-json').expect(200);
    const paths = Object.keys(response.body.paths as Record<string, unknown>).sort();
    expect(paths).toEqual(
      expect.arrayContaining([
        '/api/auth/login',
        '/api/auth/refresh',
        '/api/auth/logout',
        '/api/auth/password-reset',
        '/api/auth/password-reset/confirm',
        '/api/me',
        '/api/teams',
        '/api/teams/{teamId}',
        '/api/teams/{teamId}/members',
        '/api/teams/{teamId}/invitations',
        '/api/invitations/{token}',
        '/api/invitations/{token}/accept',
        '/api/admin/outbox',
        '/api/health',
      ]),
    );
    const loginBody =
      response.body.paths['/api/auth/login'].post.requestBody.content['application/json'].schema;
    expect(loginBody.required).toEqual(['email', 'password']);
    const loginAnswer =
      response.body.paths['/api/auth/login'].post.responses['200'].content['application/json'].schema;
    expect(loginAnswer.properties.user.properties.teams.items.properties.roles.items.enum).toEqual([
      'coordinator',
      'observer',
      'modeller',
      'reviewer',
    ]);
    await t.get('/api/docs').expect(200).expect('Content-Type', /html/);
  });

  it('responses carry security headers and no X-Powered-By', async () => {
    const response = await t.get('/api/health').expect(200);
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['content-security-policy']).toContain("default-src 'self'");
    expect(response.headers['x-powered-by']).toBeUndefined();
  });
});
