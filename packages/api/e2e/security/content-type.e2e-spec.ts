import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bootTestApp, type TestApp } from '../setup';

describe('request bodies of another type than the route reads', () => {
  let t: TestApp;
  let token: string;
  beforeAll(async () => {
    t = await bootTestApp();
    const { email, password } = await t.createUser();
    token = await t.signIn(email, password);
  });
  afterAll(async () => {
    await t.close();
  });

  it('POST /api/auth/login with a text/plain body answers 415 naming the type', async () => {
    const response = await t
      .post('/api/auth/login')
      .set('Content-Type', 'text/plain')
      .send('{"email":"a@example.org","password":"x"}')
      .expect(415);
    expect(response.body).toEqual({
      statusCode: 415,
      error: 'Unsupported Media Type',
      message: 'Content-Type text/plain is not accepted here: send application/json',
    });
  });

  it('POST /api/events with a form body answers 415, and JSON with a charset is read', async () => {
    const form = await t
      .post('/api/events')
      .set('Authorization', `Bearer ${token}`)
      .type('form')
      .send({ title: 'x' })
      .expect(415);
    expect(form.body.message).toBe(
      'Content-Type application/x-www-form-urlencoded is not accepted here: send application/json',
    );
    // A JSON body goes on to the schema, which names the missing fields.
    const json = await t
      .post('/api/events')
      .set('Authorization', `Bearer ${token}`)
      .set('Content-Type', 'application/json; charset=utf-8')
      .send(JSON.stringify({ title: 'x' }))
      .expect(400);
    expect(json.body.issues.map((i: { path: string }) => i.path)).toContain('star');
  });

  it('POST /api/events/import with a JSON body answers 415 naming multipart/form-data', async () => {
    const response = await t
      .post('/api/events/import')
      .set('Authorization', `Bearer ${token}`)
      .send({ format: 'limbus-event/1' })
      .expect(415);
    expect(response.body.message).toBe(
      'Content-Type application/json is not accepted here: send multipart/form-data',
    );
  });

  it('POST /api/auth/logout without a body is served whatever its Content-Type', async () => {
    await t.post('/api/auth/logout').set('Content-Type', 'text/plain').expect(204);
  });
});
