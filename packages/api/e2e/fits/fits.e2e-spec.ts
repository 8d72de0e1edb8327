import type { INestApplicationContext } from '@nestjs/common';
import { solveEvent, type Solution } from '@limbus/geometry';
import { validateEventFile } from '@limbus/schema';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { sha256Hex } from '../../src/common/tokens';
import { bootTestApp, type TestApp } from '../setup';
import { createWorkspace, exampleEvent, importExample, patch, type Workspace } from '../events/workspace';
import { bootWorker } from './worker';

interface FitBody {
  id: string;
  state: string;
  progress: number;
  error: string | null;
  solution: Solution | null;
  createdBy: { id: string };
}

describe('fit routes and the fit worker', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext;
  let eventId: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    worker = await bootWorker(t.config);
    eventId = await importExample(t, w);
  });
  afterAll(async () => {
    await worker.close();
    await t.close();
  });

  const submit = (options: Record<string, unknown> = {}, key?: string) => {
    const req = t.post(`/api/events/${eventId}/fits`).set(w.auth('modeller'));
    if (key) req.set('Idempotency-Key', key);
    return req.send({ options });
  };

  const waitFinished = async (fitId: string): Promise<FitBody> => {
    const deadline = Date.now() + 30_000;
    for (;;) {
      const body = (await t.get(`/api/fits/${fitId}`).set(w.auth('observer')).expect(200)).body as FitBody;
      if (body.state === 'solved' || body.state === 'failed' || Date.now() > deadline) return body;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  };

  it('POST /api/events/:eventId/fits queues a fit that the worker solves exactly as solveEvent does', async () => {
    const response = await submit().expect(202);
    const fitId = (response.body as { id: string }).id;
    const done = await waitFinished(fitId);
    expect(done.state).toBe('solved');
    expect(done.progress).toBe(100);
    expect(done.createdBy.id).toBe(w.userIds.modeller);
    const stored = await t.orm.em.fork().findOneOrFail(FitRun, { id: fitId });
    expect(sha256Hex(stored.input)).toBe(stored.inputSha256);
    const validation = validateEventFile(JSON.parse(stored.input));
    if (!validation.ok) throw new Error('stored input does not validate');
    // The same engine on the same snapshot is deterministic (seeded), so the worker's answer is exact.
    expect(done.solution).toEqual(
      JSON.parse(JSON.stringify(solveEvent(validation.event, { inputSha256: stored.inputSha256 }))),
    );
    expect(done.solution?.engine.inputSha256).toBe(stored.inputSha256);
    const mails = await t.mailTo(
      (await t.orm.em.fork().findOneOrFail(FitRun, { id: fitId }, { populate: ['createdBy'] })).createdBy
        .email,
    );
    const notice = mails.find((m) => m.subject.startsWith('Fit solved'));
    expect(notice?.text).toContain(`/events/${eventId}/fits/${fitId}`);
  });

  it('POST /api/events/:eventId/fits takes the snapshot at submit time', async () => {
    const response = await submit().expect(202);
    const fitId = (response.body as { id: string }).id;
    await patch(t, `/api/events/${eventId}`)
      .set(w.auth('coordinator'))
      .send({ title: 'Retitled later' })
      .expect(200);
    const stored = await t.orm.em.fork().findOneOrFail(FitRun, { id: fitId });
    expect((JSON.parse(stored.input) as { title: string }).title).toBe(exampleEvent().title);
    await patch(t, `/api/events/${eventId}`)
      .set(w.auth('coordinator'))
      .send({ title: exampleEvent().title as string })
      .expect(200);
    await waitFinished(fitId);
  });

  it('POST /api/events/:eventId/fits overlays options key by key on the defaults and names a bad one', async () => {
    const response = await submit({ limb: { modelErrorKm: 3 }, seed: 11 }).expect(202);
    const stored = await t.orm.em.fork().findOneOrFail(FitRun, { id: (response.body as { id: string }).id });
    const fit = (JSON.parse(stored.input) as { fit: unknown }).fit;
    expect(fit).toEqual({
      limb: { fixed: {}, modelErrorKm: 3, fitTimeOffsets: [] },
      ring: { centerFrom: 'limb' },
      seed: 11,
    });
    expect(stored.seed).toBe(11);
    const bad = await submit({ limb: { modelErrorKm: -1 }, ring: { centerFrom: 'nowhere' } }).expect(400);
    expect((bad.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path).sort()).toEqual([
      'options.limb.modelErrorKm',
      'options.ring.centerFrom',
    ]);
    await waitFinished((response.body as { id: string }).id);
  });

  it('POST /api/events/:eventId/fits with the same Idempotency-Key returns the same fit once', async () => {
    const key = `retry-${Date.now()}`;
    const [a, b] = await Promise.all([submit({}, key).expect(202), submit({}, key).expect(202)]);
    const c = await submit({}, key).expect(202);
    const id = (a.body as { id: string }).id;
    expect((b.body as { id: string }).id).toBe(id);
    expect((c.body as { id: string }).id).toBe(id);
    expect(await t.orm.em.fork().count(FitRun, { idempotencyKey: key })).toBe(1);
    await waitFinished(id);
  });

  it('POST /api/events/:eventId/fits is for modellers and coordinators only', async () => {
    await t.post(`/api/events/${eventId}/fits`).set(w.auth('observer')).send({ options: {} }).expect(403);
    await t.post(`/api/events/${eventId}/fits`).set(w.auth('reviewer')).send({ options: {} }).expect(403);
    await t.post(`/api/events/${eventId}/fits`).set(w.auth('outsider')).send({ options: {} }).expect(404);
    await t.post(`/api/events/${eventId}/fits`).send({ options: {} }).expect(401);
    await t.post(`/api/events/${eventId}/fits`).set(w.auth('modeller')).send({ options: 'all' }).expect(400);
  });

  it('a fit the geometry rejects ends failed with the path and reason, and the author is told', async () => {
    const file = exampleEvent();
    file.chords = (file.chords as Array<{ type: string }>).filter((c) => c.type === 'negative');
    const negativeStation = (file.chords as Array<{ station: string }>)[0]?.station;
    file.ringEvents = [];
    file.fit = { limb: { fitTimeOffsets: [negativeStation] } };
    const id = await importExample(t, w, file);
    const response = await t.post(`/api/events/${id}/fits`).set(w.auth('coordinator')).send({}).expect(202);
    const done = await waitFinished((response.body as { id: string }).id);
    expect(done.state).toBe('failed');
    expect(done.error).toBe('fit.limb.fitTimeOffsets: clock offsets can only be fitted with positive chords');
    expect(done.solution).toBeNull();
  });

  it('GET /api/fits/:fitId/events streams progress and state until solved, with a stream ticket in the query', async () => {
    const fitId = ((await submit().expect(202)).body as { id: string }).id;
    const ticket = (
      (await t.post(`/api/fits/${fitId}/stream-ticket`).set(w.auth('observer')).expect(201)).body as {
        ticket: string;
      }
    ).ticket;
    const response = await t
      .get(`/api/fits/${fitId}/events?ticket=${ticket}`)
      .buffer(true)
      .parse((res, callback) => {
        let text = '';
        res.on('data', (chunk: Buffer) => (text += chunk.toString()));
        res.on('end', () => callback(null, text));
      })
      .expect(200);
    expect(response.headers['content-type']).toContain('text/event-stream');
    const events = String(response.body)
      .split('\n\n')
      .filter((block) => block.includes('event:'))
      .map((block) => {
        const type = /event: (\w+)/.exec(block)?.[1];
        const data = JSON.parse(/data: (.*)/.exec(block)?.[1] ?? 'null') as Record<string, unknown>;
        return { type, data };
      });
    expect(events.at(-1)).toEqual({ type: 'state', data: { state: 'solved' } });
    expect(events.filter((e) => e.type === 'progress').at(-1)).toEqual({
      type: 'progress',
      data: { progress: 100 },
    });
    await t.get(`/api/fits/${fitId}/events`).expect(401);
    await t.post(`/api/fits/${fitId}/stream-ticket`).set(w.auth('outsider')).expect(404);
  });

  it('GET /api/events/:eventId/fits lists the fits newest first without solutions', async () => {
    const list = await t.get(`/api/events/${eventId}/fits`).set(w.auth('reviewer')).expect(200);
    const fits = list.body as Array<Record<string, unknown>>;
    expect(fits.length).toBeGreaterThanOrEqual(4);
    expect(fits.every((f) => !('solution' in f))).toBe(true);
    const times = fits.map((f) => String(f.createdAt));
    expect([...times].sort().reverse()).toEqual(times);
  });
});
