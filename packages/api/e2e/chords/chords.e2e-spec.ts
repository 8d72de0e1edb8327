import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Chord } from '../../src/chords/entities/chord.entity';
import { bootTestApp, type TestApp } from '../setup';
import {
  createWorkspace,
  del,
  exampleEvent,
  importExample,
  patch,
  type Workspace,
} from '../events/workspace';

const HEADER =
  'station,type,disappearance_utc,disappearance_sigma_s,reappearance_utc,reappearance_sigma_s,start_utc,end_utc,time_offset_s';

describe('chord routes and the chord CSV import', () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;
  let stationA: string;
  let stationB: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
    const stations = exampleEvent().stations as Array<{ id: string }>;
    stationA = stations[0]?.id ?? '';
    stationB = stations[1]?.id ?? '';
  });
  afterAll(async () => {
    await t.close();
  });

  const count = () => t.orm.em.fork().count(Chord, { event: eventId });
  const sendCsv = (csv: string, query = '') =>
    t
      .post(`/api/events/${eventId}/chords/import${query}`)
      .set(w.auth('modeller'))
      .attach('file', Buffer.from(csv), { filename: 'chords.csv', contentType: 'text/csv' });

  it('POST /api/events/:eventId/chords/import with bad rows answers 400 per row and column, writing nothing', async () => {
    const before = await count();
    const csv = [
      HEADER,
      `${stationA},positive,2028-03-14T02:11:04Z,0.05,2028-03-14T02:11:20Z,0.05,,,`,
      `${stationB},positive,2028-03-14T02:11:04Z,-1,2028-03-14T02:11:20Z,0.05,,,`,
      `Nowhere,negative,,,,,2028-03-14T02:10:00Z,2028-03-14T02:13:00Z,`,
      `${stationB},negative,,,,,2028-03-14 02:10,2028-03-14T02:13:00Z,`,
    ].join('\n');
    const response = await sendCsv(csv).expect(400);
    const issues = (response.body as { issues: Array<{ row: number; column: string; message: string }> })
      .issues;
    expect(issues.map((i) => [i.row, i.column])).toEqual([
      [3, 'disappearance_sigma_s'],
      [4, 'station'],
      [5, 'start_utc'],
    ]);
    expect(await count()).toBe(before);
  });

  it('POST /api/events/:eventId/chords/import?preview=1 returns the parsed rows and writes nothing', async () => {
    const before = await count();
    const csv = `${HEADER}\n${stationA},negative,,,,,2028-03-14T02:10:00Z,2028-03-14T02:13:00Z,0.2\n`;
    const response = await sendCsv(csv, '?preview=1').expect(200);
    expect((response.body as { chords: unknown[] }).chords).toEqual([
      {
        station: stationA,
        type: 'negative',
        start: '2028-03-14T02:10:00Z',
        end: '2028-03-14T02:13:00Z',
        timeOffsetSeconds: 0.2,
      },
    ]);
    expect(await count()).toBe(before);
  });

  it('POST /api/events/:eventId/chords/import stores every good row', async () => {
    const before = await count();
    const csv = [
      HEADER,
      `${stationA},positive,2028-03-14T02:11:04Z,0.05,2028-03-14T02:11:20Z,0.05,,,`,
      `${stationB},negative,,,,,2028-03-14T02:10:00Z,2028-03-14T02:13:00Z,`,
    ].join('\r\n');
    const response = await sendCsv(csv).expect(201);
    expect((response.body as { ids: string[] }).ids).toHaveLength(2);
    expect(await count()).toBe(before + 2);
    const stored = await t.orm.em
      .fork()
      .findOneOrFail(Chord, { id: (response.body as { ids: string[] }).ids[0] ?? '' });
    expect(stored.source).toBe('csv');
    expect(stored.disappearance).toEqual({ time: '2028-03-14T02:11:04Z', sigmaSeconds: 0.05 });
  });

  it("PATCH /api/chords/:chordId makes an imported chord 'manual' once its times change, not for a clock offset", async () => {
    const list = await t.get(`/api/events/${eventId}/chords`).set(w.auth('modeller')).expect(200);
    const imported = (
      list.body as Array<{ id: string; station: string; source: string; timingId: null }>
    ).find((c) => c.station === 'cinder-hill');
    expect(imported).toMatchObject({ source: 'import', timingId: null });
    const id = imported?.id ?? '';
    const offset = await patch(t, `/api/chords/${id}`)
      .set(w.auth('modeller'))
      .send({ timeOffsetSeconds: -0.1 })
      .expect(200);
    expect((offset.body as { source: string }).source).toBe('import');
    const edited = await patch(t, `/api/chords/${id}`)
      .set(w.auth('modeller'))
      .send({ reappearance: { time: '2028-03-14T02:14:21.990Z', sigmaSeconds: 0.04 } })
      .expect(200);
    expect((edited.body as { source: string }).source).toBe('manual');
    expect((await t.orm.em.fork().findOneOrFail(Chord, { id })).source).toBe('manual');
  });

  it('POST, PATCH and DELETE on chords validate against the event file chord schema', async () => {
    const created = await t
      .post(`/api/events/${eventId}/chords`)
      .set(w.auth('coordinator'))
      .send({
        station: stationA,
        type: 'negative',
        start: '2028-03-14T02:10:00Z',
        end: '2028-03-14T02:12:00Z',
      })
      .expect(201);
    const id = (created.body as { id: string }).id;
    const bad = await patch(t, `/api/chords/${id}`)
      .set(w.auth('modeller'))
      .send({ end: '2028-03-14T02:09:00Z' })
      .expect(400);
    expect((bad.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual(['end']);
    const good = await patch(t, `/api/chords/${id}`)
      .set(w.auth('modeller'))
      .send({ timeOffsetSeconds: 0.5 })
      .expect(200);
    expect((good.body as { timeOffsetSeconds: number; end: string }).timeOffsetSeconds).toBe(0.5);
    await t
      .post(`/api/events/${eventId}/chords`)
      .set(w.auth('coordinator'))
      .send({
        station: 'Nowhere',
        type: 'negative',
        start: '2028-03-14T02:10:00Z',
        end: '2028-03-14T02:12:00Z',
      })
      .expect(400);
    await del(t, `/api/chords/${id}`).set(w.auth('observer')).expect(403);
    await del(t, `/api/chords/${id}`).set(w.auth('outsider')).expect(404);
    await del(t, `/api/chords/${id}`).set(w.auth('modeller')).expect(204);
    expect(await t.orm.em.fork().count(Chord, { id })).toBe(0);
    const list = await t.get(`/api/events/${eventId}/chords`).set(w.auth('observer')).expect(200);
    expect(list.body).toHaveLength(await count());
  });

  describe('single-edge positive chords', () => {
    const lateStart = (station: string) => ({
      station,
      type: 'positive',
      reappearance: { time: '2028-03-14T02:14:20.000Z', sigmaSeconds: 0.05 },
    });

    it('POST /api/events/:eventId/chords stores a positive chord with one edge and refuses one with none at chords[i]', async () => {
      const created = await t
        .post(`/api/events/${eventId}/chords`)
        .set(w.auth('modeller'))
        .send(lateStart(stationA))
        .expect(201);
      const body = created.body as { id: string; disappearance: unknown; reappearance: unknown };
      expect(body.disappearance).toBeNull();
      expect(body.reappearance).toEqual({ time: '2028-03-14T02:14:20.000Z', sigmaSeconds: 0.05 });
      const stored = await t.orm.em.fork().findOneOrFail(Chord, { id: body.id });
      expect(stored.disappearance).toBeNull();
      // The event file the fits read gives the chord without the edge it lacks.
      const exported = await t.get(`/api/events/${eventId}/export`).set(w.auth('modeller')).expect(200);
      const file = JSON.parse(exported.text) as { chords: Array<Record<string, unknown>> };
      const last = file.chords[file.chords.length - 1];
      expect(last).toEqual({ ...lateStart(stationA), timeOffsetSeconds: 0 });
      const before = await count();
      const none = await t
        .post(`/api/events/${eventId}/chords`)
        .set(w.auth('modeller'))
        .send({ station: stationA, type: 'positive' })
        .expect(400);
      expect((none.body as { issues: unknown }).issues).toEqual([
        {
          path: `chords[${before}]`,
          message: 'a positive chord needs a disappearance, a reappearance or both',
        },
      ]);
      expect(await count()).toBe(before);
    });

    it('PATCH /api/chords/:chordId drops an edge given as null, and refuses to drop the last one at chords[i]', async () => {
      const created = await t
        .post(`/api/events/${eventId}/chords`)
        .set(w.auth('modeller'))
        .send({
          ...lateStart(stationB),
          disappearance: { time: '2028-03-14T02:14:01.000Z', sigmaSeconds: 0.05 },
        })
        .expect(201);
      const id = (created.body as { id: string }).id;
      const list = await t.get(`/api/events/${eventId}/chords`).set(w.auth('modeller')).expect(200);
      const index = (list.body as Array<{ id: string }>).findIndex((c) => c.id === id);
      const dropped = await patch(t, `/api/chords/${id}`)
        .set(w.auth('modeller'))
        .send({ disappearance: null })
        .expect(200);
      expect((dropped.body as { disappearance: unknown }).disappearance).toBeNull();
      expect((await t.orm.em.fork().findOneOrFail(Chord, { id })).disappearance).toBeNull();
      const none = await patch(t, `/api/chords/${id}`)
        .set(w.auth('modeller'))
        .send({ reappearance: null })
        .expect(400);
      expect((none.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual([
        `chords[${index}]`,
      ]);
      expect((await t.orm.em.fork().findOneOrFail(Chord, { id })).reappearance).not.toBeNull();
    });

    it('POST /api/events/:eventId/chords/import reads a single-edge row and names the row of an edgeless one', async () => {
      const before = await count();
      const bad = await sendCsv([HEADER, `${stationA},positive,,,,,,,`].join('\n')).expect(400);
      expect((bad.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual(['row 2']);
      const good = await sendCsv(
        [HEADER, `${stationA},positive,2028-03-14T02:14:01.500Z,0.06,,,,,`].join('\n'),
      ).expect(201);
      const stored = await t.orm.em
        .fork()
        .findOneOrFail(Chord, { id: (good.body as { ids: string[] }).ids[0] ?? '' });
      expect(stored.disappearance).toEqual({ time: '2028-03-14T02:14:01.500Z', sigmaSeconds: 0.06 });
      expect(stored.reappearance).toBeNull();
      expect(await count()).toBe(before + 1);
    });

    it('POST /api/events/import refuses a positive chord with neither edge at chords[i]', async () => {
      const file = exampleEvent() as { chords: Array<Record<string, unknown>> };
      const index = file.chords.findIndex((c) => c.type === 'positive');
      const { disappearance: _d, reappearance: _r, ...edgeless } = file.chords[index] ?? {};
      file.chords[index] = edgeless;
      const response = await t
        .post('/api/events/import')
        .set(w.auth('coordinator'))
        .field('teamId', w.team.id)
        .attach('file', Buffer.from(JSON.stringify(file)), {
          filename: 'event.json',
          contentType: 'application/json',
        })
        .expect(400);
      expect((response.body as { issues: unknown }).issues).toEqual([
        {
          path: `chords[${index}]`,
          message: 'a positive chord needs a disappearance, a reappearance or both',
        },
      ]);
    });
  });
});
