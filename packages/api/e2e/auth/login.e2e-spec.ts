import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { User } from '../../src/users/entities/user.entity';
import { bootTestApp, type TestApp, uniqueEmail } from '../setup';

describe('POST /api/auth/login', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('POST /api/auth/login signs in with the right password and sets the refresh cookie', async () => {
    const { user, email, password } = await t.createUser();
    const response = await t
      .post('/api/auth/login')
      .send({ email: email.toUpperCase(), password })
      .expect(200);
    expect(response.body.user).toEqual({
      id: user.id,
      email,
      name: user.name,
      isAdmin: false,
      teams: [],
      noticeOptOuts: [],
    });
    expect(response.body.accessToken.split('.')).toHaveLength(3);
    const cookie = String(response.headers['set-cookie']);
    expect(cookie).toMatch(/^limbus_refresh=[A-Za-z0-9_-]{43};/);
    expect(cookie).toContain('Path=/api/auth');
    expect(cookie).toContain('HttpOnly');
    expect(cookie).toContain('SameSite=Strict');
    const stored = await t.orm.em.fork().findOneOrFail(User, { id: user.id });
    expect(stored.passwordHash).toMatch(/^\$argon2id\$/);
  });

  it('POST /api/auth/login answers 401 with one message for a wrong password and an unknown user', async () => {
    const { email } = await t.createUser();
    const wrong = await t.post('/api/auth/login').send({ email, password: 'not the password' }).expect(401);
    const unknown = await t
      .post('/api/auth/login')
      .send({ email: uniqueEmail('nobody'), password: 'not the password' })
      .expect(401);
    expect(wrong.body).toEqual({
      statusCode: 401,
      error: 'Unauthorized',
      message: 'Wrong e-mail or password',
    });
    expect(unknown.body).toEqual(wrong.body);
    expect(wrong.headers['set-cookie']).toBeUndefined();
  });

  it('POST /api/auth/login answers 429 with Retry-After after five failures, even with the right password', async () => {
    const { email, password } = await t.createUser();
    for (let i = 0; i < 5; i += 1) {
      await t
        .post('/api/auth/login')
        .send({ email, password: `wrong-${i}` })
        .expect(401);
    }
    const limited = await t.post('/api/auth/login').send({ email, password }).expect(429);
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(limited.headers['retry-after'])).toBeLessThanOrEqual(t.config.loginFailureWindowSeconds);
    expect(limited.body.statusCode).toBe(429);
  });

  it('POST /api/auth/login does not count successful sign-ins toward the limit', async () => {
    const { email, password } = await t.createUser();
    for (let i = 0; i < 7; i += 1) await t.post('/api/auth/login').send({ email, password }).expect(200);
    for (let i = 0; i < 4; i += 1) {
      await t.post('/api/auth/login').send({ email, password: 'wrong' }).expect(401);
    }
    await t.post('/api/auth/login').send({ email, password }).expect(200);
  });

  it('POST /api/auth/login answers 400 with the field path for a malformed body', async () => {
    const response = await t
      .post('/api/auth/login')
      .send({ email: 'not-an-address', password: 3 })
      .expect(400);
    expect(response.body.statusCode).toBe(400);
    expect(response.body.error).toBe('Bad Request');
    expect(response.body.issues.map((i: { path: string }) => i.path).sort()).toEqual(['email', 'password']);
  });
});

describe('POST /api/auth/login per-address limit', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await bootTestApp({ LOGIN_FAILURE_ADDRESS_LIMIT: '3' });
  });
  afterAll(async () => {
    await t.close();
  });

  it('POST /api/auth/login limits one address trying many accounts', async () => {
    for (let i = 0; i < 3; i += 1) {
      await t
        .post('/api/auth/login')
        .send({ email: uniqueEmail('spray'), password: 'guess' })
        .expect(401);
    }
    const { email, password } = await t.createUser();
    await t.post('/api/auth/login').send({ email, password }).expect(429);
    await t
      .post('/api/auth/login')
      .set('X-Forwarded-For', '192.0.2.77')
      .send({ email, password })
      .expect(200);
  });
});
