import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '../../src/audit/entities/audit-entry.entity';
import { Station } from '../../src/stations/entities/station.entity';
import { Membership } from '../../src/teams/entities/membership.entity';
import type { Team } from '../../src/teams/entities/team.entity';
import type { TeamRole } from '../../src/teams/roles';
import { bootTestApp, type TestApp } from '../setup';
import { createWorkspace, del, importExample, patch, type Workspace } from '../events/workspace';

describe('team members', () => {
  let t: TestApp;
  let w: Workspace;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
  });
  afterAll(async () => {
    await t.close();
  });

  const admin = () => w.auth('admin');
  const coordinator = () => w.auth('coordinator');

  async function member(roles: TeamRole[], team: Team = w.team): Promise<{ id: string; name: string }> {
    const { user } = await t.createUser({ teams: [{ team, roles }] });
    return { id: user.id, name: user.name };
  }

  const storedRoles = async (teamId: string, userId: string): Promise<TeamRole[] | null> =>
    (await t.orm.em.fork().findOne(Membership, { team: teamId, user: userId }))?.roles ?? null;

  const coordinatorsOf = async (teamId: string): Promise<number> =>
    (await t.orm.em.fork().find(Membership, { team: teamId })).filter((m) => m.roles.includes('coordinator'))
      .length;

  it('GET /api/teams/:teamId/members answers every member with roles and the time they joined', async () => {
    const response = await t.get(`/api/teams/${w.team.id}/members`).set(w.auth('observer')).expect(200);
    const rows = await t.orm.em.fork().find(Membership, { team: w.team.id }, { populate: ['user'] });
    const expected = rows
      .map((m) => ({
        userId: m.user.id,
        name: m.user.name,
        email: m.user.email,
        roles: m.roles,
        joinedAt: m.createdAt.toISOString(),
      }))
      .sort((a, b) => a.name.localeCompare(b.name));
    expect(response.body).toEqual(expected);
    expect(expected.length).toBeGreaterThanOrEqual(4);
  });

  it('PATCH /api/teams/:teamId/members/:userId sets the roles, stores them and writes an audit entry', async () => {
    const target = await member(['observer']);
    const response = await patch(t, `/api/teams/${w.team.id}/members/${target.id}`)
      .set(coordinator())
      .send({ roles: ['reviewer', 'observer', 'reviewer'] })
      .expect(200);
    expect(response.body).toMatchObject({
      userId: target.id,
      name: target.name,
      roles: ['observer', 'reviewer'],
    });
    expect(await storedRoles(w.team.id, target.id)).toEqual(['observer', 'reviewer']);
    const membership = await t.orm.em.fork().findOneOrFail(Membership, { team: w.team.id, user: target.id });
    const entries = await t.orm.em
      .fork()
      .find(AuditEntry, { objectType: 'membership', objectId: membership.id });
    expect(entries.map((e) => [e.teamId, e.eventId, e.actorId, e.action, e.detail])).toEqual([
      [
        w.team.id,
        null,
        w.userIds.coordinator,
        'membership.roles',
        { userId: target.id, before: ['observer'], after: ['observer', 'reviewer'] },
      ],
    ]);
  });

  it('PATCH /api/teams/:teamId/members/:userId answers 400 naming the field for an unknown or no role', async () => {
    const target = await member(['observer']);
    const url = `/api/teams/${w.team.id}/members/${target.id}`;
    const unknown = await patch(t, url)
      .set(coordinator())
      .send({ roles: ['admin'] })
      .expect(400);
    expect(unknown.body.issues.map((i: { path: string }) => i.path)).toEqual(['roles.0']);
    const none = await patch(t, url).set(coordinator()).send({ roles: [] }).expect(400);
    expect(none.body.issues).toEqual([{ path: 'roles', message: 'choose at least one role' }]);
    expect(await storedRoles(w.team.id, target.id)).toEqual(['observer']);
  });

  it('PATCH and DELETE /api/teams/:teamId/members/:userId answer 404 for a user who is not in the team', async () => {
    const foreign = await member(['observer'], w.otherTeam);
    for (const userId of [foreign.id, randomUUID()]) {
      await patch(t, `/api/teams/${w.team.id}/members/${userId}`)
        .set(coordinator())
        .send({ roles: ['modeller'] })
        .expect(404);
      await del(t, `/api/teams/${w.team.id}/members/${userId}`).set(coordinator()).expect(404);
    }
    expect(await storedRoles(w.otherTeam.id, foreign.id)).toEqual(['observer']);
  });

  it('PATCH /api/teams/:teamId/members/:userId refuses with 409 to take the role of the last coordinator', async () => {
    const team = await t.createTeam();
    const only = await member(['coordinator', 'modeller'], team);
    const response = await patch(t, `/api/teams/${team.id}/members/${only.id}`)
      .set(admin())
      .send({ roles: ['modeller'] })
      .expect(409);
    expect(response.body.message).toBe(
      `${team.name} needs at least one coordinator: give another member the coordinator role first`,
    );
    expect(await storedRoles(team.id, only.id)).toEqual(['coordinator', 'modeller']);
    // Keeping the role while changing the others is fine.
    await patch(t, `/api/teams/${team.id}/members/${only.id}`)
      .set(admin())
      .send({ roles: ['coordinator'] })
      .expect(200);
    expect(await storedRoles(team.id, only.id)).toEqual(['coordinator']);
  });

  it('DELETE /api/teams/:teamId/members/:userId removes the member, unlinks their stations keeping the name, and audits', async () => {
    const team = w.team;
    const leaving = await member(['observer']);
    const eventId = await importExample(t, w);
    const station = async (observerName?: string): Promise<string> => {
      const response = await t
        .post(`/api/events/${eventId}/stations`)
        .set(coordinator())
        .send({
          code: `site-${randomUUID().slice(0, 8)}`,
          latDeg: -20,
          lonDeg: 70,
          heightM: 10,
          observerId: leaving.id,
          ...(observerName === undefined ? {} : { observerName }),
        })
        .expect(201);
      return (response.body as { id: string }).id;
    };
    const unnamed = await station();
    const named = await station('K. Aldana (club telescope)');
    const membership = await t.orm.em.fork().findOneOrFail(Membership, { team: team.id, user: leaving.id });

    await del(t, `/api/teams/${team.id}/members/${leaving.id}`).set(coordinator()).expect(204);

    expect(await storedRoles(team.id, leaving.id)).toBeNull();
    const stations = await t.orm.em.fork().find(Station, { id: { $in: [unnamed, named] } });
    const byId = new Map(stations.map((s) => [s.id, s]));
    expect(byId.get(unnamed)?.observer).toBeNull();
    expect(byId.get(unnamed)?.observerName).toBe(leaving.name);
    expect(byId.get(named)?.observer).toBeNull();
    expect(byId.get(named)?.observerName).toBe('K. Aldana (club telescope)');
    const entries = await t.orm.em
      .fork()
      .find(AuditEntry, { objectType: 'membership', objectId: membership.id });
    expect(entries).toHaveLength(1);
    expect(entries[0]).toMatchObject({
      teamId: team.id,
      eventId: null,
      actorId: w.userIds.coordinator,
      action: 'membership.remove',
    });
    expect(entries[0]?.detail).toEqual({
      userId: leaving.id,
      roles: ['observer'],
      stationIds: [unnamed, named].sort(),
    });
    const members = await t.get(`/api/teams/${team.id}/members`).set(coordinator()).expect(200);
    expect((members.body as Array<{ userId: string }>).map((m) => m.userId)).not.toContain(leaving.id);
  });

  it('DELETE /api/teams/:teamId/members/:userId refuses with 409 to remove the last coordinator', async () => {
    const team = await t.createTeam();
    const only = await member(['coordinator'], team);
    await member(['observer'], team);
    const response = await del(t, `/api/teams/${team.id}/members/${only.id}`).set(admin()).expect(409);
    expect(response.body.message).toBe(
      `${team.name} needs at least one coordinator: give another member the coordinator role first`,
    );
    expect(await storedRoles(team.id, only.id)).toEqual(['coordinator']);
  });

  // Without the row lock each request would see two coordinators and both changes would pass.
  it('PATCH and DELETE /api/teams/:teamId/members/:userId fired together never leave a team without a coordinator', async () => {
    const kinds = ['demote both', 'remove both', 'demote one, remove the other'] as const;
    for (const kind of kinds) {
      for (let round = 0; round < 4; round += 1) {
        const team = await t.createTeam();
        const first = await member(['coordinator', 'observer'], team);
        const second = await member(['coordinator', 'observer'], team);
        const demote = (userId: string) =>
          patch(t, `/api/teams/${team.id}/members/${userId}`)
            .set(admin())
            .send({ roles: ['observer'] });
        const remove = (userId: string) => del(t, `/api/teams/${team.id}/members/${userId}`).set(admin());
        const calls =
          kind === 'demote both'
            ? [demote(first.id), demote(second.id)]
            : kind === 'remove both'
              ? [remove(first.id), remove(second.id)]
              : [demote(first.id), remove(second.id)];
        const statuses = (await Promise.all(calls)).map((r) => r.status);
        expect(
          statuses.filter((s) => s === 409),
          `${kind}: ${statuses.join(', ')}`,
        ).toHaveLength(1);
        expect(statuses.filter((s) => s === 200 || s === 204)).toHaveLength(1);
        expect(await coordinatorsOf(team.id)).toBe(1);
      }
    }
  });
});
