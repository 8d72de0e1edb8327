// Issue 13, item 11: a member whose only role is observer sees their own reports only, on every route
// that names or lists reports; another observer's report answers exactly the 404 of a missing one. Each
// route is also called by the report's author and by a modeller, so a test cannot pass by refusing all.
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createWorkspace, importExample, patch, type Workspace } from '../events/workspace';
import { lightCurveCsv } from '../uploads/light-curve-text';
import { bootTestApp, type TestApp } from '../setup';

type Who = 'author' | 'other observer' | 'modeller';

describe('observers see their own reports only', () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;
  let reportId: string;
  let acceptedId: string;
  let timingId: string;
  let otherAuth: Record<string, string>;
  let otherReportId: string;

  const auth = (who: Who): Record<string, string> =>
    who === 'author' ? w.auth('observer') : who === 'modeller' ? w.auth('modeller') : otherAuth;

  async function station(code: string, observerId: string): Promise<string> {
    const res = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code, latDeg: -29, lonDeg: -71, heightM: 800, observerId })
      .expect(201);
    return (res.body as { id: string }).id;
  }

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
    const other = await t.createUser({ teams: [{ team: w.team, roles: ['observer'] }] });
    otherAuth = { Authorization: `Bearer ${await t.signIn(other.email, other.password)}` };
    const mine = await station('Corran Hill', w.userIds.observer);
    const mineToo = await station('Tarn Edge', w.userIds.observer);
    const theirs = await station('Oxley Rise', other.user.id);
    const report = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId: mine, result: 'positive', timesFromLightCurve: true, notes: 'private words' })
      .expect(201);
    reportId = (report.body as { id: string }).id;
    await t
      .post(`/api/reports/${reportId}/light-curve`)
      .set(w.auth('observer'))
      .attach('file', Buffer.from(lightCurveCsv(12)), { filename: 'curve.csv', contentType: 'text/csv' })
      .expect(201);
    const timing = await t
      .post(`/api/events/${eventId}/reports/${reportId}/timings`)
      .set(w.auth('modeller'))
      .send({ speedKmPerS: 20, distanceKm: 1e6, exposureSeconds: 0.04 })
      .expect(202);
    timingId = (timing.body as { id: string }).id;
    const accepted = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({
        stationId: mineToo,
        result: 'negative',
        observedFromUtc: '2028-03-14T02:10:00Z',
        observedToUtc: '2028-03-14T02:18:00Z',
      })
      .expect(201);
    acceptedId = (accepted.body as { id: string }).id;
    await t.post(`/api/reports/${acceptedId}/accept`).set(w.auth('coordinator')).send({}).expect(200);
    const theirsReport = await t
      .post(`/api/events/${eventId}/reports`)
      .set(otherAuth)
      .send({ stationId: theirs, result: 'clouded_out' })
      .expect(201);
    otherReportId = (theirsReport.body as { id: string }).id;
  });
  afterAll(async () => {
    await t.close();
  });

  /** The 404 a missing report gives on the same route, to compare the refusal with. */
  async function missing(call: (id: string) => Promise<{ status: number; body: unknown }>) {
    const res = await call(randomUUID());
    expect(res.status).toBe(404);
    return res.body;
  }

  it('GET /api/events/:eventId/reports lists only the observer’s own reports', async () => {
    const list = async (who: Who) =>
      (
        (await t.get(`/api/events/${eventId}/reports`).set(auth(who)).expect(200)).body as Array<{
          id: string;
        }>
      )
        .map((r) => r.id)
        .sort();
    expect(await list('other observer')).toEqual([otherReportId]);
    expect(await list('author')).toEqual([reportId, acceptedId].sort());
    expect(await list('modeller')).toEqual([reportId, acceptedId, otherReportId].sort());
  });

  const routes: Array<{
    name: string;
    call: (who: Who, id: string) => Promise<{ status: number; body: unknown }>;
    /** What the author and a modeller get (a modeller may only read). */
    author: number;
    modeller: number;
    report: () => string;
  }> = [
    {
      name: 'GET /api/reports/:reportId/light-curve',
      call: (who, id) => t.get(`/api/reports/${id}/light-curve`).set(auth(who)),
      author: 200,
      modeller: 200,
      report: () => reportId,
    },
    {
      name: 'POST /api/reports/:reportId/light-curve',
      call: (who, id) =>
        t
          .post(`/api/reports/${id}/light-curve`)
          .set(auth(who))
          .attach('file', Buffer.from(lightCurveCsv(12)), { filename: 'curve.csv', contentType: 'text/csv' }),
      author: 201,
      modeller: 403,
      report: () => reportId,
    },
    {
      name: 'PATCH /api/reports/:reportId',
      call: (who, id) => patch(t, `/api/reports/${id}`).set(auth(who)).send({ notes: 'edited' }),
      author: 200,
      modeller: 403,
      report: () => reportId,
    },
    {
      name: 'GET /api/events/:eventId/reports/:reportId/timings',
      call: (who, id) => t.get(`/api/events/${eventId}/reports/${id}/timings`).set(auth(who)),
      author: 200,
      modeller: 200,
      report: () => reportId,
    },
    {
      name: 'GET /api/events/:eventId/reports/:reportId/timing-defaults',
      call: (who, id) => t.get(`/api/events/${eventId}/reports/${id}/timing-defaults`).set(auth(who)),
      author: 200,
      modeller: 200,
      report: () => reportId,
    },
    {
      name: 'POST /api/reports/:reportId/corrections',
      call: (who, id) =>
        t
          .post(`/api/reports/${id}/corrections`)
          .set(auth(who))
          .send({ changes: { notes: 'watched until 02:18:30' }, message: 'I watched longer' }),
      author: 201,
      modeller: 403,
      report: () => acceptedId,
    },
  ];

  for (const r of routes)
    it(`${r.name} answers another observer the 404 of a missing report, and the author ${r.author}`, async () => {
      const refused = await r.call('other observer', r.report());
      expect(refused.status).toBe(404);
      expect(refused.body).toEqual(await missing((id) => r.call('other observer', id)));
      expect((await r.call('modeller', r.report())).status).toBe(r.modeller);
      expect((await r.call('author', r.report())).status).toBe(r.author);
    });

  it('GET /api/events/:eventId/timings/:timingId answers another observer 404, the author and a modeller 200', async () => {
    const get = (who: Who, id: string) => t.get(`/api/events/${eventId}/timings/${id}`).set(auth(who));
    const refused = await get('other observer', timingId);
    expect(refused.status).toBe(404);
    expect(refused.body).toEqual((await get('other observer', randomUUID())).body);
    expect((await get('author', timingId)).status).toBe(200);
    expect((await get('modeller', timingId)).status).toBe(200);
  });
});
