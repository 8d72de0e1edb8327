// Issue 13, item 10: requests that meet. Each test fires real parallel HTTP requests at one API and
// checks that the database kept the rule: one open report per observer and station, one decision per
// report (one audit entry), one station per id in an event; the losers get a 409 or a 400 naming the
// field, never a 500.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '../../src/audit/entities/audit-entry.entity';
import { Chord } from '../../src/chords/entities/chord.entity';
import { Report } from '../../src/reports/entities/report.entity';
import { Station } from '../../src/stations/entities/station.entity';
import { createWorkspace, importExample, patch, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';

interface Answer {
  status: number;
  body: unknown;
}

const negative = {
  result: 'negative',
  observedFromUtc: '2028-03-14T02:10:00Z',
  observedToUtc: '2028-03-14T02:18:00Z',
};

function statuses(answers: Answer[]): number[] {
  return answers.map((a) => a.status).sort((a, b) => a - b);
}

describe('concurrent writes', () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
  });
  afterAll(async () => {
    await t.close();
  });

  async function stationFor(code: string): Promise<string> {
    const res = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code, latDeg: -24.3, lonDeg: 77.7, heightM: 300, observerId: w.userIds.observer })
      .expect(201);
    return (res.body as { id: string }).id;
  }

  async function openReports(stationId: string): Promise<number> {
    return t.orm.em.fork().count(Report, {
      station: stationId,
      author: w.userIds.observer,
      state: { $in: ['submitted', 'accepted'] },
    });
  }

  it('five simultaneous POST /api/events/:eventId/reports for one station leave one open report; the others answer 409', async () => {
    const stationId = await stationFor('Race Hill');
    const answers: Answer[] = await Promise.all(
      Array.from({ length: 5 }, () =>
        t
          .post(`/api/events/${eventId}/reports`)
          .set(w.auth('observer'))
          .send({ stationId, ...negative }),
      ),
    );
    expect(statuses(answers), JSON.stringify(answers.map((a) => a.body))).toEqual([201, 409, 409, 409, 409]);
    for (const a of answers.filter((x) => x.status === 409))
      expect((a.body as { message: string }).message).toMatch(/already have a report for this station/);
    expect(await openReports(stationId)).toBe(1);
  });

  it('PATCH /api/reports/:reportId of a rejected report answers 409 while a newer report of that station is open', async () => {
    const stationId = await stationFor('Second Try');
    const first = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId, ...negative })
      .expect(201);
    const firstId = (first.body as { id: string }).id;
    await t
      .post(`/api/reports/${firstId}/reject`)
      .set(w.auth('coordinator'))
      .send({ reason: 'times are local, not UTC' })
      .expect(200);
    await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId, ...negative, notes: 'times in UTC now' })
      .expect(201);
    const again = await patch(t, `/api/reports/${firstId}`)
      .set(w.auth('observer'))
      .send({ notes: 'resubmitted' });
    expect(again.status, JSON.stringify(again.body)).toBe(409);
    expect(await openReports(stationId)).toBe(1);
    expect((await t.orm.em.fork().findOneOrFail(Report, { id: firstId })).state).toBe('rejected');
  });

  it('six simultaneous POST /api/reports/:reportId/accept answer one 200 and five 409, with one report.accept audit entry and one chord', async () => {
    const stationId = await stationFor('Accept Race');
    const report = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId, ...negative })
      .expect(201);
    const reportId = (report.body as { id: string }).id;
    const answers: Answer[] = await Promise.all(
      Array.from({ length: 6 }, (_, k) =>
        t
          .post(`/api/reports/${reportId}/accept`)
          .set(w.auth(k % 2 === 0 ? 'coordinator' : 'admin'))
          .send({}),
      ),
    );
    expect(statuses(answers), JSON.stringify(answers.map((a) => a.body))).toEqual([
      200, 409, 409, 409, 409, 409,
    ]);
    const em = t.orm.em.fork();
    expect(await em.count(AuditEntry, { action: 'report.accept', objectId: reportId })).toBe(1);
    expect(await em.count(Chord, { report: reportId })).toBe(1);
    expect((await em.findOneOrFail(Report, { id: reportId })).state).toBe('accepted');
  });

  it('five simultaneous POST /api/events/:eventId/stations with one code answer one 201 and four 400 naming code', async () => {
    const answers: Answer[] = await Promise.all(
      Array.from({ length: 5 }, () =>
        t
          .post(`/api/events/${eventId}/stations`)
          .set(w.auth('coordinator'))
          .send({ code: 'Twin Peak', latDeg: 1, lonDeg: 2, heightM: 3 }),
      ),
    );
    expect(statuses(answers), JSON.stringify(answers.map((a) => a.body))).toEqual([201, 400, 400, 400, 400]);
    for (const a of answers.filter((x) => x.status === 400))
      expect((a.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual(['code']);
    expect(await t.orm.em.fork().count(Station, { event: eventId, code: 'Twin Peak' })).toBe(1);
  });

  it('five simultaneous PATCH of five stations to one code leave one station with it; the others answer 400 naming code', async () => {
    const ids = await Promise.all(
      Array.from({ length: 5 }, async (_, k) => {
        const res = await t
          .post(`/api/events/${eventId}/stations`)
          .set(w.auth('coordinator'))
          .send({ code: `Renamed ${k}`, latDeg: 1, lonDeg: 2, heightM: 3 })
          .expect(201);
        return (res.body as { id: string }).id;
      }),
    );
    const answers: Answer[] = await Promise.all(
      ids.map((id) =>
        patch(t, `/api/events/${eventId}/stations/${id}`)
          .set(w.auth('coordinator'))
          .send({ code: 'One Name' }),
      ),
    );
    expect(statuses(answers), JSON.stringify(answers.map((a) => a.body))).toEqual([200, 400, 400, 400, 400]);
    expect(await t.orm.em.fork().count(Station, { event: eventId, code: 'One Name' })).toBe(1);
  });
});
