import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { EventDetail } from '../../src/events/events.service';
import { bootTestApp, type TestApp } from '../setup';
import { createWorkspace, del, importExample, patch, type Workspace } from './workspace';

// GET /api/events/:eventId answers from a per-process cache checked against events.revision, which
// database triggers raise. Each test warms the cache, writes one way, and reads again.
describe('GET /api/events/:eventId after writes (detail cache)', () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
  });
  afterAll(async () => t.close());

  const detail = async (): Promise<EventDetail> =>
    (await t.get(`/api/events/${eventId}`).set(w.auth('modeller')).expect(200)).body as EventDetail;
  const sql = (statement: string, params: unknown[]) => t.orm.em.getConnection().execute(statement, params);
  const revision = async (): Promise<number> => {
    const [row] = await sql('select `revision` from `events` where `id` = ?', [eventId]);
    return Number((row as { revision: number }).revision);
  };

  it('shows an edited title, station and chord at once', async () => {
    const before = await detail();
    await patch(t, `/api/events/${eventId}`)
      .set(w.auth('coordinator'))
      .send({ title: 'Renamed night' })
      .expect(200);
    expect((await detail()).title).toBe('Renamed night');

    const station = before.stations[0];
    await patch(t, `/api/events/${eventId}/stations/${station?.id ?? ''}`)
      .set(w.auth('coordinator'))
      .send({ heightM: 1234 })
      .expect(200);
    expect((await detail()).stations.find((s) => s.id === station?.id)?.heightM).toBe(1234);

    const chord = before.chords[0];
    await patch(t, `/api/chords/${chord?.id ?? ''}`)
      .set(w.auth('modeller'))
      .send({ timeOffsetSeconds: 0.25 })
      .expect(200);
    expect((await detail()).chords.find((c) => c.id === chord?.id)?.timeOffsetSeconds).toBe(0.25);
  });

  it('loses a removed station and the chords and ring events that hung on it', async () => {
    const before = await detail();
    const created = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: 'Short-lived', latDeg: 1, lonDeg: 2, heightM: 3 })
      .expect(201);
    const id = (created.body as { id: string }).id;
    expect((await detail()).stations.map((s) => s.id)).toContain(id);
    await del(t, `/api/events/${eventId}/stations/${id}`).set(w.auth('coordinator')).expect(204);
    expect((await detail()).stations.map((s) => s.id)).toEqual(before.stations.map((s) => s.id));
  });

  it('sees a write made outside this process, straight in the database', async () => {
    const before = await detail();
    const ring = before.ringEvents[0];
    expect(ring).toBeDefined();
    const start = await revision();
    await sql('update `ring_events` set `ring` = ? where `id` = ?', ['outer', ring?.id]);
    expect(await revision()).toBeGreaterThan(start);
    expect((await detail()).ringEvents.find((r) => r.id === ring?.id)?.ring).toBe('outer');

    const chord = before.chords[1];
    await sql('delete from `chords` where `id` = ?', [chord?.id]);
    expect((await detail()).chords.map((c) => c.id)).not.toContain(chord?.id);

    await sql('update `stations` set `observer_name` = ? where `id` = ?', [
      'Ada Quill',
      before.stations[1]?.id,
    ]);
    expect((await detail()).stations[1]?.observerName).toBe('Ada Quill');
  });

  it('answers 404 once the event is deleted and the full view again once it is restored', async () => {
    const before = await detail();
    await del(t, `/api/events/${eventId}`).set(w.auth('coordinator')).expect(204);
    await t.get(`/api/events/${eventId}`).set(w.auth('modeller')).expect(404);
    await t.post(`/api/events/${eventId}/restore`).set(w.auth('coordinator')).expect(200);
    expect(await detail()).toEqual({ ...before, updatedAt: expect.any(String) as unknown });
  });
});
