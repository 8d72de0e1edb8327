// Issue 13, items 6 and 7: text longer than its column, or holding a control character, is refused by
// the schema with 400 naming the path, on every route that takes it, and nothing is written. Before the
// fix a chord time with 30 decimals reached the varchar(40) column and answered 500.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { TEXT_LIMITS } from '@limbus/schema';
import { Chord } from '../../src/chords/entities/chord.entity';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { Report } from '../../src/reports/entities/report.entity';
import { Station } from '../../src/stations/entities/station.entity';
import { createWorkspace, exampleEvent, importExample, patch, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';

interface Refusal {
  issues: Array<{ path: string; message: string }>;
}

/** A UTC time with `decimals` digits after the second; 30 give 51 characters, the column holds 40. */
function longTime(decimals: number): string {
  return `2028-03-14T02:10:00.${'1'.repeat(decimals)}Z`;
}

function csv(rows: string[][]): Buffer {
  return Buffer.from(rows.map((r) => r.join(',')).join('\r\n') + '\r\n');
}

describe('text limits and control characters on every route that stores text', () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;
  let stationId: string;
  let chordId: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
    const station = await t
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
    stationId = (station.body as { id: string }).id;
    const chords = await t.get(`/api/events/${eventId}/chords`).set(w.auth('modeller')).expect(200);
    chordId =
      (chords.body as Array<{ id: string; type: string }>).find((c) => c.type === 'negative')?.id ?? '';
  });
  afterAll(async () => {
    await t.close();
  });

  /** Rows of the event as stored, to show that a refusal wrote nothing. */
  async function stored(): Promise<{ chords: string; stations: number; reports: number; title: string }> {
    const em = t.orm.em.fork();
    const chords = await em.find(Chord, { event: eventId }, { orderBy: { id: 'asc' } });
    return {
      chords: JSON.stringify(chords.map((c) => [c.id, c.station.id, c.startUtc, c.endUtc, c.disappearance])),
      stations: await em.count(Station, { event: eventId }),
      reports: await em.count(Report, { event: eventId }),
      title: (await em.findOneOrFail(OccultationEvent, { id: eventId })).title,
    };
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

  function importCsv(rows: string[][]) {
    return t
      .post(`/api/events/${eventId}/chords/import`)
      .set(w.auth('modeller'))
      .attach('file', csv(rows), { filename: 'chords.csv', contentType: 'text/csv' });
  }

  const createPayload = (title: string) => {
    const file = exampleEvent();
    return {
      teamId: w.team.id,
      title,
      star: file.star,
      ephemeris: file.ephemeris,
      earthRotation: file.earthRotation,
      fitDefaults: file.fit,
    };
  };

  const longTitle = 'T'.repeat(TEXT_LIMITS.eventTitle + 1);
  const longLabel = 'r'.repeat(TEXT_LIMITS.ringLabel + 1);
  const longStation = 's'.repeat(TEXT_LIMITS.stationCode + 1);

  /** Each case: a request, and the path its refusal must name. */
  const cases: Array<{ name: string; send: () => Promise<{ status: number; body: unknown }>; path: string }> =
    [
      {
        name: `POST /api/events with a title of ${TEXT_LIMITS.eventTitle + 1} characters`,
        send: () => t.post('/api/events').set(w.auth('coordinator')).send(createPayload(longTitle)),
        path: 'title',
      },
      {
        name: `PATCH /api/events/:eventId with a title of ${TEXT_LIMITS.eventTitle + 1} characters`,
        send: () => patch(t, `/api/events/${eventId}`).set(w.auth('coordinator')).send({ title: longTitle }),
        path: 'title',
      },
      {
        name: `POST /api/events/import with a title of ${TEXT_LIMITS.eventTitle + 1} characters`,
        send: () => importFile({ ...exampleEvent(), title: longTitle }),
        path: 'title',
      },
      {
        name: `POST /api/events/import with a ring label of ${TEXT_LIMITS.ringLabel + 1} characters`,
        send: () => {
          const file = exampleEvent();
          const rings = file.ringEvents as Array<Record<string, unknown>>;
          rings[0] = { ...rings[0], ring: longLabel };
          return importFile(file);
        },
        path: 'ringEvents[0].ring',
      },
      {
        name: `POST /api/events/import with a station id of ${TEXT_LIMITS.stationCode + 1} characters`,
        send: () => {
          const file = exampleEvent();
          const stations = file.stations as Array<Record<string, unknown>>;
          stations[0] = { ...stations[0], id: longStation };
          return importFile(file);
        },
        path: 'stations[0].id',
      },
      {
        name: 'POST /api/events/import with a negative chord start of 30 decimals',
        send: () => {
          const file = exampleEvent();
          const chords = file.chords as Array<Record<string, unknown>>;
          const k = chords.findIndex((c) => c.type === 'negative');
          chords[k] = { ...chords[k], start: longTime(30) };
          return importFile(file);
        },
        path: `chords[${(exampleEvent().chords as Array<{ type: string }>).findIndex((c) => c.type === 'negative')}].start`,
      },
      {
        name: 'POST /api/events/:eventId/chords with a negative chord start of 30 decimals',
        send: () =>
          t
            .post(`/api/events/${eventId}/chords`)
            .set(w.auth('modeller'))
            .send({
              station: 'Harrow Fell',
              type: 'negative',
              start: longTime(30),
              end: '2028-03-14T02:18:00Z',
            }),
        path: 'start',
      },
      {
        name: 'PATCH /api/chords/:chordId with a negative chord end of 30 decimals',
        send: () =>
          patch(t, `/api/chords/${chordId}`)
            .set(w.auth('modeller'))
            .send({ end: longTime(30) }),
        path: 'end',
      },
      {
        name: `POST /api/events/:eventId/chords with a station id of ${TEXT_LIMITS.stationCode + 1} characters`,
        send: () =>
          t
            .post(`/api/events/${eventId}/chords`)
            .set(w.auth('modeller'))
            .send({
              station: longStation,
              type: 'negative',
              start: longTime(3),
              end: '2028-03-14T02:18:00Z',
            }),
        path: 'station',
      },
      {
        name: 'POST /api/events/:eventId/chords/import with a start_utc of 30 decimals',
        send: () =>
          importCsv([
            ['station', 'type', 'start_utc', 'end_utc'],
            ['Harrow Fell', 'negative', longTime(30), '2028-03-14T02:18:00Z'],
          ]),
        path: 'row 2, column start_utc',
      },
      {
        name: `POST /api/events/:eventId/chords/import with a station id of ${TEXT_LIMITS.stationCode + 1} characters`,
        send: () =>
          importCsv([
            ['station', 'type', 'start_utc', 'end_utc'],
            [longStation, 'negative', longTime(3), '2028-03-14T02:18:00Z'],
          ]),
        path: 'row 2, column station',
      },
      {
        name: `POST /api/events/:eventId/stations with a station id of ${TEXT_LIMITS.stationCode + 1} characters`,
        send: () =>
          t
            .post(`/api/events/${eventId}/stations`)
            .set(w.auth('coordinator'))
            .send({ code: longStation, latDeg: 0, lonDeg: 0, heightM: 0 }),
        path: 'code',
      },
      {
        name: `PATCH /api/events/:eventId/stations/:stationId with a station id of ${TEXT_LIMITS.stationCode + 1} characters`,
        send: () =>
          patch(t, `/api/events/${eventId}/stations/${stationId}`)
            .set(w.auth('coordinator'))
            .send({ code: longStation }),
        path: 'code',
      },
      {
        name: `POST /api/events/:eventId/reports with a ring dip label of ${TEXT_LIMITS.ringLabel + 1} characters`,
        send: () =>
          t
            .post(`/api/events/${eventId}/reports`)
            .set(w.auth('observer'))
            .send({
              stationId,
              result: 'negative',
              observedFromUtc: '2028-03-14T02:10:00Z',
              observedToUtc: '2028-03-14T02:18:00Z',
              ringDips: [
                {
                  ring: longLabel,
                  start: { time: '2028-03-14T02:11:00Z', sigmaSeconds: 0.1 },
                  end: { time: '2028-03-14T02:11:01Z', sigmaSeconds: 0.1 },
                },
              ],
            }),
        path: 'ringDips.0.ring',
      },
      {
        name: 'POST /api/events/:eventId/reports with an observedFromUtc of 30 decimals',
        send: () =>
          t
            .post(`/api/events/${eventId}/reports`)
            .set(w.auth('observer'))
            .send({
              stationId,
              result: 'negative',
              observedFromUtc: longTime(30),
              observedToUtc: '2028-03-14T02:18:00Z',
            }),
        path: 'observedFromUtc',
      },
      // Control characters (item 7): refused with the path, wherever the text comes in.
      {
        name: 'POST /api/events with a NUL in the title',
        send: () =>
          t.post('/api/events').set(w.auth('coordinator')).send(createPayload('Quillon\u0000night')),
        path: 'title',
      },
      {
        name: 'PATCH /api/events/:eventId with an ESC in the title',
        send: () =>
          patch(t, `/api/events/${eventId}`).set(w.auth('coordinator')).send({ title: 'Quillon \u001b[31m' }),
        path: 'title',
      },
      {
        name: 'POST /api/events/import with a C1 control (U+0085) in a station id',
        send: () => {
          const file = exampleEvent();
          const stations = file.stations as Array<Record<string, unknown>>;
          stations[0] = { ...stations[0], id: 'amber\u0085field' };
          return importFile(file);
        },
        path: 'stations[0].id',
      },
      {
        name: 'POST /api/events/import with an ESC in the multipart field bodyName',
        send: () =>
          t
            .post('/api/events/import')
            .set(w.auth('coordinator'))
            .field('teamId', w.team.id)
            .field('bodyName', 'Quil\u001blon')
            .attach('file', Buffer.from(JSON.stringify(exampleEvent())), {
              filename: 'event.json',
              contentType: 'application/json',
            }),
        path: 'bodyName',
      },
      {
        name: 'POST /api/events/:eventId/chords/import with a BEL in a station cell',
        send: () =>
          importCsv([
            ['station', 'type', 'start_utc', 'end_utc'],
            ['Harrow\u0007Fell', 'negative', longTime(3), '2028-03-14T02:18:00Z'],
          ]),
        path: 'row 2, column station',
      },
      {
        name: 'PATCH /api/events/:eventId/stations/:stationId with a NUL in the camera',
        send: () =>
          patch(t, `/api/events/${eventId}/stations/${stationId}`)
            .set(w.auth('coordinator'))
            .send({ camera: 'video\u0000' }),
        path: 'camera',
      },
      {
        name: 'POST /api/events/:eventId/reports with a NUL in the notes (tab and newline pass)',
        send: () =>
          t.post(`/api/events/${eventId}/reports`).set(w.auth('observer')).send({
            stationId,
            result: 'clouded_out',
            notes: 'first line\n\tsecond\u0000',
          }),
        path: 'notes',
      },
      {
        name: 'POST /api/events/:eventId/timings/:timingId/ring-events with an ESC in the ring label',
        send: () =>
          t
            .post(`/api/events/${eventId}/timings/${randomUUID()}/ring-events`)
            .set(w.auth('modeller'))
            .send({ ring: 'R1\u001b[0m' }),
        path: 'ring',
      },
      {
        name: 'POST /api/teams/:teamId/bodies with an ESC in the name',
        send: () =>
          t.post(`/api/teams/${w.team.id}/bodies`).set(w.auth('coordinator')).send({ name: 'Quil\u001blon' }),
        path: 'name',
      },
    ];

  for (const c of cases)
    it(`${c.name} answers 400 naming ${c.path}, and writes nothing`, async () => {
      const before = await stored();
      const eventsBefore = await t.orm.em.fork().count(OccultationEvent, { team: w.team.id });
      const res = await c.send();
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect((res.body as Refusal).issues.map((i) => i.path)).toContain(c.path);
      expect(await stored()).toEqual(before);
      expect(await t.orm.em.fork().count(OccultationEvent, { team: w.team.id })).toBe(eventsBefore);
    });

  it('POST /api/events/:eventId/chords takes a time of 19 decimals, the most its column holds', async () => {
    const time = longTime(19);
    expect(time.length).toBe(40);
    const res = await t
      .post(`/api/events/${eventId}/chords`)
      .set(w.auth('modeller'))
      .send({ station: 'Harrow Fell', type: 'negative', start: time, end: '2028-03-14T02:18:00Z' })
      .expect(201);
    const row = await t.orm.em.fork().findOneOrFail(Chord, { id: (res.body as { id: string }).id });
    expect(row.startUtc).toBe(time);
  });

  it('POST /api/events/:eventId/reports keeps tab and newline in notes', async () => {
    const res = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId, result: 'clouded_out', notes: 'first line\n\tsecond' })
      .expect(201);
    const row = await t.orm.em.fork().findOneOrFail(Report, { id: (res.body as { id: string }).id });
    expect(row.notes).toBe('first line\n\tsecond');
  });
});
