import type { Server } from 'node:http';
import request from 'supertest';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Team } from '../../src/teams/entities/team.entity';
import type { TeamRole } from '../../src/teams/roles';
import type { TestApp } from '../setup';

/** The invented example event of docs/examples (11 stations, a ring), as its file's text. */
export const EXAMPLE_EVENT_TEXT = readFileSync(
  path.resolve(__dirname, '../../../../docs/examples/event-example.json'),
  'utf8',
);

export function exampleEvent(): Record<string, unknown> {
  return JSON.parse(EXAMPLE_EVENT_TEXT) as Record<string, unknown>;
}

export type Actor = 'admin' | TeamRole | 'outsider' | 'anonymous';

export interface Workspace {
  team: Team;
  otherTeam: Team;
  tokens: Record<Actor, string>;
  userIds: Record<Actor, string>;
  auth(actor: Actor): Record<string, string>;
}

/** One team with a user per role, a site admin, and a coordinator of another team ("outsider"). */
export async function createWorkspace(t: TestApp): Promise<Workspace> {
  const team = await t.createTeam();
  const otherTeam = await t.createTeam();
  const tokens = { anonymous: '' } as Record<Actor, string>;
  const userIds = { anonymous: '' } as Record<Actor, string>;
  for (const role of ['coordinator', 'observer', 'modeller', 'reviewer'] as const) {
    const { user, email, password } = await t.createUser({ teams: [{ team, roles: [role] }] });
    tokens[role] = await t.signIn(email, password);
    userIds[role] = user.id;
  }
  const admin = await t.createUser({ isAdmin: true });
  tokens.admin = await t.signIn(admin.email, admin.password);
  userIds.admin = admin.user.id;
  const outsider = await t.createUser({
    teams: [{ team: otherTeam, roles: ['coordinator', 'modeller', 'reviewer'] }],
  });
  tokens.outsider = await t.signIn(outsider.email, outsider.password);
  userIds.outsider = outsider.user.id;
  return {
    team,
    otherTeam,
    tokens,
    userIds,
    auth: (actor): Record<string, string> =>
      actor === 'anonymous' ? {} : { Authorization: `Bearer ${tokens[actor]}` },
  };
}

/**
 * Imports an event file as the workspace's coordinator. Without `bodyName` the event goes to the team's
 * only body (an "Unassigned" one made on the first import).
 */
export async function importExample(
  t: TestApp,
  w: Workspace,
  file: Record<string, unknown> = exampleEvent(),
  options: { bodyName?: string } = {},
): Promise<string> {
  const form = t.post('/api/events/import').set(w.auth('coordinator')).field('teamId', w.team.id);
  if (options.bodyName !== undefined) void form.field('bodyName', options.bodyName);
  const response = await form
    .attach('file', Buffer.from(JSON.stringify(file)), {
      filename: 'event.json',
      contentType: 'application/json',
    })
    .expect(201);
  return (response.body as { id: string }).id;
}

/** TestApp has get and post only; these add the other verbs with the same client address. */
export function patch(t: TestApp, url: string): request.Test {
  return request(t.app.getHttpServer() as Server)
    .patch(url)
    .set('X-Forwarded-For', t.address);
}

export function del(t: TestApp, url: string): request.Test {
  return request(t.app.getHttpServer() as Server)
    .delete(url)
    .set('X-Forwarded-For', t.address);
}
