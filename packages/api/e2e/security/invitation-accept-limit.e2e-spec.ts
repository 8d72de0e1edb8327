import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Membership } from '../../src/teams/entities/membership.entity';
import type { Team } from '../../src/teams/entities/team.entity';
import { bootTestApp, type TestApp, tokenFromLink } from '../setup';

describe('POST /api/invitations/:token/accept for an existing account, under the sign-in limiter', () => {
  let t: TestApp;
  let team: Team;
  let coordinatorToken: string;
  beforeAll(async () => {
    // The per-address limit is lowered so that the test reaches it with a few requests (sign-in's own
    // test does the same); the per-account limit keeps its default of 5.
    t = await bootTestApp({ LOGIN_FAILURE_ADDRESS_LIMIT: '8' });
    team = await t.createTeam();
    const coordinator = await t.createUser({ teams: [{ team, roles: ['coordinator'] }] });
    coordinatorToken = await t.signIn(coordinator.email, coordinator.password);
  });
  afterAll(async () => {
    await t.close();
  });

  async function invite(email: string): Promise<string> {
    await t
      .post(`/api/teams/${team.id}/invitations`)
      .set('Authorization', `Bearer ${coordinatorToken}`)
      .send({ email, role: 'observer' })
      .expect(201);
    const mail = await t.mailAbout(email, 'You are invited');
    return tokenFromLink(mail.text, 'invitations');
  }

  const accept = (token: string, password: string, client = t.address) =>
    t.post(`/api/invitations/${token}/accept`).set('X-Forwarded-For', client).send({ password });

  it('POST /api/invitations/:token/accept answers 429 with Retry-After after 5 wrong passwords, even with the right one', async () => {
    const { user, email, password } = await t.createUser();
    const token = await invite(email);
    // Another client address each time: the account's own counter is what stops this guesser.
    for (let i = 0; i < 5; i++) await accept(token, `wrong-guess-${i}`, `192.0.2.${10 + i}`).expect(401);
    const refused = await accept(token, password, '192.0.2.40').expect(429);
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(refused.headers['retry-after'])).toBeLessThanOrEqual(t.config.loginFailureWindowSeconds);
    // The counter is the sign-in's: signing in is refused as well, and nothing was joined.
    await t
      .post('/api/auth/login')
      .set('X-Forwarded-For', '192.0.2.41')
      .send({ email, password })
      .expect(429);
    expect(await t.orm.em.fork().count(Membership, { user: user.id, team: team.id })).toBe(0);
  });

  it('POST /api/invitations/:token/accept counts wrong passwords per client address across accounts', async () => {
    const client = '198.51.100.23';
    const guessed = await Promise.all([t.createUser(), t.createUser(), t.createUser(), t.createUser()]);
    const tokens = await Promise.all(guessed.map(({ email }) => invite(email)));
    // Two wrong passwords for each of four accounts: below the per-account limit, at the address's 8.
    for (const token of tokens) {
      await accept(token, 'first-wrong-guess', client).expect(401);
      await accept(token, 'second-wrong-guess', client).expect(401);
    }
    const [first] = guessed;
    const [firstToken] = tokens;
    if (!first || !firstToken) throw new Error('no account');
    await accept(firstToken, first.password, client).expect(429);
    // From another address the right password is taken, and the account joins the team.
    const joined = await accept(firstToken, first.password, '198.51.100.24').expect(200);
    expect(joined.body.user.teams).toEqual([{ id: team.id, name: team.name, roles: ['observer'] }]);
  });
});
