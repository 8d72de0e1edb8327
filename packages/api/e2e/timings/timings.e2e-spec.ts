import 'reflect-metadata';
import { createHash, randomUUID } from 'node:crypto';
import type { INestApplicationContext } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { getQueueToken } from '@nestjs/bullmq';
import type { Queue } from 'bullmq';
import { type EventInput, projectEvent } from '@limbus/geometry';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Chord } from '../../src/chords/entities/chord.entity';
import { RingEvent } from '../../src/chords/entities/ring-event.entity';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { Report } from '../../src/reports/entities/report.entity';
import { Station } from '../../src/stations/entities/station.entity';
import { StorageService } from '../../src/storage/storage.service';
import { LightCurveTiming } from '../../src/timings/entities/light-curve-timing.entity';
import { TimingRequeue } from '../../src/timings/timing-requeue';
import { TIMINGS_QUEUE } from '../../src/timings/timings-queue';
import type { TimingDetail } from '../../src/timings/timings.service';
import { Upload } from '../../src/uploads/entities/upload.entity';
import { User } from '../../src/users/entities/user.entity';
import { WorkerModule } from '../../src/worker.module';
import { createWorkspace, importExample, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';
import { squareWellCsv } from './square-well';

// The invented example event's first station; its chord there says D 02:14:02.059, R 02:14:18.359.
const ORIGIN_UNIX_SECONDS = Date.UTC(2028, 2, 14, 2, 13, 40) / 1000;
const TRUE_D_SECONDS = 22.059;
const TRUE_R_SECONDS = 38.359;
const RING_DIP = { startSeconds: 8.88, endSeconds: 9.18, opacity: 0.6 };
// About 4.5 standard errors deep: below the 6-sigma search threshold, so only a hand mark reports it.
const FAINT_DIP = { startSeconds: 48.0, endSeconds: 48.5, opacity: 0.04 };

const CSV = squareWellCsv({
  originUnixSeconds: ORIGIN_UNIX_SECONDS,
  samples: 600,
  cadenceSeconds: 0.1,
  wells: [{ startSeconds: TRUE_D_SECONDS, endSeconds: TRUE_R_SECONDS, opacity: 1 }, RING_DIP, FAINT_DIP],
  noiseSigma: 0.02,
  seed: 20280314,
});

// The synthetic wells are geometric, so the distance is set where the Fresnel scale √(λD/2) is 18 m,
// about 1 ms of shadow motion: the diffraction model then agrees with the well. At a TNO's 6e9 km the
// scale is 1.4 km (70 ms) and a geometric well no longer looks like a real edge: a straight edge lets
// through a quarter of the light at the geometric shadow line (Born & Wolf, Principles of Optics, 7th ed.,
// §8.7, from memory), and the fit moves each time up to ~0.01 s into the well.
const OPTIONS = { speedKmPerS: 20, distanceKm: 1.0e6, exposureSeconds: 0.1, bottom: 'zero' };

function secondsFromOrigin(iso: string): number {
  return Date.parse(iso) / 1000 - ORIGIN_UNIX_SECONDS;
}

describe('light-curve timing routes and job', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext;
  let eventId: string;
  let reportId: string;
  let stationId: string;

  beforeAll(async () => {
    t = await bootTestApp();
    worker = await NestFactory.createApplicationContext(WorkerModule.register(t.config), { logger: false });
    await worker.init();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
    // Uploading is the reports routes' job; here the upload is stored the way they store one.
    const em = t.orm.em.fork();
    const event = await em.findOneOrFail(OccultationEvent, { id: eventId }, { populate: ['team'] });
    const station = await em.findOneOrFail(Station, { event: eventId, code: 'amberfield' });
    stationId = station.id;
    const key = `e2e/timings/${eventId}/amberfield.csv`;
    await t.app.get(StorageService).put(key, CSV, 'text/csv');
    const upload = new Upload({
      team: event.team,
      storageKey: key,
      name: 'amberfield.csv',
      contentType: 'text/csv',
      sizeBytes: Buffer.byteLength(CSV),
      sha256: createHash('sha256').update(CSV).digest('hex'),
      createdBy: null,
    });
    const report = new Report(event, station, em.getReference(User, w.userIds.observer), 'positive');
    report.lightCurve = upload;
    await em.persist([upload, report]).flush();
    reportId = report.id;
  });
  afterAll(async () => {
    await worker.close();
    await t.close();
  });

  async function solved(timingId: string): Promise<TimingDetail> {
    const deadline = Date.now() + 45_000;
    for (;;) {
      const response = await t
        .get(`/api/events/${eventId}/timings/${timingId}`)
        .set(w.auth('observer'))
        .expect(200);
      const body = response.body as TimingDetail;
      if (body.state === 'solved' || body.state === 'failed' || Date.now() > deadline) return body;
      await new Promise((resolve) => setTimeout(resolve, 200));
    }
  }

  let timingId: string;

  it('POST /api/events/:eventId/reports/:reportId/timings queues a job that the worker solves', async () => {
    const response = await t
      .post(`/api/events/${eventId}/reports/${reportId}/timings`)
      .set(w.auth('modeller'))
      .send(OPTIONS)
      .expect(202);
    timingId = (response.body as { id: string }).id;
    const detail = await solved(timingId);
    expect(detail.error).toBeNull();
    expect(detail.state).toBe('solved');
    const result = detail.result;
    if (!result?.disappearance || !result.reappearance) throw new Error('no D or R');
    // Truth is the square well the curve was drawn from (square-well.ts); 0.01 s is a tenth of a sample,
    // about four times the 1-sigma the fit reports at this noise (~0.002 s).
    expect(Math.abs(secondsFromOrigin(result.disappearance.time) - TRUE_D_SECONDS)).toBeLessThan(0.01);
    expect(Math.abs(secondsFromOrigin(result.reappearance.time) - TRUE_R_SECONDS)).toBeLessThan(0.01);
    expect(result.disappearance.sigmaSeconds).toBeGreaterThan(0);
    expect(result.disappearance.sigmaSeconds).toBeLessThan(0.05);
    expect(result.dips).toHaveLength(1);
    const dip = result.dips[0];
    if (!dip) throw new Error('no dip');
    expect(Math.abs(secondsFromOrigin(dip.start.time) - RING_DIP.startSeconds)).toBeLessThan(0.03);
    expect(Math.abs(secondsFromOrigin(dip.end.time) - RING_DIP.endSeconds)).toBeLessThan(0.03);
    expect(dip.marked).toBe(false);
    expect(result.series.flux).toHaveLength(600);
    expect(result.series.modelFlux).toHaveLength(600);
    const row = await t.orm.em
      .fork()
      .findOneOrFail(LightCurveTiming, { id: timingId }, { populate: ['result'] });
    expect(row.state).toBe('solved');
    expect(row.result?.disappearance).toEqual(result.disappearance);
  });

  it('a timing whose job never reached Redis is answered 202, then queued again by the worker and solved', async () => {
    const queue = t.app.get<Queue>(getQueueToken(TIMINGS_QUEUE));
    const add = queue.add.bind(queue);
    queue.add = () => Promise.reject(new Error('Connection is closed.'));
    let id: string;
    try {
      const response = await t
        .post(`/api/events/${eventId}/reports/${reportId}/timings`)
        .set(w.auth('modeller'))
        .send(OPTIONS)
        .expect(202);
      id = (response.body as { id: string }).id;
    } finally {
      queue.add = add;
    }
    expect(await queue.getJob(id)).toBeUndefined();
    // The sweep leaves rows younger than a submit's grace period alone; this one is made older.
    await t.orm.em
      .fork()
      .nativeUpdate(LightCurveTiming, { id }, { createdAt: new Date(Date.now() - 60_000) });
    await worker.get(TimingRequeue).sweep();
    expect((await solved(id)).state).toBe('solved');
  });

  it('POST /api/events/:eventId/timings/:timingId/accept writes D and R with their sigmas into the station chord and accepts the report', async () => {
    const detail = await solved(timingId);
    expect(detail.inChord).toBe(false);
    const response = await t
      .post(`/api/events/${eventId}/timings/${timingId}/accept`)
      .set(w.auth('modeller'))
      .expect(200);
    const body = response.body as { chordId: string; report: { state: string; chord: { source: string } } };
    const chord = await t.orm.em.fork().findOneOrFail(Chord, { id: body.chordId }, { populate: ['station'] });
    expect(chord.station.id).toBe(stationId);
    expect(chord.type).toBe('positive');
    expect(chord.disappearance).toEqual(detail.result?.disappearance);
    expect(chord.reappearance).toEqual(detail.result?.reappearance);
    expect(chord.source).toBe('timing');
    expect(chord.timing?.id).toBe(timingId);
    expect(chord.report?.id).toBe(reportId);
    // The example's own chord at this station was updated, not joined by a second one.
    expect(await t.orm.em.fork().count(Chord, { event: eventId, station: stationId })).toBe(1);
    expect((await t.orm.em.fork().findOneOrFail(Report, { id: reportId })).state).toBe('accepted');
    expect(body.report).toMatchObject({ state: 'accepted', chord: { source: 'timing' } });
    expect((await solved(timingId)).inChord).toBe(true);
  });

  it('POST /api/events/:eventId/timings/:timingId/ring-events makes one ring event per dip, once', async () => {
    const em = t.orm.em.fork();
    const before = await em.count(RingEvent, { event: eventId });
    const response = await t
      .post(`/api/events/${eventId}/timings/${timingId}/ring-events`)
      .set(w.auth('modeller'))
      .send({ ring: 'R1' })
      .expect(201);
    const ids = (response.body as { ringEventIds: string[] }).ringEventIds;
    expect(ids).toHaveLength(1);
    const made = await t.orm.em
      .fork()
      .findOneOrFail(RingEvent, { id: ids[0] }, { populate: ['report', 'station'] });
    const detail = await solved(timingId);
    expect(made.ring).toBe('R1');
    expect(made.station.id).toBe(stationId);
    expect(made.report?.id).toBe(reportId);
    expect(made.start).toEqual(detail.result?.dips[0]?.start);
    expect(await t.orm.em.fork().count(RingEvent, { event: eventId })).toBe(before + 1);
    await t
      .post(`/api/events/${eventId}/timings/${timingId}/ring-events`)
      .set(w.auth('modeller'))
      .send({ ring: 'R1' })
      .expect(409);
  });

  it('POST /api/events/:eventId/timings/:timingId/dips measures a hand-marked dip below the threshold', async () => {
    const iso = (s: number): string => new Date((ORIGIN_UNIX_SECONDS + s) * 1000).toISOString();
    const count = () => t.orm.em.fork().count(LightCurveTiming, { report: reportId });
    const before = await count();
    const response = await t
      .post(`/api/events/${eventId}/timings/${timingId}/dips`)
      .set(w.auth('modeller'))
      .send({ startUtc: iso(FAINT_DIP.startSeconds - 0.3), endUtc: iso(FAINT_DIP.endSeconds + 0.3) })
      .expect(202);
    const again = await solved((response.body as { id: string }).id);
    expect(again.state).toBe('solved');
    expect(again.options.markedDips).toHaveLength(1);
    const marked = again.result?.dips.filter((d) => d.marked) ?? [];
    expect(marked).toHaveLength(1);
    const dip = marked[0];
    if (!dip) throw new Error('no marked dip');
    // Depth 0.04 at noise 0.02 over 5 samples: the measured opacity is within a few of its 0.009 standard errors.
    expect(Math.abs(dip.apparentOpacity - FAINT_DIP.opacity)).toBeLessThan(0.04);
    expect(again.result?.dips.filter((d) => !d.marked)).toHaveLength(1);
    expect(await count()).toBe(before + 1); // a new timing, the marked one; the original stays
  });

  it("GET /api/events/:eventId/reports/:reportId/timing-defaults gives the station's speed and the distance from the event", async () => {
    const response = await t
      .get(`/api/events/${eventId}/reports/${reportId}/timing-defaults`)
      .set(w.auth('modeller'))
      .expect(200);
    const defaults = response.body as {
      speedKmPerS: number;
      distanceKm: number;
      exposureSeconds: number | null;
      atFrom: string;
      atUtc: string;
    };
    // The report has no times of its own, so the instant is the event's positive chords' mean mid-time;
    // the fit's own projection of amberfield's chord moves at nearly the same speed.
    expect(defaults.atFrom).toBe('chords');
    const exported = (await t.get(`/api/events/${eventId}/export`).set(w.auth('modeller')).expect(200))
      .body as EventInput;
    const chord = projectEvent(exported).chords.find((c) => c.station === 'amberfield');
    expect(chord).toBeDefined();
    const speed = Math.hypot(chord?.velocityKmPerS.f ?? 0, chord?.velocityKmPerS.g ?? 0);
    expect(Math.abs(defaults.speedKmPerS - speed) / speed).toBeLessThan(0.01);
    expect(defaults.distanceKm).toBeGreaterThan(1e9);
    expect(defaults.exposureSeconds).toBeNull();
    await t
      .get(`/api/events/${eventId}/reports/${randomUUID()}/timing-defaults`)
      .set(w.auth('modeller'))
      .expect(404);
  });

  it('POST /api/events/:eventId/reports/:reportId/timings answers 400 naming each bad field and stores nothing', async () => {
    const before = await t.orm.em.fork().count(LightCurveTiming, { report: reportId });
    const response = await t
      .post(`/api/events/${eventId}/reports/${reportId}/timings`)
      .set(w.auth('modeller'))
      .send({ ...OPTIONS, speedKmPerS: -1, bottom: 'sideways' })
      .expect(400);
    const paths = (response.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path).sort();
    expect(paths).toEqual(['bottom', 'speedKmPerS']);
    const dip = await t
      .post(`/api/events/${eventId}/timings/${timingId}/dips`)
      .set(w.auth('modeller'))
      .send({ startUtc: 'soon', endUtc: '2028-03-14T02:14:28Z' })
      .expect(400);
    expect((dip.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path)).toEqual(['startUtc']);
    expect(await t.orm.em.fork().count(LightCurveTiming, { report: reportId })).toBe(before);
  });

  const ACTORS = [
    'admin',
    'coordinator',
    'observer',
    'modeller',
    'reviewer',
    'outsider',
    'anonymous',
  ] as const;
  async function freshSolvedTiming(): Promise<string> {
    const response = await t
      .post(`/api/events/${eventId}/reports/${reportId}/timings`)
      .set(w.auth('modeller'))
      .send(OPTIONS)
      .expect(202);
    const id = (response.body as { id: string }).id;
    expect((await solved(id)).state).toBe('solved');
    return id;
  }

  // Every cell of the timing rows of docs/authorization.md ("outsider" is the other team's coordinator).
  it.each([
    { route: 'POST …/reports/:reportId/timings', codes: [202, 202, 403, 202, 403, 404, 401] },
    { route: 'GET …/reports/:reportId/timings', codes: [200, 200, 200, 200, 200, 404, 401] },
    { route: 'GET …/reports/:reportId/timing-defaults', codes: [200, 200, 200, 200, 200, 404, 401] },
    { route: 'GET …/timings/:timingId', codes: [200, 200, 200, 200, 200, 404, 401] },
    { route: 'POST …/timings/:timingId/accept', codes: [200, 200, 403, 200, 403, 404, 401] },
    { route: 'POST …/timings/:timingId/ring-events', codes: [201, 201, 403, 201, 403, 404, 401] },
    { route: 'POST …/timings/:timingId/dips', codes: [202, 202, 403, 202, 403, 404, 401] },
  ])('$route answers each role as docs/authorization.md says', async ({ route, codes }) => {
    const actual: number[] = [];
    for (const [k, actor] of ACTORS.entries()) {
      const allowed = codes[k] !== undefined && codes[k] < 400;
      // Ring events are made once per timing, so each allowed caller gets a timing of its own.
      const id = route.endsWith('ring-events') && allowed ? await freshSolvedTiming() : timingId;
      const url = route
        .replace('POST ', '')
        .replace('GET ', '')
        .replace('…', `/api/events/${eventId}`)
        .replace(':reportId', reportId)
        .replace(':timingId', id);
      const req = route.startsWith('GET') ? t.get(url) : t.post(url);
      const body = route.endsWith('/timings')
        ? OPTIONS
        : route.endsWith('ring-events')
          ? { ring: 'R9' }
          : route.endsWith('dips')
            ? { startUtc: '2028-03-14T02:14:27.5Z', endUtc: '2028-03-14T02:14:28.5Z' }
            : {};
      actual.push((await req.set(w.auth(actor)).send(body)).status);
    }
    expect(actual).toEqual(codes);
  });

  it('POST /api/events/:eventId/timings/:timingId/accept of another timing asks before replacing the timed chord', async () => {
    const other = await freshSolvedTiming();
    const refused = await t
      .post(`/api/events/${eventId}/timings/${other}/accept`)
      .set(w.auth('coordinator'))
      .send({})
      .expect(409);
    expect(refused.body).toMatchObject({
      code: 'replaces-better-timing',
      detail: { station: 'amberfield', source: 'timing', timingId },
    });
    expect((refused.body as { message: string }).message).toMatch(
      /^the chord of amberfield holds times from a light-curve timing \(σ .+\); this timing's times have σ .+ s$/,
    );
    const listed = async () =>
      (await t.get(`/api/events/${eventId}/reports/${reportId}/timings`).set(w.auth('observer')).expect(200))
        .body as Array<{ id: string; inChord: boolean }>;
    expect((await listed()).filter((s) => s.inChord).map((s) => s.id)).toEqual([timingId]);
    await t
      .post(`/api/events/${eventId}/timings/${other}/accept`)
      .set(w.auth('coordinator'))
      .send({ replaceTimedChord: true })
      .expect(200);
    expect((await listed()).filter((s) => s.inChord).map((s) => s.id)).toEqual([other]);
    const chord = await t.orm.em.fork().findOneOrFail(Chord, { report: reportId });
    expect(chord.timing?.id).toBe(other);
  });

  it('timing routes: observers read but may not queue; another team sees nothing', async () => {
    await t.get(`/api/events/${eventId}/reports/${reportId}/timings`).set(w.auth('observer')).expect(200);
    await t
      .post(`/api/events/${eventId}/reports/${reportId}/timings`)
      .set(w.auth('observer'))
      .send(OPTIONS)
      .expect(403);
    await t.get(`/api/events/${eventId}/timings/${timingId}`).set(w.auth('outsider')).expect(404);
    await t.post(`/api/events/${eventId}/timings/${timingId}/accept`).set(w.auth('outsider')).expect(404);
  });
});
