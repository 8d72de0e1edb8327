import { randomUUID } from 'node:crypto';
import type { Server } from 'node:http';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Team } from '../../src/teams/entities/team.entity';
import type { TeamRole } from '../../src/teams/roles';
import { bootTestApp, type TestApp, uniqueEmail } from '../setup';
import { del, patch } from '../events/workspace';

describe('team routes and role guards', () => {
  let t: TestApp;
  let team: Team;
  let otherTeam: Team;
  const tokens: Record<'admin' | TeamRole | 'outsider' | 'otherCoordinator', string> = {
    admin: '',
    coordinator: '',
    observer: '',
    modeller: '',
    reviewer: '',
    outsider: '',
    otherCoordinator: '',
  };

  beforeAll(async () => {
    t = await bootTestApp();
    team = await t.createTeam();
    otherTeam = await t.createTeam();
    for (const role of ['coordinator', 'observer', 'modeller', 'reviewer'] as const) {
      const { email, password } = await t.createUser({ teams: [{ team, roles: [role] }] });
      tokens[role] = await t.signIn(email, password);
    }
    const admin = await t.createUser({ isAdmin: true });
    tokens.admin = await t.signIn(admin.email, admin.password);
    const outsider = await t.createUser({ teams: [{ team: otherTeam, roles: ['observer'] }] });
    tokens.outsider = await t.signIn(outsider.email, outsider.password);
    const other = await t.createUser({ teams: [{ team: otherTeam, roles: ['coordinator'] }] });
    tokens.otherCoordinator = await t.signIn(other.email, other.password);
  });
  afterAll(async () => {
    await t.close();
  });

  const bearer = (who: keyof typeof tokens) => `Bearer ${tokens[who]}`;

  it('GET /api/teams lists only my teams with my roles', async () => {
    const response = await t.get('/api/teams').set('Authorization', bearer('observer')).expect(200);
    expect(response.body).toEqual([{ id: team.id, name: team.name, roles: ['observer'] }]);
  });

  it('GET /api/teams/:teamId answers a member and 404 to a member of another team', async () => {
    const own = await t.get(`/api/teams/${team.id}`).set('Authorization', bearer('modeller')).expect(200);
    expect(own.body).toEqual({ id: team.id, name: team.name, roles: ['modeller'] });
    const other = await t.get(`/api/teams/${team.id}`).set('Authorization', bearer('outsider')).expect(404);
    expect(other.body).toEqual({ statusCode: 404, error: 'Not Found', message: 'Not found' });
  });

  it('GET /api/teams/:teamId answers 404 for a team that does not exist, same as for a foreign one', async () => {
    const missing = await t
      .get(`/api/teams/${randomUUID()}`)
      .set('Authorization', bearer('coordinator'))
      .expect(404);
    const foreign = await t
      .get(`/api/teams/${otherTeam.id}`)
      .set('Authorization', bearer('coordinator'))
      .expect(404);
    expect(missing.body).toEqual(foreign.body);
  });

  it('GET /api/teams/:teamId/members lists members for a member, 404 for an outsider, 401 anonymous', async () => {
    const response = await t
      .get(`/api/teams/${team.id}/members`)
      .set('Authorization', bearer('reviewer'))
      .expect(200);
    const roles = (response.body as Array<{ roles: string[] }>).map((m) => m.roles[0]).sort();
    expect(roles).toEqual(['coordinator', 'modeller', 'observer', 'reviewer']);
    await t.get(`/api/teams/${team.id}/members`).set('Authorization', bearer('outsider')).expect(404);
    await t.get(`/api/teams/${team.id}/members`).expect(401);
  });

  it('GET /api/teams/:teamId lets a site admin see a team without membership', async () => {
    const response = await t.get(`/api/teams/${team.id}`).set('Authorization', bearer('admin')).expect(200);
    expect(response.body.roles).toEqual([]);
  });

  it('POST /api/teams/:teamId/invitations needs the coordinator role in that team (or site admin)', async () => {
    const invite = (who: keyof typeof tokens | null) => {
      const req = t
        .post(`/api/teams/${team.id}/invitations`)
        .send({ email: uniqueEmail('invitee'), role: 'observer' });
      return who === null ? req : req.set('Authorization', bearer(who));
    };
    expect((await invite('coordinator')).status).toBe(201);
    expect((await invite('admin')).status).toBe(201);
    expect((await invite('observer')).status).toBe(403);
    expect((await invite('modeller')).status).toBe(403);
    expect((await invite('reviewer')).status).toBe(403);
    expect((await invite('otherCoordinator')).status).toBe(404);
    expect((await invite(null)).status).toBe(401);
  });

  it('GET /api/admin/outbox is for site admins only', async () => {
    const response = await t.get('/api/admin/outbox').set('Authorization', bearer('admin')).expect(200);
    expect(Array.isArray(response.body)).toBe(true);
    const forbidden = await t
      .get('/api/admin/outbox')
      .set('Authorization', bearer('coordinator'))
      .expect(403);
    expect(forbidden.body.message).toBe('Site administrators only');
    await t.get('/api/admin/outbox').expect(401);
  });

  it('GET /api/admin/outbox returns the messages the catcher holds, newest first, with their kind', async () => {
    const first = uniqueEmail('outbox');
    const second = uniqueEmail('outbox');
    for (const email of [first, second]) {
      await t
        .post(`/api/teams/${team.id}/invitations`)
        .set('Authorization', bearer('coordinator'))
        .send({ email, role: 'reviewer' })
        .expect(201);
      await t.mailTo(email);
    }
    const response = await t.get('/api/admin/outbox').set('Authorization', bearer('admin')).expect(200);
    const mine = (response.body as Array<{ to: string[]; subject: string; kind: string | null }>).filter(
      (m) => [first, second].some((email) => m.to.includes(email)),
    );
    expect(mine.map((m) => [m.to, m.subject, m.kind])).toEqual([
      [[second], `You are invited to ${team.name} on Limbus`, 'invitation'],
      [[first], `You are invited to ${team.name} on Limbus`, 'invitation'],
    ]);
  });

  // The matrix of docs/authorization.md, cell by cell ("anonymous" sends no token).
  const who = [
    'admin',
    'coordinator',
    'observer',
    'modeller',
    'reviewer',
    'otherCoordinator',
    'anonymous',
  ] as const;
  const server = () => t.app.getHttpServer() as Server;
  /** A member of the team to change or remove, new for each call so one caller's success cannot shape the next answer. */
  const freshMember = async (): Promise<string> =>
    (await t.createUser({ teams: [{ team, roles: ['observer'] }] })).user.id;
  /** An open invitation of the team, new for each call. */
  const freshInvitation = async (): Promise<string> =>
    (
      await t
        .post(`/api/teams/${team.id}/invitations`)
        .set('Authorization', bearer('coordinator'))
        .send({ email: uniqueEmail('cell'), roles: ['observer'] })
        .expect(201)
    ).body.id as string;

  /** `fresh` makes the object one call acts on (a member, an invitation), new for each caller. */
  const matrix: Array<{
    route: string;
    fresh?: () => Promise<string>;
    send: (id: string) => request.Test;
    expected: number[];
  }> = [
    {
      route: 'GET /api/me',
      send: () => t.get('/api/me'),
      expected: [200, 200, 200, 200, 200, 200, 401],
    },
    {
      route: 'PUT /api/me/notices',
      send: () =>
        request(server()).put('/api/me/notices').set('X-Forwarded-For', t.address).send({ optOut: [] }),
      expected: [200, 200, 200, 200, 200, 200, 401],
    },
    {
      route: 'GET /api/teams',
      send: () => t.get('/api/teams'),
      expected: [200, 200, 200, 200, 200, 200, 401],
    },
    {
      route: 'GET /api/teams/:teamId',
      send: () => t.get(`/api/teams/${team.id}`),
      expected: [200, 200, 200, 200, 200, 404, 401],
    },
    {
      route: 'GET /api/teams/:teamId/members',
      send: () => t.get(`/api/teams/${team.id}/members`),
      expected: [200, 200, 200, 200, 200, 404, 401],
    },
    {
      route: 'PATCH /api/teams/:teamId/members/:userId',
      fresh: freshMember,
      send: (userId) => patch(t, `/api/teams/${team.id}/members/${userId}`).send({ roles: ['modeller'] }),
      expected: [200, 200, 403, 403, 403, 404, 401],
    },
    {
      route: 'DELETE /api/teams/:teamId/members/:userId',
      fresh: freshMember,
      send: (userId) => del(t, `/api/teams/${team.id}/members/${userId}`),
      expected: [204, 204, 403, 403, 403, 404, 401],
    },
    {
      route: 'GET /api/teams/:teamId/invitations',
      send: () => t.get(`/api/teams/${team.id}/invitations`),
      expected: [200, 200, 403, 403, 403, 404, 401],
    },
    {
      route: 'POST /api/teams/:teamId/invitations',
      send: () =>
        t.post(`/api/teams/${team.id}/invitations`).send({ email: uniqueEmail('cell'), role: 'observer' }),
      expected: [201, 201, 403, 403, 403, 404, 401],
    },
    {
      route: 'POST /api/teams/:teamId/invitations/:invitationId/resend',
      fresh: freshInvitation,
      send: (invitationId) => t.post(`/api/teams/${team.id}/invitations/${invitationId}/resend`),
      expected: [200, 200, 403, 403, 403, 404, 401],
    },
    {
      route: 'DELETE /api/teams/:teamId/invitations/:invitationId',
      fresh: freshInvitation,
      send: (invitationId) => del(t, `/api/teams/${team.id}/invitations/${invitationId}`),
      expected: [204, 204, 403, 403, 403, 404, 401],
    },
    {
      route: 'GET /api/admin/outbox',
      send: () => t.get('/api/admin/outbox'),
      expected: [200, 403, 403, 403, 403, 403, 401],
    },
    {
      route: 'GET /api/health',
      send: () => t.get('/api/health'),
      expected: [200, 200, 200, 200, 200, 200, 200],
    },
  ];

  it.each(matrix)(
    '$route answers each role as docs/authorization.md says',
    async ({ fresh, send, expected }) => {
      const actual: number[] = [];
      for (const caller of who) {
        const req = send(fresh ? await fresh() : '');
        actual.push(
          (caller === 'anonymous' ? await req : await req.set('Authorization', bearer(caller))).status,
        );
      }
      expect(actual).toEqual(expected);
    },
  );
});
