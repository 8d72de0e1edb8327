import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sha256Hex } from '../../src/common/tokens';
import { Invitation } from '../../src/invitations/entities/invitation.entity';
import { Membership } from '../../src/teams/entities/membership.entity';
import type { Team } from '../../src/teams/entities/team.entity';
import { bootTestApp, type TestApp, tokenFromLink, uniqueEmail } from '../setup';
import { del } from '../events/workspace';

const UTC_TEXT = /^\d{4}-\d{2}-\d{2} \d{2}:\d{2}:\d{2} UTC$/;
const utcText = (date: Date): string => `${date.toISOString().slice(0, 19).replace('T', ' ')} UTC`;
const SEVEN_DAYS_MS = 7 * 24 * 3600 * 1000;

describe('invitations', () => {
  let t: TestApp;
  let team: Team;
  let otherTeam: Team;
  let coordinatorToken: string;
  let coordinatorId: string;
  let coordinatorName: string;
  let otherCoordinatorToken: string;

  beforeAll(async () => {
    t = await bootTestApp();
    team = await t.createTeam();
    otherTeam = await t.createTeam();
    const coordinator = await t.createUser({ teams: [{ team, roles: ['coordinator'] }] });
    coordinatorToken = await t.signIn(coordinator.email, coordinator.password);
    coordinatorId = coordinator.user.id;
    coordinatorName = coordinator.user.name;
    const other = await t.createUser({ teams: [{ team: otherTeam, roles: ['coordinator'] }] });
    otherCoordinatorToken = await t.signIn(other.email, other.password);
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

  it('POST /api/invitations/:token/accept adds the team to an existing account only with its password', async () => {
    const existing = await t.createUser({ teams: [{ team: otherTeam, roles: ['observer'] }] });
    const { token } = await invite(existing.email, 'reviewer');
    await t
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'ignored', password: 'not-their-password' })
      .expect(401);
    await t.post(`/api/invitations/${token}/accept`).send({ password: existing.password }).expect(200);
    const membership = await t.orm.em
      .fork()
      .findOneOrFail(Membership, { team: team.id, user: existing.user.id });
    expect(membership.roles).toEqual(['reviewer']);
    const elsewhere = await t.orm.em
      .fork()
      .findOneOrFail(Membership, { team: otherTeam.id, user: existing.user.id });
    expect(elsewhere.roles).toEqual(['observer']);
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

  it('POST /api/invitations/:token/accept asks a new address for its name, and keeps the invitation open', async () => {
    const { token } = await invite(uniqueEmail('nameless'), 'observer');
    const response = await t
      .post(`/api/invitations/${token}/accept`)
      .send({ password: 'a-fine-long-password' })
      .expect(400);
    expect(response.body.issues).toEqual([{ path: 'name', message: 'a new account needs your name' }]);
    await t.get(`/api/invitations/${token}`).expect(200);
  });

  const coordinator = () => ({ Authorization: `Bearer ${coordinatorToken}` });

  async function inviteRoles(
    email: string,
    roles: string[],
    teamId = team.id,
  ): Promise<{ id: string; token: string; text: string; html: string }> {
    const created = await t
      .post(`/api/teams/${teamId}/invitations`)
      .set(teamId === team.id ? coordinator() : { Authorization: `Bearer ${otherCoordinatorToken}` })
      .send({ email, roles })
      .expect(201);
    const mail = await t.mailAbout(email, 'You are invited');
    return {
      id: created.body.id,
      token: tokenFromLink(mail.text, 'invitations'),
      text: mail.text,
      html: mail.html,
    };
  }

  const stored = (id: string) => t.orm.em.fork().findOneOrFail(Invitation, { id });

  it('POST /api/teams/:teamId/invitations stores the roles and e-mails them with the expiry in UTC', async () => {
    const email = uniqueEmail('two-roles');
    const { id, token, text, html } = await inviteRoles(email.toUpperCase(), ['observer', 'coordinator']);
    const row = await stored(id);
    expect(row).toMatchObject({
      email,
      openEmail: email,
      roles: ['coordinator', 'observer'],
      acceptedAt: null,
      revokedAt: null,
      tokenHash: sha256Hex(token),
    });
    expect(row.expiresAt.getTime() - row.createdAt.getTime()).toBeGreaterThan(SEVEN_DAYS_MS - 5000);
    expect(row.expiresAt.getTime() - row.createdAt.getTime()).toBeLessThan(SEVEN_DAYS_MS + 5000);
    expect(text).toContain(
      `${coordinatorName} invites you to join ${team.name} on Limbus as coordinator and observer.`,
    );
    expect(text).toContain(`valid until ${utcText(row.expiresAt)}`);
    expect(utcText(row.expiresAt)).toMatch(UTC_TEXT);
    expect(html).toContain(`valid until ${utcText(row.expiresAt)}`);
  });

  it('POST /api/teams/:teamId/invitations still reads the older { email, role }', async () => {
    const email = uniqueEmail('one-role');
    const created = await t
      .post(`/api/teams/${team.id}/invitations`)
      .set(coordinator())
      .send({ email, role: 'reviewer' })
      .expect(201);
    expect((await stored(created.body.id)).roles).toEqual(['reviewer']);
  });

  it('POST /api/teams/:teamId/invitations answers 400 naming the field for a long address, a role "admin" or no role', async () => {
    const local = 'a'.repeat(255 - '@example.org'.length);
    const long = await t
      .post(`/api/teams/${team.id}/invitations`)
      .set(coordinator())
      .send({ email: `${local}@example.org`, roles: ['observer'] })
      .expect(400);
    expect(long.body.issues).toEqual([{ path: 'email', message: 'at most 254 characters' }]);
    const admin = await t
      .post(`/api/teams/${team.id}/invitations`)
      .set(coordinator())
      .send({ email: uniqueEmail('x'), roles: ['admin'] })
      .expect(400);
    expect(admin.body.issues.map((i: { path: string }) => i.path)).toEqual(['roles.0']);
    const none = await t
      .post(`/api/teams/${team.id}/invitations`)
      .set(coordinator())
      .send({ email: uniqueEmail('x') })
      .expect(400);
    expect(none.body.issues).toEqual([{ path: 'roles', message: 'choose at least one role' }]);
  });

  it('POST /api/teams/:teamId/invitations answers 409 for an address that is already a member, naming their roles', async () => {
    const existing = await t.createUser({ teams: [{ team, roles: ['observer', 'modeller'] }] });
    const response = await t
      .post(`/api/teams/${team.id}/invitations`)
      .set(coordinator())
      .send({ email: existing.email, roles: ['reviewer'] })
      .expect(409);
    expect(response.body.message).toBe(
      `${existing.email} is already a member of this team (roles modeller, observer): change their roles on the team page`,
    );
    expect(await t.orm.em.fork().count(Invitation, { email: existing.email })).toBe(0);
  });

  it('POST /api/teams/:teamId/invitations answers 409 while an open invitation to the address exists', async () => {
    const email = uniqueEmail('twice');
    const { id } = await inviteRoles(email, ['observer']);
    const response = await t
      .post(`/api/teams/${team.id}/invitations`)
      .set(coordinator())
      .send({ email, roles: ['modeller'] })
      .expect(409);
    expect(response.body.message).toBe(
      `${email} was already invited on ${utcText((await stored(id)).lastSentAt)}: resend it instead`,
    );
    expect(await t.orm.em.fork().count(Invitation, { email })).toBe(1);
    // Another team may invite the same address.
    await inviteRoles(email, ['observer'], otherTeam.id);
  });

  it('POST /api/teams/:teamId/invitations fired four times at once for one address gives one 201 and 409 for the others', async () => {
    // Two requests seldom both pass the friendly check before either inserts; four do, so the unique key
    // (team_id, open_email) is what answers some of them here.
    for (let round = 0; round < 4; round += 1) {
      const email = uniqueEmail('race');
      const send = () =>
        t
          .post(`/api/teams/${team.id}/invitations`)
          .set(coordinator())
          .send({ email, roles: ['observer'] });
      const statuses = (await Promise.all([send(), send(), send(), send()])).map((r) => r.status).sort();
      expect(statuses).toEqual([201, 409, 409, 409]);
      expect(await t.orm.em.fork().count(Invitation, { email, team: team.id })).toBe(1);
    }
  });

  it('POST /api/teams/:teamId/invitations revokes an expired open invitation and replaces it', async () => {
    const email = uniqueEmail('expired');
    const first = await inviteRoles(email, ['observer']);
    await t.orm.em
      .fork()
      .nativeUpdate(Invitation, { id: first.id }, { expiresAt: new Date(Date.now() - 1000) });
    const listed = await t.get(`/api/teams/${team.id}/invitations`).set(coordinator()).expect(200);
    expect(
      (listed.body as Array<{ id: string; expired: boolean }>).find((i) => i.id === first.id)?.expired,
    ).toBe(true);

    const second = await t
      .post(`/api/teams/${team.id}/invitations`)
      .set(coordinator())
      .send({ email, roles: ['modeller'] })
      .expect(201);
    const old = await stored(first.id);
    expect(old.revokedAt).toBeInstanceOf(Date);
    expect(old.openEmail).toBeNull();
    expect(await stored(second.body.id)).toMatchObject({
      openEmail: email,
      roles: ['modeller'],
      revokedAt: null,
    });
    const after = await t.get(`/api/teams/${team.id}/invitations`).set(coordinator()).expect(200);
    const ids = (after.body as Array<{ id: string }>).map((i) => i.id);
    expect(ids).toContain(second.body.id);
    expect(ids).not.toContain(first.id);
  });

  it('GET /api/teams/:teamId/invitations lists the open invitations of the team, newest first', async () => {
    const email = uniqueEmail('listed');
    const { id } = await inviteRoles(email, ['reviewer', 'modeller']);
    const accepted = await inviteRoles(uniqueEmail('accepted'), ['observer']);
    await t
      .post(`/api/invitations/${accepted.token}/accept`)
      .send({ name: 'Iris Taal', password: 'a-fine-long-password' })
      .expect(200);
    const response = await t.get(`/api/teams/${team.id}/invitations`).set(coordinator()).expect(200);
    const list = response.body as Array<{ id: string; createdAt: string }>;
    const row = await stored(id);
    expect(list.find((i) => i.id === id)).toEqual({
      id,
      email,
      roles: ['modeller', 'reviewer'],
      invitedBy: { id: coordinatorId, name: coordinatorName },
      createdAt: row.createdAt.toISOString(),
      lastSentAt: row.lastSentAt.toISOString(),
      expiresAt: row.expiresAt.toISOString(),
      expired: false,
    });
    expect(list.map((i) => i.id)).not.toContain(accepted.id);
    const open = await t.orm.em
      .fork()
      .count(Invitation, { team: team.id, acceptedAt: null, revokedAt: null });
    expect(list).toHaveLength(open);
    const times = list.map((i) => i.createdAt);
    expect([...times].sort().reverse()).toEqual(times);
  });

  it('POST /api/teams/:teamId/invitations/:invitationId/resend sends a new link with a new expiry; the old link dies', async () => {
    const email = uniqueEmail('resend');
    const first = await inviteRoles(email, ['observer']);
    const before = await stored(first.id);
    await new Promise((resolve) => setTimeout(resolve, 1100));
    const response = await t
      .post(`/api/teams/${team.id}/invitations/${first.id}/resend`)
      .set(coordinator())
      .expect(200);
    const mails = await t.mailTo(email, 2);
    expect(mails).toHaveLength(2);
    const newToken = tokenFromLink(mails[1]?.text ?? '', 'invitations');
    expect(newToken).not.toBe(first.token);
    const after = await stored(first.id);
    expect(after.tokenHash).toBe(sha256Hex(newToken));
    expect(after.expiresAt.getTime()).toBeGreaterThan(before.expiresAt.getTime());
    expect(after.lastSentAt.getTime()).toBeGreaterThan(before.lastSentAt.getTime());
    expect(response.body).toEqual({
      id: first.id,
      email,
      roles: ['observer'],
      invitedBy: { id: coordinatorId, name: coordinatorName },
      createdAt: after.createdAt.toISOString(),
      lastSentAt: after.lastSentAt.toISOString(),
      expiresAt: after.expiresAt.toISOString(),
      expired: false,
    });
    expect(mails[1]?.text).toContain(`valid until ${utcText(after.expiresAt)}`);
    await t.get(`/api/invitations/${first.token}`).expect(404);
    await t
      .post(`/api/invitations/${first.token}/accept`)
      .send({ name: 'Old Link', password: 'a-fine-long-password' })
      .expect(404);
    await t.get(`/api/invitations/${newToken}`).expect(200);
  });

  it('DELETE /api/teams/:teamId/invitations/:invitationId revokes: the link dies and the address may be invited again', async () => {
    const email = uniqueEmail('revoke');
    const { id, token } = await inviteRoles(email, ['observer']);
    await del(t, `/api/teams/${team.id}/invitations/${id}`).set(coordinator()).expect(204);
    const row = await stored(id);
    expect(row.revokedAt).toBeInstanceOf(Date);
    expect(row.openEmail).toBeNull();
    await t.get(`/api/invitations/${token}`).expect(404);
    await t
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Revoked', password: 'a-fine-long-password' })
      .expect(404);
    await del(t, `/api/teams/${team.id}/invitations/${id}`).set(coordinator()).expect(404);
    await t.post(`/api/teams/${team.id}/invitations/${id}/resend`).set(coordinator()).expect(404);
    await inviteRoles(email, ['observer']);
  });

  it('resend and DELETE of an invitation of another team answer 404, as for a missing one', async () => {
    const foreign = await inviteRoles(uniqueEmail('foreign'), ['observer'], otherTeam.id);
    for (const id of [foreign.id, randomUUID()]) {
      await t.post(`/api/teams/${team.id}/invitations/${id}/resend`).set(coordinator()).expect(404);
      await del(t, `/api/teams/${team.id}/invitations/${id}`).set(coordinator()).expect(404);
    }
    expect(await stored(foreign.id)).toMatchObject({ revokedAt: null, tokenHash: sha256Hex(foreign.token) });
  });

  it('GET /api/invitations/:token shows every role and whether the address has an account', async () => {
    const fresh = uniqueEmail('fresh');
    const a = await inviteRoles(fresh, ['reviewer', 'modeller']);
    expect((await t.get(`/api/invitations/${a.token}`).expect(200)).body).toEqual({
      email: fresh,
      teamName: team.name,
      roles: ['modeller', 'reviewer'],
      role: 'modeller',
      expiresAt: (await stored(a.id)).expiresAt.toISOString(),
      existingAccount: false,
    });
    const existing = await t.createUser({ teams: [{ team: otherTeam, roles: ['observer'] }] });
    const b = await inviteRoles(existing.email, ['observer']);
    expect((await t.get(`/api/invitations/${b.token}`).expect(200)).body).toMatchObject({
      existingAccount: true,
      roles: ['observer'],
    });
  });

  it('POST /api/invitations/:token/accept gives every role of the invitation, sets both cookies and embeds the me view', async () => {
    const email = uniqueEmail('all-roles');
    const { id, token } = await inviteRoles(email, ['modeller', 'observer', 'reviewer']);
    const accepted = await t
      .post(`/api/invitations/${token}/accept`)
      .send({ name: 'Tomas Reyes', password: 'a-fine-long-password' })
      .expect(200);
    expect(accepted.body.user).toMatchObject({
      email,
      name: 'Tomas Reyes',
      teams: [{ id: team.id, name: team.name, roles: ['modeller', 'observer', 'reviewer'] }],
      noticeOptOuts: [],
    });
    const cookies = ([] as string[]).concat(accepted.headers['set-cookie'] ?? []);
    expect(cookies.some((c) => c.startsWith('limbus_refresh='))).toBe(true);
    expect(cookies.some((c) => c.startsWith('limbus_session=1;'))).toBe(true);
    const membership = await t.orm.em
      .fork()
      .findOneOrFail(Membership, { team: team.id, user: accepted.body.user.id });
    expect(membership.roles).toEqual(['modeller', 'observer', 'reviewer']);
    expect(await stored(id)).toMatchObject({ openEmail: null });
  });
});
