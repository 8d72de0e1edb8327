import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '../../src/audit/entities/audit-entry.entity';
import { Chord } from '../../src/chords/entities/chord.entity';
import { RingEvent } from '../../src/chords/entities/ring-event.entity';
import { Report } from '../../src/reports/entities/report.entity';
import { bootTestApp, type TestApp } from '../setup';
import { createWorkspace, del, importExample, patch, type Workspace } from '../events/workspace';

interface StationBody {
  id: string;
  code: string;
  observerId: string | null;
}
interface ReportBody {
  id: string;
  state: string;
  authorId: string;
  rejectReason: string | null;
}

describe('stations and observer reports', () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;
  let station: StationBody;
  let secondObserverToken: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
    const second = await t.createUser({ teams: [{ team: w.team, roles: ['observer'] }] });
    secondObserverToken = await t.signIn(second.email, second.password);
    const created = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({
        code: 'Harrow Fell',
        latDeg: -30.5,
        lonDeg: -70.2,
        heightM: 2100,
        observerId: w.userIds.observer,
        apertureMm: 280,
        camera: 'video',
        exposureSeconds: 0.04,
        timeSource: 'GNSS PPS',
      })
      .expect(201);
    station = created.body as StationBody;
  });
  afterAll(async () => {
    await t.close();
  });

  const positive = {
    result: 'positive',
    disappearance: { time: '2028-03-14T02:11:30.100Z', sigmaSeconds: 0.05 },
    reappearance: { time: '2028-03-14T02:11:41.900Z', sigmaSeconds: 0.05 },
    ringDips: [
      {
        ring: 'R1',
        start: { time: '2028-03-14T02:11:05.000Z', sigmaSeconds: 0.1 },
        end: { time: '2028-03-14T02:11:05.400Z', sigmaSeconds: 0.1 },
      },
    ],
    notes: 'steady seeing',
  };

  it('POST /api/events/:eventId/stations stores the station; a duplicate id is a 400 on code', async () => {
    expect(station.observerId).toBe(w.userIds.observer);
    const dup = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: 'Harrow Fell', latDeg: 0, lonDeg: 0, heightM: 0 })
      .expect(400);
    expect((dup.body as { issues: Array<{ path: string }> }).issues[0]?.path).toBe('code');
    await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('modeller'))
      .send({ code: 'x', latDeg: 0, lonDeg: 0, heightM: 0 })
      .expect(403);
    const bad = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: 'y', latDeg: 91, lonDeg: '0', heightM: 0 })
      .expect(400);
    expect((bad.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path).sort()).toEqual([
      'latDeg',
      'lonDeg',
    ]);
  });

  it('PATCH and DELETE /api/events/:eventId/stations/:stationId edit and remove a station without reports', async () => {
    const created = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: 'Temp', latDeg: 1, lonDeg: 2, heightM: 3 })
      .expect(201);
    const id = (created.body as StationBody).id;
    const edited = await patch(t, `/api/events/${eventId}/stations/${id}`)
      .set(w.auth('coordinator'))
      .send({ heightM: 30 })
      .expect(200);
    expect((edited.body as { heightM: number }).heightM).toBe(30);
    await del(t, `/api/events/${eventId}/stations/${id}`).set(w.auth('coordinator')).expect(204);
  });

  it('POST /api/events/:eventId/reports lets only the station observer report; a positive needs a timing', async () => {
    await t
      .post(`/api/events/${eventId}/reports`)
      .set('Authorization', `Bearer ${secondObserverToken}`)
      .send({ stationId: station.id, ...positive })
      .expect(403);
    const missing = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId: station.id, result: 'positive' })
      .expect(400);
    // One time alone is a single-edge chord (e2e/timings/edges.e2e-spec.ts); neither is refused.
    expect((missing.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual([
      'disappearance',
    ]);
    await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .set('Content-Type', 'application/json')
      .send('{"stationId": ')
      .expect(400);
  });

  it('a report goes submitted → edited by its author → accepted, creating its chord and ring event', async () => {
    const created = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId: station.id, ...positive })
      .expect(201);
    const report = created.body as ReportBody;
    expect(report.state).toBe('submitted');
    await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId: station.id, ...positive })
      .expect(409);
    await patch(t, `/api/reports/${report.id}`).set(w.auth('coordinator')).send({ notes: 'x' }).expect(403);
    await patch(t, `/api/reports/${report.id}`)
      .set(w.auth('observer'))
      .send({ reappearance: { time: '2028-03-14T02:11:20.000Z', sigmaSeconds: 0.05 } })
      .expect(400);
    await patch(t, `/api/reports/${report.id}`)
      .set(w.auth('observer'))
      .send({ reappearance: { time: '2028-03-14T02:11:42.000Z', sigmaSeconds: 0.04 } })
      .expect(200);
    await t.post(`/api/reports/${report.id}/accept`).set(w.auth('observer')).expect(403);
    await t.post(`/api/reports/${report.id}/accept`).set(w.auth('coordinator')).expect(200);
    const em = t.orm.em.fork();
    const chord = await em.findOneOrFail(Chord, { report: report.id });
    expect(chord.type).toBe('positive');
    expect(chord.source).toBe('report');
    expect(chord.reappearance).toEqual({ time: '2028-03-14T02:11:42.000Z', sigmaSeconds: 0.04 });
    expect(await em.count(RingEvent, { report: report.id })).toBe(1);
    await patch(t, `/api/reports/${report.id}`).set(w.auth('observer')).send({ notes: 'late' }).expect(409);
    const actions = (
      await em.find(AuditEntry, { objectId: report.id }, { orderBy: { createdAt: 'asc' } })
    ).map((a) => a.action);
    expect(actions).toEqual(['report.submit', 'report.update', 'report.accept']);
  });

  it('POST /api/reports/:reportId/reject needs a reason; an observer sees only their own reports', async () => {
    const other = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: 'Sable Ridge', latDeg: -31, lonDeg: -70, heightM: 900, observerId: w.userIds.observer })
      .expect(201);
    const created = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId: (other.body as StationBody).id, result: 'clouded_out', notes: 'overcast' })
      .expect(201);
    const id = (created.body as ReportBody).id;
    await t.post(`/api/reports/${id}/reject`).set(w.auth('coordinator')).send({ reason: ' ' }).expect(400);
    const rejected = await t
      .post(`/api/reports/${id}/reject`)
      .set(w.auth('coordinator'))
      .send({ reason: 'wrong station picked' })
      .expect(200);
    expect((rejected.body as ReportBody).rejectReason).toBe('wrong station picked');
    expect((await t.orm.em.fork().findOneOrFail(Report, { id })).state).toBe('rejected');
    const mine = await t.get(`/api/events/${eventId}/reports`).set(w.auth('observer')).expect(200);
    const theirs = await t
      .get(`/api/events/${eventId}/reports`)
      .set('Authorization', `Bearer ${secondObserverToken}`)
      .expect(200);
    const all = await t.get(`/api/events/${eventId}/reports`).set(w.auth('coordinator')).expect(200);
    expect((mine.body as ReportBody[]).every((r) => r.authorId === w.userIds.observer)).toBe(true);
    expect(mine.body).toHaveLength(2);
    expect(theirs.body).toEqual([]);
    expect(all.body).toHaveLength(2);
  });

  it('DELETE /api/events/:eventId/stations/:stationId refuses a station with reports', async () => {
    await del(t, `/api/events/${eventId}/stations/${station.id}`).set(w.auth('coordinator')).expect(409);
  });
});
