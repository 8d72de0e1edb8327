// Issue 13, item 9: an event holds at most EVENT_SIZE_LIMITS stations, chords and ring events, on every
// route that adds them (file import, chord CSV import, single adds, report accepts), also when requests
// race; the events list stays the same size whatever an event holds. Large events are made by SQL, not
// by thousands of requests.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EVENT_SIZE_LIMITS } from '@limbus/schema';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { Report } from '../../src/reports/entities/report.entity';
import { createWorkspace, exampleEvent, importExample, patch, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';

interface Refusal {
  issues: Array<{ path: string; message: string }>;
}
type Kind = keyof typeof EVENT_SIZE_LIMITS;

describe('the size limits of one event', () => {
  let t: TestApp;
  let w: Workspace;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
  });
  afterAll(async () => {
    await t.close();
  });

  async function count(kind: Kind, eventId: string): Promise<number> {
    const table = { stations: 'stations', chords: 'chords', ringEvents: 'ring_events' }[kind];
    const [row] = await t.orm.em
      .getConnection()
      .execute<Array<{ n: number | string }>>(
        `select count(*) as n from \`${table}\` where \`event_id\` = ?`,
        [eventId],
      );
    return Number(row?.n ?? 0);
  }

  /** Tops the event up to `total` rows of one kind with generated rows (MariaDB's seq_1_to_N table). */
  async function fill(eventId: string, kind: Kind, total: number): Promise<void> {
    const missing = total - (await count(kind, eventId));
    if (missing <= 0) return;
    const connection = t.orm.em.getConnection();
    const [first] = await connection.execute<Array<{ id: string }>>(
      'select `id` from `stations` where `event_id` = ? order by `position` limit 1',
      [eventId],
    );
    const stationId = first?.id ?? '';
    const seq = `seq_1_to_${missing}`;
    if (kind === 'stations')
      await connection.execute(
        'insert into `stations` (`id`, `event_id`, `code`, `lat_deg`, `lon_deg`, `height_m`, `position`) ' +
          `select uuid(), ?, concat('generated-', seq), -24, 77, 300, 1000 + seq from ${seq}`,
        [eventId],
      );
    else if (kind === 'chords')
      await connection.execute(
        'insert into `chords` (`id`, `event_id`, `station_id`, `type`, `start_utc`, `end_utc`, `source`, ' +
          '`position`, `created_at`, `updated_at`) ' +
          `select uuid(), ?, ?, 'negative', '2028-03-14T02:10:00.000Z', '2028-03-14T02:18:00.000Z', 'csv', ` +
          `1000 + seq, utc_timestamp(), utc_timestamp() from ${seq}`,
        [eventId, stationId],
      );
    else
      await connection.execute(
        'insert into `ring_events` (`id`, `event_id`, `station_id`, `ring`, `start`, `end`, `position`) ' +
          `select uuid(), ?, ?, 'R1', '{"time":"2028-03-14T02:13:48.880Z","sigmaSeconds":0.04}', ` +
          `'{"time":"2028-03-14T02:13:49.180Z","sigmaSeconds":0.04}', 1000 + seq from ${seq}`,
        [eventId, stationId],
      );
    expect(await count(kind, eventId)).toBe(total);
  }

  function importFile(file: Record<string, unknown>) {
    return t
      .post('/api/events/import')
      .set(w.auth('coordinator'))
      .field('teamId', w.team.id)
      .attach('file', Buffer.from(JSON.stringify(file)), {
        filename: 'event.json',
        contentType: 'application/json',
      });
  }

  function expectRefusal(res: { status: number; body: unknown }, path: Kind): void {
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    const issue = (res.body as Refusal).issues.find((i) => i.path === path);
    expect(issue?.message).toContain(String(EVENT_SIZE_LIMITS[path]));
  }

  it('POST /api/events/import refuses a file over any of the three limits, naming the list and the limit', async () => {
    const base = exampleEvent();
    const chords = base.chords as Array<Record<string, unknown>>;
    const rings = base.ringEvents as Array<Record<string, unknown>>;
    const stations = base.stations as Array<Record<string, unknown>>;
    const negative = chords.find((c) => c.type === 'negative') ?? {};
    const overfull: Array<[Kind, Record<string, unknown>]> = [
      [
        'stations',
        {
          ...base,
          stations: [
            ...stations,
            ...Array.from({ length: EVENT_SIZE_LIMITS.stations + 1 - stations.length }, (_, k) => ({
              id: `generated-${k}`,
              latDeg: -24,
              lonDeg: 77,
              heightM: 300,
            })),
          ],
        },
      ],
      [
        'chords',
        { ...base, chords: [...chords, ...Array.from({ length: EVENT_SIZE_LIMITS.chords }, () => negative)] },
      ],
      [
        'ringEvents',
        { ...base, ringEvents: Array.from({ length: EVENT_SIZE_LIMITS.ringEvents + 1 }, () => rings[0]) },
      ],
    ];
    const before = await t.orm.em.fork().count(OccultationEvent, { team: w.team.id });
    for (const [kind, file] of overfull) expectRefusal(await importFile(file), kind);
    expect(await t.orm.em.fork().count(OccultationEvent, { team: w.team.id })).toBe(before);
    // Exactly at the limit is fine.
    await importFile({
      ...base,
      ringEvents: Array.from({ length: EVENT_SIZE_LIMITS.ringEvents }, () => rings[0]),
    }).expect(201);
  });

  describe('an event filled to its limits by SQL', () => {
    let eventId: string;
    let harrowId: string;
    let juniperId: string;

    beforeAll(async () => {
      eventId = await importExample(t, w);
      const harrow = await t
        .post(`/api/events/${eventId}/stations`)
        .set(w.auth('coordinator'))
        .send({
          code: 'Harrow Fell',
          latDeg: -24.3,
          lonDeg: 77.7,
          heightM: 300,
          observerId: w.userIds.observer,
        })
        .expect(201);
      harrowId = (harrow.body as { id: string }).id;
      const detail = await t.get(`/api/events/${eventId}`).set(w.auth('coordinator')).expect(200);
      juniperId =
        (detail.body as { stations: Array<{ id: string; code: string }> }).stations.find(
          (s) => s.code === 'juniper-flat',
        )?.id ?? '';
      await patch(t, `/api/events/${eventId}/stations/${juniperId}`)
        .set(w.auth('coordinator'))
        .send({ observerId: w.userIds.observer })
        .expect(200);
      await fill(eventId, 'stations', EVENT_SIZE_LIMITS.stations);
      await fill(eventId, 'chords', EVENT_SIZE_LIMITS.chords);
      await fill(eventId, 'ringEvents', EVENT_SIZE_LIMITS.ringEvents);
    });

    it('POST /api/events/:eventId/stations answers 400 naming stations and 2000', async () => {
      expectRefusal(
        await t
          .post(`/api/events/${eventId}/stations`)
          .set(w.auth('coordinator'))
          .send({ code: 'One more', latDeg: 0, lonDeg: 0, heightM: 0 }),
        'stations',
      );
      expect(await count('stations', eventId)).toBe(EVENT_SIZE_LIMITS.stations);
    });

    it('POST /api/events/:eventId/chords and the chord CSV import (also its preview) answer 400 naming chords', async () => {
      expectRefusal(
        await t.post(`/api/events/${eventId}/chords`).set(w.auth('modeller')).send({
          station: 'Harrow Fell',
          type: 'negative',
          start: '2028-03-14T02:10:00Z',
          end: '2028-03-14T02:18:00Z',
        }),
        'chords',
      );
      const csv = Buffer.from(
        'station,type,start_utc,end_utc\r\nHarrow Fell,negative,2028-03-14T02:10:00Z,2028-03-14T02:18:00Z\r\n',
      );
      for (const query of ['', '?preview=1'])
        expectRefusal(
          await t
            .post(`/api/events/${eventId}/chords/import${query}`)
            .set(w.auth('modeller'))
            .attach('file', csv, { filename: 'chords.csv', contentType: 'text/csv' }),
          'chords',
        );
      expect(await count('chords', eventId)).toBe(EVENT_SIZE_LIMITS.chords);
    });

    it('POST /api/reports/:reportId/accept answers 400 naming chords when the report needs a new chord, and leaves it submitted', async () => {
      const report = await t
        .post(`/api/events/${eventId}/reports`)
        .set(w.auth('observer'))
        .send({
          stationId: harrowId,
          result: 'negative',
          observedFromUtc: '2028-03-14T02:10:00Z',
          observedToUtc: '2028-03-14T02:18:00Z',
        })
        .expect(201);
      const id = (report.body as { id: string }).id;
      expectRefusal(await t.post(`/api/reports/${id}/accept`).set(w.auth('coordinator')).send({}), 'chords');
      expect((await t.orm.em.fork().findOneOrFail(Report, { id })).state).toBe('submitted');
    });

    it('POST /api/reports/:reportId/accept answers 400 naming ringEvents when its ring dips would pass 5000', async () => {
      const report = await t
        .post(`/api/events/${eventId}/reports`)
        .set(w.auth('observer'))
        .send({
          stationId: juniperId,
          result: 'negative',
          observedFromUtc: '2028-03-14T02:10:00Z',
          observedToUtc: '2028-03-14T02:18:00Z',
          ringDips: [
            {
              ring: 'R1',
              start: { time: '2028-03-14T02:13:48.8Z', sigmaSeconds: 0.05 },
              end: { time: '2028-03-14T02:13:49.2Z', sigmaSeconds: 0.05 },
            },
          ],
        })
        .expect(201);
      const id = (report.body as { id: string }).id;
      expectRefusal(
        await t.post(`/api/reports/${id}/accept`).set(w.auth('coordinator')).send({}),
        'ringEvents',
      );
      expect(await count('ringEvents', eventId)).toBe(EVENT_SIZE_LIMITS.ringEvents);
      expect((await t.orm.em.fork().findOneOrFail(Report, { id })).state).toBe('submitted');
    });

    it('GET /api/events/:eventId still answers at the limits, and GET /api/events answers no larger than for a small event', async () => {
      const detail = await t.get(`/api/events/${eventId}`).set(w.auth('observer')).expect(200);
      const body = detail.body as { stations: unknown[]; chords: unknown[]; ringEvents: unknown[] };
      expect([body.stations.length, body.chords.length, body.ringEvents.length]).toEqual([
        EVENT_SIZE_LIMITS.stations,
        EVENT_SIZE_LIMITS.chords,
        EVENT_SIZE_LIMITS.ringEvents,
      ]);
      const list = await t
        .get(`/api/events?teamId=${w.team.id}&pageSize=100`)
        .set(w.auth('observer'))
        .expect(200);
      const items = (list.body as { items: Array<{ id: string; counts: { chords: number } }> }).items;
      const big = items.find((i) => i.id === eventId);
      const small = items.find((i) => i.id !== eventId);
      expect(big?.counts.chords).toBe(EVENT_SIZE_LIMITS.chords);
      // One summary per event with counts only: the two differ by the digits of their counts and ids.
      expect(Math.abs(JSON.stringify(big).length - JSON.stringify(small).length)).toBeLessThan(40);
    });
  });

  it('five simultaneous station adds at 1999 stations let exactly one in; the others answer 400 naming stations', async () => {
    const eventId = await importExample(t, w);
    await fill(eventId, 'stations', EVENT_SIZE_LIMITS.stations - 1);
    const answers = await Promise.all(
      Array.from({ length: 5 }, (_, k) =>
        t
          .post(`/api/events/${eventId}/stations`)
          .set(w.auth('coordinator'))
          .send({ code: `Racer ${k}`, latDeg: 0, lonDeg: 0, heightM: 0 }),
      ),
    );
    expect(answers.map((a) => a.status).sort()).toEqual([201, 400, 400, 400, 400]);
    for (const a of answers.filter((x) => x.status === 400)) expectRefusal(a, 'stations');
    expect(await count('stations', eventId)).toBe(EVENT_SIZE_LIMITS.stations);
  });

  it('five simultaneous chord adds at 1999 chords let exactly one in; the others answer 400 naming chords', async () => {
    const eventId = await importExample(t, w);
    await fill(eventId, 'chords', EVENT_SIZE_LIMITS.chords - 1);
    const answers = await Promise.all(
      Array.from({ length: 5 }, () =>
        t.post(`/api/events/${eventId}/chords`).set(w.auth('modeller')).send({
          station: 'juniper-flat',
          type: 'negative',
          start: '2028-03-14T02:10:00Z',
          end: '2028-03-14T02:18:00Z',
        }),
      ),
    );
    expect(answers.map((a) => a.status).sort()).toEqual([201, 400, 400, 400, 400]);
    for (const a of answers.filter((x) => x.status === 400)) expectRefusal(a, 'chords');
    expect(await count('chords', eventId)).toBe(EVENT_SIZE_LIMITS.chords);
  });
});
