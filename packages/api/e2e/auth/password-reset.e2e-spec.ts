import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { bootTestApp, type TestApp, tokenFromLink, uniqueEmail } from '../setup';

describe('password reset', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('POST /api/auth/password-reset e-mails a link; confirming it replaces the password and ends sessions', async () => {
    const { email, password } = await t.createUser();
    const login = await t.post('/api/auth/login').send({ email, password }).expect(200);
    const oldCookie = String(login.headers['set-cookie']).split(';')[0] ?? '';

    await t.post('/api/auth/password-reset').send({ email }).expect(202);
    const [mail] = await t.mailTo(email);
    if (!mail) throw new Error('no reset mail');
    const token = tokenFromLink(mail.text, 'reset-password');
    expect(mail.text).toContain(`${t.config.publicUrl}/reset-password/${token}`);

    await t
      .post('/api/auth/password-reset/confirm')
      .send({ token, password: 'brand-new-password' })
      .expect(204);
    await t.post('/api/auth/login').send({ email, password }).expect(401);
    await t.signIn(email, 'brand-new-password');
    await t.post('/api/auth/refresh').set('Cookie', oldCookie).expect(401);
    await t
      .post('/api/auth/password-reset/confirm')
      .send({ token, password: 'another-new-password' })
      .expect(404);
  });

  it('POST /api/auth/password-reset answers 202 for an unknown address and sends nothing', async () => {
    const email = uniqueEmail('ghost');
    await t.post('/api/auth/password-reset').send({ email }).expect(202);
    const known = await t.createUser();
    await t.post('/api/auth/password-reset').send({ email: known.email }).expect(202);
    await t.mailTo(known.email);
    expect(await t.mailTo(email, 0)).toEqual([]);
  });

  it('POST /api/auth/password-reset/confirm answers 400 naming the field for a short password', async () => {
    const response = await t
      .post('/api/auth/password-reset/confirm')
      .send({ token: 'x', password: 'short' })
      .expect(400);
    expect(response.body.issues).toEqual([{ path: 'password', message: 'must be at least 10 characters' }]);
  });
});
