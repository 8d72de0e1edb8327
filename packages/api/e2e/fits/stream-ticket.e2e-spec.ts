import type { INestApplicationContext } from '@nestjs/common';
import type { Redis } from 'ioredis';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sha256Hex } from '../../src/common/tokens';
import { REDIS } from '../../src/redis/redis.module';
import { bootTestApp, type TestApp } from '../setup';
import { type Actor, createWorkspace, importExample, type Workspace } from '../events/workspace';
import { bootWorker, fitWhenFinished } from './worker';

const KEY_PREFIX = 'limbus:fit-stream-ticket:';

interface StreamEvent {
  type: string | undefined;
  data: Record<string, unknown>;
}

describe('the fit progress stream and its one-time tickets', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext;
  let redis: Redis;
  let fitId: string;
  let otherFitId: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    worker = await bootWorker(t.config);
    redis = t.app.get<Redis>(REDIS);
    const eventId = await importExample(t, w);
    const submit = async () =>
      (
        (await t.post(`/api/events/${eventId}/fits`).set(w.auth('modeller')).send({}).expect(202)).body as {
          id: string;
        }
      ).id;
    fitId = await submit();
    otherFitId = await submit();
    expect((await fitWhenFinished(t, fitId)).state).toBe('solved');
    expect((await fitWhenFinished(t, otherFitId)).state).toBe('solved');
  });
  afterAll(async () => {
    await worker.close();
    await t.close();
  });

  const ticketFor = async (actor: Actor, id = fitId): Promise<string> =>
    (
      (await t.post(`/api/fits/${id}/stream-ticket`).set(w.auth(actor)).expect(201)).body as {
        ticket: string;
      }
    ).ticket;

  const open = (query: string, id = fitId) =>
    t
      .get(`/api/fits/${id}/events${query}`)
      .buffer(true)
      .parse((res, callback) => {
        let text = '';
        res.on('data', (chunk: Buffer) => (text += chunk.toString()));
        res.on('end', () => callback(null, text));
      });

  const eventsOf = (body: unknown): StreamEvent[] =>
    String(body)
      .split('\n\n')
      .filter((block) => block.includes('event:'))
      .map((block) => ({
        type: /event: (\w+)/.exec(block)?.[1],
        data: JSON.parse(/data: (.*)/.exec(block)?.[1] ?? 'null') as Record<string, unknown>,
      }));

  it('POST /api/fits/:fitId/stream-ticket answers a ticket valid 60 s, kept in Redis only as its SHA-256', async () => {
    const response = await t.post(`/api/fits/${fitId}/stream-ticket`).set(w.auth('observer')).expect(201);
    const { ticket, expiresInSeconds } = response.body as { ticket: string; expiresInSeconds: number };
    expect(expiresInSeconds).toBe(60);
    expect(ticket).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const key = KEY_PREFIX + sha256Hex(ticket);
    expect(JSON.parse((await redis.get(key)) ?? 'null')).toEqual({ userId: w.userIds.observer, fitId });
    const ttl = await redis.ttl(key);
    expect(ttl).toBeGreaterThan(50);
    expect(ttl).toBeLessThanOrEqual(60);
    expect(await redis.exists(KEY_PREFIX + ticket)).toBe(0);
  });

  it('GET /api/fits/:fitId/events?ticket= streams progress and state until solved, and takes the ticket', async () => {
    const ticket = await ticketFor('observer');
    const response = await open(`?ticket=${ticket}`).expect(200);
    expect(response.headers['content-type']).toContain('text/event-stream');
    const events = eventsOf(response.body);
    expect(events.at(-1)).toEqual({ type: 'state', data: { state: 'solved' } });
    expect(events.filter((e) => e.type === 'progress').at(-1)).toEqual({
      type: 'progress',
      data: { progress: 100 },
    });
    expect(await redis.exists(KEY_PREFIX + sha256Hex(ticket))).toBe(0);
  });

  it('GET /api/fits/:fitId/events answers 401 to a used ticket', async () => {
    const ticket = await ticketFor('modeller');
    await open(`?ticket=${ticket}`).expect(200);
    const again = await open(`?ticket=${ticket}`).expect(401);
    expect(again.body).toContain('unknown, used, expired or for another fit');
  });

  it('GET /api/fits/:fitId/events answers 401 without a ticket, with an unknown one, or with an access token', async () => {
    await t.get(`/api/fits/${fitId}/events`).expect(401);
    await t.get(`/api/fits/${fitId}/events?ticket=`).expect(401);
    await t.get(`/api/fits/${fitId}/events?ticket=made-up`).expect(401);
    await t.get(`/api/fits/${fitId}/events?access_token=${w.tokens.observer}`).expect(401);
    await t.get(`/api/fits/${fitId}/events?ticket=made-up`).set(w.auth('observer')).expect(401);
  });

  it('GET /api/fits/:fitId/events answers 401 to a ticket of another fit, which that try spends', async () => {
    const ticket = await ticketFor('reviewer', otherFitId);
    await open(`?ticket=${ticket}`, fitId).expect(401);
    await open(`?ticket=${ticket}`, otherFitId).expect(401);
  });

  it('GET /api/fits/:fitId/events answers 401 to an expired ticket', async () => {
    const ticket = await ticketFor('coordinator');
    // Redis expires the key; shortening its life stands in for waiting a minute.
    await redis.pexpire(KEY_PREFIX + sha256Hex(ticket), 1);
    await new Promise((resolve) => setTimeout(resolve, 20));
    await open(`?ticket=${ticket}`).expect(401);
  });

  // The rows of docs/authorization.md "fit progress stream", cell by cell.
  it('POST /api/fits/:fitId/stream-ticket answers each role as docs/authorization.md says', async () => {
    const actors: Actor[] = [
      'admin',
      'coordinator',
      'observer',
      'modeller',
      'reviewer',
      'outsider',
      'anonymous',
    ];
    const got: Record<string, number> = {};
    for (const actor of actors)
      got[actor] = (await t.post(`/api/fits/${fitId}/stream-ticket`).set(w.auth(actor))).status;
    expect(got).toEqual({
      admin: 201,
      coordinator: 201,
      observer: 201,
      modeller: 201,
      reviewer: 201,
      outsider: 404,
      anonymous: 401,
    });
  });

  it('GET /api/fits/:fitId/events?ticket= opens with the ticket of each member, no access token needed', async () => {
    const got: Record<string, number> = {};
    for (const actor of ['admin', 'coordinator', 'observer', 'modeller', 'reviewer'] as const) {
      const ticket = await ticketFor(actor);
      got[actor] = (await open(`?ticket=${ticket}`)).status;
    }
    expect(got).toEqual({ admin: 200, coordinator: 200, observer: 200, modeller: 200, reviewer: 200 });
  });
});
