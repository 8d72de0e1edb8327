import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Invitation } from '../../src/invitations/entities/invitation.entity';
import { Membership } from '../../src/teams/entities/membership.entity';
import type { Team } from '../../src/teams/entities/team.entity';
import { bootTestApp, type TestApp, tokenFromLink, uniqueEmail } from '../setup';

describe('invitations', () => {
  let t: TestApp;
  let team: Team;
  let coordinatorToken: string;

  beforeAll(async () => {
    t = await bootTestApp();
    team = await t.createTeam();
    const coordinator = await t.createUser({ teams: [{ team, roles: ['coordinator'] }] });
    coordinatorToken = await t.signIn(coordinator.email, coordinator.password);
  });
  afterAll(async () => {
    await t.close();
  });

  async function invite(email: string, role: string): Promise<{ id: string; token: string; text: string }> {
    const created = await t
      .post(`/api/teams/${team.id}/invitations`)
      .set('Authorization', `Bearer ${coordinatorToken}`)
      .send({ email, role })
      .expect(201);
    const [mail] = await t.mailTo(email);
    if (!mail) throw new Error(`no invitation mail to ${email}`);
    return { id: created.body.id, token: tokenFromLink(mail.text, 'invitations'), text: mail.text };
  }

  it('an invitation e-mail link leads to an account in the team with the invited role', async () => {
    const email = uniqueEmail('newcomer');
    const { id, token, text } = await invite(email, 'modeller');
    expect(text).toContain(`${t.config.publicUrl}/invitations/${token}`);

    const described = await t.get(`/api/invitations/${token}`).expect(200);
    expect(described.body).toMatchObject({ email, teamName: team.name, role: 'modeller' });
    expect(Date.parse(described.body.expiresAt)).toBeGreaterThan(Date.now());

    const accepted = await t
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Wen Okabe', password: 'a-fine-long-password' })
      .expect(200);
    expect(String(accepted.headers['set-cookie'])).toContain('limbus_refresh=');
    const me = await t.get('/api/me').set('Authorization', `Bearer ${accepted.body.accessToken}`).expect(200);
    expect(me.body).toMatchObject({ email, name: 'Wen Okabe', isAdmin: false });
    expect(me.body.teams).toEqual([{ id: team.id, name: team.name, roles: ['modeller'] }]);

    const row = await t.orm.em.fork().findOneOrFail(Invitation, { id });
    expect(row.acceptedAt).toBeInstanceOf(Date);
    expect(row.tokenHash).not.toBe(token);
    await t.signIn(email, 'a-fine-long-password');
  });

  it('GET /api/invitations/:token answers 404 once used and for an unknown token', async () => {
    const email = uniqueEmail('once');
    const { token } = await invite(email, 'observer');
    await t
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Ada Voss', password: 'a-fine-long-password' })
      .expect(200);
    await t.get(`/api/invitations/${token}`).expect(404);
    await t
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Ada Voss', password: 'a-fine-long-password' })
      .expect(404);
    await t.get('/api/invitations/not-a-token').expect(404);
  });

  it('POST /api/invitations/:token/accept adds the role to an existing account only with its password', async () => {
    const existing = await t.createUser({ teams: [{ team, roles: ['observer'] }] });
    const { token } = await invite(existing.email, 'reviewer');
    await t
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'ignored', password: 'not-their-password' })
      .expect(401);
    await t
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'ignored', password: existing.password })
      .expect(200);
    const membership = await t.orm.em
      .fork()
      .findOneOrFail(Membership, { team: team.id, user: existing.user.id });
    expect(membership.roles).toEqual(['observer', 'reviewer']);
  });

  it('POST /api/teams/:teamId/invitations answers 400 naming the bad field', async () => {
    const response = await t
      .post(`/api/teams/${team.id}/invitations`)
      .set('Authorization', `Bearer ${coordinatorToken}`)
      .send({ email: uniqueEmail('x'), role: 'captain' })
      .expect(400);
    expect(response.body.issues).toHaveLength(1);
    expect(response.body.issues[0].path).toBe('role');
  });

  it('POST /api/invitations/:token/accept answers 400 for a short password', async () => {
    const { token } = await invite(uniqueEmail('short'), 'observer');
    const response = await t
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Bo', password: 'short' })
      .expect(400);
    expect(response.body.issues).toEqual([{ path: 'password', message: 'must be at least 10 characters' }]);
  });
});
