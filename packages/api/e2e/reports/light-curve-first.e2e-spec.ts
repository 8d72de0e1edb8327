import type { INestApplicationContext } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { type ReportView, REPLACES_BETTER_TIMING, replacesBetterTimingSchema } from '@limbus/schema';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEntry } from '../../src/audit/entities/audit-entry.entity';
import { Chord } from '../../src/chords/entities/chord.entity';
import type { ChordView } from '../../src/events/views';
import { Report } from '../../src/reports/entities/report.entity';
import type { TimingDetail, TimingSummary } from '../../src/timings/timings.service';
import { User } from '../../src/users/entities/user.entity';
import { WorkerModule } from '../../src/worker.module';
import { createWorkspace, importExample, patch, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';
import { squareWellCsv } from '../timings/square-well';

// A light curve with one opaque well, as in e2e/timings (see square-well.ts for how it is drawn): the
// star goes out 22.059 s and comes back 38.359 s after 02:13:40 UTC.
const ORIGIN_UNIX_SECONDS = Date.UTC(2028, 2, 14, 2, 13, 40) / 1000;
const CSV = squareWellCsv({
  originUnixSeconds: ORIGIN_UNIX_SECONDS,
  samples: 600,
  cadenceSeconds: 0.1,
  wells: [{ startSeconds: 22.059, endSeconds: 38.359, opacity: 1 }],
  noiseSigma: 0.02,
  seed: 20280315,
});
// At 1e6 km the Fresnel scale is about 1 ms of shadow motion, so the geometric well looks like an edge
// to the diffraction model (the reasoning is in e2e/timings/timings.e2e-spec.ts).
const OPTIONS = { speedKmPerS: 20, distanceKm: 1.0e6, exposureSeconds: 0.1, bottom: 'zero' };
const STATION = 'wrenfold-moor';
const TYPED = {
  disappearance: { time: '2028-03-14T02:14:02.1Z', sigmaSeconds: 0.5 },
  reappearance: { time: '2028-03-14T02:14:18.4Z', sigmaSeconds: 0.5 },
};

describe('a report whose times come from its light curve', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext;
  let eventId: string;
  let stationId: string;
  let reportId: string;
  let timingId: string;
  let otherObserver: { id: string; email: string; auth: Record<string, string> };
  const emails: Record<'coordinator' | 'observer', string> = { coordinator: '', observer: '' };

  beforeAll(async () => {
    t = await bootTestApp();
    worker = await NestFactory.createApplicationContext(WorkerModule.register(t.config), { logger: false });
    await worker.init();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
    const em = t.orm.em.fork();
    for (const role of ['coordinator', 'observer'] as const)
      emails[role] = (await em.findOneOrFail(User, { id: w.userIds[role] })).email;
    const other = await t.createUser({ teams: [{ team: w.team, roles: ['observer'] }] });
    otherObserver = {
      id: other.user.id,
      email: other.email,
      auth: { Authorization: `Bearer ${await t.signIn(other.email, other.password)}` },
    };
    const station = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: STATION, latDeg: -30.4, lonDeg: -70.6, heightM: 1500, observerId: w.userIds.observer })
      .expect(201);
    stationId = (station.body as { id: string }).id;
  });
  afterAll(async () => {
    await worker.close();
    await t.close();
  });

  const reportOf = async (id: string, auth = w.auth('coordinator')): Promise<ReportView> => {
    const list = await t.get(`/api/events/${eventId}/reports`).set(auth).expect(200);
    const found = (list.body as ReportView[]).find((r) => r.id === id);
    if (!found) throw new Error(`report ${id} not listed`);
    return found;
  };

  async function solved(id: string): Promise<TimingDetail> {
    const deadline = Date.now() + 45_000;
    for (;;) {
      const response = await t
        .get(`/api/events/${eventId}/timings/${id}`)
        .set(w.auth('modeller'))
        .expect(200);
      const body = response.body as TimingDetail;
      if (body.state === 'solved' || body.state === 'failed' || Date.now() > deadline) return body;
      await new Promise((resolve) => setTimeout(resolve, 200));
    }
  }

  it('POST /api/events/:eventId/reports takes a positive without times when they are to come from its light curve; accept answers 409 until it is timed', async () => {
    const created = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId, result: 'positive', timesFromLightCurve: true, notes: 'video, GNSS PPS' })
      .expect(201);
    const report = created.body as ReportView;
    reportId = report.id;
    expect(report).toMatchObject({
      state: 'submitted',
      timesFromLightCurve: true,
      disappearance: null,
      reappearance: null,
      chord: null,
      latestTiming: null,
      corrections: [],
    });
    const submitted = await t.mailAbout(emails.coordinator, `Report submitted: ${STATION}`);
    expect(submitted.kind).toBe('report-submitted');
    expect(submitted.text).toContain(`/events/${eventId}?section=stations`);
    expect(submitted.text).toContain('to come from its light curve');

    const refused = await t.post(`/api/reports/${reportId}/accept`).set(w.auth('coordinator')).expect(409);
    expect((refused.body as { message: string }).message).toBe(
      'this report has no times yet: time its light curve (Light curves) and accept the timing',
    );
    expect((await t.orm.em.fork().findOneOrFail(Report, { id: reportId })).state).toBe('submitted');

    const uploaded = await t
      .post(`/api/reports/${reportId}/light-curve`)
      .set(w.auth('observer'))
      .attach('file', Buffer.from(CSV), { filename: 'wrenfold.csv', contentType: 'text/csv' })
      .expect(201);
    expect((uploaded.body as ReportView).lightCurve?.name).toBe('wrenfold.csv');
  });

  it('POST /api/events/:eventId/timings/:timingId/accept writes the timed chord and accepts the report, which shows both', async () => {
    const queued = await t
      .post(`/api/events/${eventId}/reports/${reportId}/timings`)
      .set(w.auth('modeller'))
      .send(OPTIONS)
      .expect(202);
    timingId = (queued.body as { id: string }).id;
    const detail = await solved(timingId);
    expect(detail.state).toBe('solved');
    const d = detail.result?.disappearance;
    const r = detail.result?.reappearance;
    if (!d || !r) throw new Error('the timing found no D or R');
    // Before the accept the observer sees the timing, not yet in a chord.
    const waiting = await reportOf(reportId, w.auth('observer'));
    expect(waiting.latestTiming).toMatchObject({ id: timingId, state: 'solved', inChord: false });
    expect(waiting.latestTiming?.disappearance).toEqual(d);

    const accepted = await t
      .post(`/api/events/${eventId}/timings/${timingId}/accept`)
      .set(w.auth('modeller'))
      .expect(200);
    const body = accepted.body as { chordId: string; report: ReportView };
    expect(body.report.state).toBe('accepted');
    expect(body.report.chord).toEqual({
      id: body.chordId,
      source: 'timing',
      timingId,
      disappearance: d,
      reappearance: r,
    });
    expect(body.report.latestTiming).toMatchObject({ id: timingId, inChord: true, disappearance: d });
    // The stored updatedAt has whole seconds; the answer to the accept still carries the milliseconds.
    const { updatedAt: _stored, ...listed } = await reportOf(reportId, w.auth('observer'));
    const { updatedAt: _answered, ...answered } = body.report;
    expect(listed).toEqual(answered);

    const em = t.orm.em.fork();
    const chord = await em.findOneOrFail(Chord, { id: body.chordId });
    expect(chord.source).toBe('timing');
    expect(chord.timing?.id).toBe(timingId);
    expect(chord.report?.id).toBe(reportId);
    expect(chord.disappearance).toEqual(d);
    expect((await em.findOneOrFail(Report, { id: reportId })).state).toBe('accepted');
    const actions = (await em.find(AuditEntry, { eventId }, { orderBy: { createdAt: 'asc', id: 'asc' } }))
      .filter((a) => a.objectId === reportId || a.objectId === body.chordId)
      .map((a) => a.action);
    expect(actions).toEqual(expect.arrayContaining(['report.submit', 'timing.accept', 'report.accept']));

    const decided = await t.mailAbout(emails.observer, `Report accepted: ${STATION}`);
    expect(decided.kind).toBe('report-decided');
    expect(decided.text).toContain('accepted the timing into the chord');

    const timings = await t
      .get(`/api/events/${eventId}/reports/${reportId}/timings`)
      .set(w.auth('observer'))
      .expect(200);
    const [summary] = timings.body as TimingSummary[];
    expect(summary).toMatchObject({ id: timingId, inChord: true });
    expect(summary?.acceptedAt).not.toBeNull();
    const chords = await t.get(`/api/events/${eventId}/chords`).set(w.auth('reviewer')).expect(200);
    expect((chords.body as ChordView[]).find((c) => c.id === body.chordId)).toMatchObject({
      source: 'timing',
      timingId,
      reportId,
    });
  });

  it('PATCH /api/chords/:chordId keeps the timing for a clock offset but makes hand-edited times "manual"', async () => {
    const { chord } = await reportOf(reportId);
    if (!chord) throw new Error('no chord');
    const offset = await patch(t, `/api/chords/${chord.id}`)
      .set(w.auth('modeller'))
      .send({ timeOffsetSeconds: 0.02 })
      .expect(200);
    expect(offset.body as ChordView).toMatchObject({ source: 'timing', timingId, timeOffsetSeconds: 0.02 });
    const edited = await patch(t, `/api/chords/${chord.id}`)
      .set(w.auth('modeller'))
      .send({ disappearance: { ...chord.disappearance, time: '2028-03-14T02:14:02.070Z' } })
      .expect(200);
    expect(edited.body as ChordView).toMatchObject({ source: 'manual', timingId: null, reportId });
    const stored = await t.orm.em.fork().findOneOrFail(Chord, { id: chord.id });
    expect(stored.source).toBe('manual');
    expect(stored.timing).toBeNull();
    expect((await reportOf(reportId)).latestTiming?.inChord).toBe(false);

    // The same timing accepted again puts its times back; its σ equals the hand-edited chord's, so
    // nothing better-timed is replaced and no confirmation is needed. The clock offset stays.
    const again = await t
      .post(`/api/events/${eventId}/timings/${timingId}/accept`)
      .set(w.auth('coordinator'))
      .send({})
      .expect(200);
    const back = (again.body as { report: ReportView }).report;
    expect(back.chord).toMatchObject({ source: 'timing', timingId });
    expect(back.latestTiming?.inChord).toBe(true);
    expect((await t.orm.em.fork().findOneOrFail(Chord, { id: chord.id })).timeOffsetSeconds).toBe(0.02);
  });

  it('POST /api/reports/:reportId/accept over the timed chord answers 409 replaces-better-timing, and replaces it once told to', async () => {
    // The station's observer changes (an account replaces a name); their typed report is of the same
    // observation, so it stands for the same chord.
    await patch(t, `/api/events/${eventId}/stations/${stationId}`)
      .set(w.auth('coordinator'))
      .send({ observerId: otherObserver.id })
      .expect(200);
    const created = await t
      .post(`/api/events/${eventId}/reports`)
      .set(otherObserver.auth)
      .send({ stationId, result: 'positive', ...TYPED })
      .expect(201);
    const typedId = (created.body as ReportView).id;
    const timed = (await reportOf(reportId)).chord;
    if (!timed) throw new Error('no chord');

    const refused = await t.post(`/api/reports/${typedId}/accept`).set(w.auth('coordinator')).expect(409);
    const body = refused.body as {
      statusCode: number;
      error: string;
      message: string;
      code: string;
      detail: unknown;
    };
    expect(body.statusCode).toBe(409);
    expect(body.error).toBe('Conflict');
    expect(body.code).toBe(REPLACES_BETTER_TIMING);
    expect(body.message).toMatch(
      new RegExp(
        `^the chord of ${STATION} holds times from a light-curve timing \\(σ [0-9.]+ s.*\\); the report's typed times have σ 0\\.5 s$`,
      ),
    );
    expect(replacesBetterTimingSchema.parse(body.detail)).toEqual({
      chordId: timed.id,
      station: STATION,
      source: 'timing',
      timingId,
      current: { disappearance: timed.disappearance, reappearance: timed.reappearance },
      incoming: TYPED,
    });
    const em = t.orm.em.fork();
    expect((await em.findOneOrFail(Report, { id: typedId })).state).toBe('submitted');
    expect((await em.findOneOrFail(Chord, { id: timed.id })).source).toBe('timing');
    expect(await em.count(AuditEntry, { objectId: typedId, action: 'report.accept' })).toBe(0);

    await t
      .post(`/api/reports/${typedId}/accept`)
      .set(w.auth('coordinator'))
      .send({ replaceTimedChord: 'yes' })
      .expect(400);
    const replaced = await t
      .post(`/api/reports/${typedId}/accept`)
      .set(w.auth('coordinator'))
      .send({ replaceTimedChord: true })
      .expect(200);
    const view = replaced.body as ReportView;
    expect(view.state).toBe('accepted');
    expect(view.chord).toEqual({ id: timed.id, source: 'report', timingId: null, ...TYPED });
    const chord = await t.orm.em.fork().findOneOrFail(Chord, { id: timed.id });
    expect(chord.report?.id).toBe(typedId);
    expect(chord.timing).toBeNull();
    expect(await t.orm.em.fork().count(Chord, { event: eventId, station: stationId })).toBe(1);
    // The light-curve report no longer has the chord; its timing stays, no longer in the chord.
    const first = await reportOf(reportId);
    expect(first.chord).toBeNull();
    expect(first.latestTiming).toMatchObject({ id: timingId, inChord: false });
  });

  it("an observer sees nothing of another observer's report: its timings, defaults and light curve answer 404", async () => {
    const other = otherObserver.auth;
    const urls = [
      `/api/events/${eventId}/reports/${reportId}/timings`,
      `/api/events/${eventId}/timings/${timingId}`,
      `/api/events/${eventId}/reports/${reportId}/timing-defaults`,
      `/api/reports/${reportId}/light-curve`,
    ];
    for (const url of urls) {
      await t.get(url).set(other).expect(404);
      await t.get(url).set(w.auth('observer')).expect(200);
      await t.get(url).set(w.auth('reviewer')).expect(200);
    }
    await patch(t, `/api/reports/${reportId}`).set(other).send({ notes: 'mine now' }).expect(404);
    await t
      .post(`/api/reports/${reportId}/corrections`)
      .set(other)
      .send({ changes: { notes: 'x' }, message: 'mine' })
      .expect(404);
    await t
      .post(`/api/reports/${reportId}/light-curve`)
      .set(other)
      .attach('file', Buffer.from(CSV), { filename: 'x.csv', contentType: 'text/csv' })
      .expect(404);
    const listed = await t.get(`/api/events/${eventId}/reports`).set(other).expect(200);
    expect((listed.body as ReportView[]).map((r) => r.authorId)).toEqual([otherObserver.id]);
    // A member who also models sees every report.
    const both = await t.createUser({ teams: [{ team: w.team, roles: ['observer', 'modeller'] }] });
    const bothAuth = { Authorization: `Bearer ${await t.signIn(both.email, both.password)}` };
    for (const url of urls) await t.get(url).set(bothAuth).expect(200);
  });
});
