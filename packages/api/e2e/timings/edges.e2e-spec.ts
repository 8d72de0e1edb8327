import 'reflect-metadata';
import { createHash } from 'node:crypto';
import type { INestApplicationContext } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { limbCrossing, shadowMotionAt, type EventInput, type Solution } from '@limbus/geometry';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Chord } from '../../src/chords/entities/chord.entity';
import { RingEvent } from '../../src/chords/entities/ring-event.entity';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { Report } from '../../src/reports/entities/report.entity';
import { Station } from '../../src/stations/entities/station.entity';
import { StorageService } from '../../src/storage/storage.service';
import type { TimingDefaults } from '../../src/timings/timing-defaults';
import type { TimingDetail } from '../../src/timings/timings.service';
import { Upload } from '../../src/uploads/entities/upload.entity';
import { User } from '../../src/users/entities/user.entity';
import { WorkerModule } from '../../src/worker.module';
import { createWorkspace, importExample, patch, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';
import { squareWellCsv } from './square-well';

// The invented example event's station brackwater: D 02:13:56.183, R 02:14:21.141. Its camera here stopped
// at 02:14:10, inside the event, so its light curve holds the disappearance only (a single-edge chord).
const ORIGIN_UNIX_SECONDS = Date.UTC(2028, 2, 14, 2, 13, 40) / 1000;
const TRUE_D_SECONDS = 16.183;
const RING_DIP = { startSeconds: 8.88, endSeconds: 9.18, opacity: 0.6 };
const CSV = squareWellCsv({
  originUnixSeconds: ORIGIN_UNIX_SECONDS,
  samples: 300,
  cadenceSeconds: 0.1,
  wells: [{ startSeconds: TRUE_D_SECONDS, endSeconds: 41.141, opacity: 1 }, RING_DIP],
  noiseSigma: 0.02,
  seed: 20280315,
});
// Where the Fresnel scale (18 m) is far below the 0.1 s samples, as in timings.e2e-spec.ts: the square
// well is then what a real edge looks like.
const OPTIONS = { speedKmPerS: 20, distanceKm: 1.0e6, exposureSeconds: 0.1, bottom: 'zero' };
// The limb the example was written from (tools/examples/make-event-examples.ts).
const LIMB = {
  centerFKm: 14,
  centerGKm: -9,
  equatorialRadiusKm: 415,
  oblateness: 0.12,
  positionAngleDeg: 35,
};

describe('timing edges: single-edge curves, edge speeds, dip opacity into ring events', () => {
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
    const em = t.orm.em.fork();
    const event = await em.findOneOrFail(OccultationEvent, { id: eventId }, { populate: ['team'] });
    const station = await em.findOneOrFail(Station, { event: eventId, code: 'brackwater' });
    stationId = station.id;
    const key = `e2e/timings/${eventId}/brackwater.csv`;
    await t.app.get(StorageService).put(key, CSV, 'text/csv');
    const upload = new Upload({
      team: event.team,
      storageKey: key,
      name: 'brackwater.csv',
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

  const defaults = async (): Promise<TimingDefaults> =>
    (
      await t
        .get(`/api/events/${eventId}/reports/${reportId}/timing-defaults`)
        .set(w.auth('modeller'))
        .expect(200)
    ).body as TimingDefaults;

  it('GET …/timing-defaults takes the edge speeds from the full speed, then the prediction, then the latest fit', async () => {
    const none = await defaults();
    expect(none.edgeSpeeds).toMatchObject({
      from: 'full',
      fitId: null,
      disappearanceKmPerS: none.speedKmPerS,
      reappearanceKmPerS: none.speedKmPerS,
    });
    expect(none.rings).toEqual([]);

    await patch(t, `/api/events/${eventId}`)
      .set(w.auth('coordinator'))
      .send({ prediction: { bodyRadiusKm: 400 } })
      .expect(200);
    const predicted = await defaults();
    expect(predicted.edgeSpeeds.from).toBe('prediction');
    // brackwater crosses a 400 km circle about the ephemeris centre off its middle: both edges slower.
    expect(predicted.edgeSpeeds.disappearanceKmPerS).toBeLessThan(predicted.speedKmPerS);

    // A solved fit (stored as the fit worker stores one) with the example's own limb and one ring.
    const exported = (await t.get(`/api/events/${eventId}/export`).set(w.auth('modeller')).expect(200))
      .body as EventInput;
    const em = t.orm.em.fork();
    const event = await em.findOneOrFail(OccultationEvent, { id: eventId });
    const fit = new FitRun(event, em.getReference(User, w.userIds.modeller), {
      input: JSON.stringify(exported),
      inputSha256: 'a'.repeat(64),
      dataSha256: 'b'.repeat(64),
      options: {},
      engineVersion: 'e2e',
      seed: 1,
      idempotencyKey: null,
    });
    const zero = { ...LIMB, centerFKm: 0, centerGKm: 0, equivalentRadiusKm: 0 };
    fit.state = 'solved';
    fit.finishedAt = new Date();
    fit.solution = {
      format: 'limbus-solution/1',
      chords: [],
      limb: {
        ...LIMB,
        equivalentRadiusKm: 415 * Math.sqrt(0.88),
        uncertainty: zero,
        chi2: 1,
        dof: 1,
        radialResidualsKm: [],
        negativeChordsClear: true,
        timeOffsets: [],
        band: [],
      },
      rings: [
        {
          ring: 'R1',
          centerFKm: 14,
          centerGKm: -9,
          radiusKm: 1100,
          openingAngleDeg: 33,
          positionAngleDeg: 35,
          uncertainty: { radiusKm: 2, openingAngleDeg: 0.8, positionAngleDeg: 0.5 },
          poles: [
            { raDeg: 1, decDeg: 2 },
            { raDeg: 3, decDeg: 4 },
          ],
          crossings: [],
          chi2: 1,
          dof: 1,
        },
      ],
      astrometry: null,
      engine: { version: 'e2e', inputSha256: 'a'.repeat(64), seed: 1 },
    } satisfies Solution;
    await em.persist(fit).flush();

    const fromFit = await defaults();
    // The same limb-normal speeds the geometry gives for this station's track at that instant.
    const motion = shadowMotionAt(exported, 'brackwater', fromFit.atUtc);
    const crossing = limbCrossing(LIMB, motion.pointKm, motion.velocityKmPerS);
    expect(fromFit.edgeSpeeds).toMatchObject({
      from: 'fit',
      fitId: fit.id,
      disappearanceKmPerS: crossing?.disappearanceKmPerS,
      reappearanceKmPerS: crossing?.reappearanceKmPerS,
    });
    expect(fromFit.rings).toEqual([
      { ring: 'R1', openingAngleDeg: 33, openingAngleSigmaDeg: 0.8, fitId: fit.id },
    ]);
  });

  let timingId: string;

  it('POST …/timings times the one edge of a curve that ends inside the event, at its own edge speed', async () => {
    const d = await defaults();
    const response = await t
      .post(`/api/events/${eventId}/reports/${reportId}/timings`)
      .set(w.auth('modeller'))
      .send({
        ...OPTIONS,
        speedDisappearanceKmPerS: 12,
        speedReappearanceKmPerS: 15,
        edgeSpeedsFrom: 'entered',
        ringOpeningAngleDeg: d.rings[0]?.openingAngleDeg,
        ringOpeningAngleSigmaDeg: d.rings[0]?.openingAngleSigmaDeg,
      })
      .expect(202);
    timingId = (response.body as { id: string }).id;
    const detail = await solved(timingId);
    expect(detail.error).toBeNull();
    const result = detail.result;
    if (result === null || result.disappearance === null) throw new Error('no disappearance');
    expect(result.reappearance).toBeNull();
    expect(result.edgeSpeedsKmPerS).toEqual({ disappearance: 12, reappearance: 15 });
    // Truth: the square well's edge (square-well.ts); 0.01 s is a tenth of a sample.
    expect(
      Math.abs(Date.parse(result.disappearance.time) / 1000 - ORIGIN_UNIX_SECONDS - TRUE_D_SECONDS),
    ).toBeLessThan(0.01);
    expect(detail.options).toMatchObject({ speedDisappearanceKmPerS: 12, edgeSpeedsFrom: 'entered' });
    const dip = result.dips[0];
    if (dip === undefined) throw new Error('no dip');
    // τ_N = τ·|sin B| with the fit ring's B = 33°: the truth −ln(0.4)·sin 33° = 0.4990, within 3 sigma.
    expect(Math.abs((dip.normalOpticalDepth ?? NaN) - 0.499)).toBeLessThan(
      3 * (dip.normalOpticalDepthSigma ?? 0),
    );
    expect(dip.lowerLimits).toBeNull();
  });

  it('POST …/timings/:timingId/accept writes the single edge into the chord, the other edge left out', async () => {
    const detail = await solved(timingId);
    const response = await t
      .post(`/api/events/${eventId}/timings/${timingId}/accept`)
      .set(w.auth('modeller'))
      .expect(200);
    const chord = await t.orm.em
      .fork()
      .findOneOrFail(
        Chord,
        { id: (response.body as { chordId: string }).chordId },
        { populate: ['station'] },
      );
    expect(chord.station.id).toBe(stationId);
    expect(chord.disappearance).toEqual(detail.result?.disappearance);
    expect(chord.reappearance).toBeNull();
    const exported = (await t.get(`/api/events/${eventId}/export`).set(w.auth('modeller')).expect(200))
      .body as EventInput;
    const inFile = exported.chords.find((c) => c.station === 'brackwater');
    expect(inFile).toEqual({
      station: 'brackwater',
      type: 'positive',
      disappearance: detail.result?.disappearance,
      timeOffsetSeconds: 0,
    });
  });

  it("POST …/timings/:timingId/ring-events carries each dip's apparent opacity into its ring event", async () => {
    const detail = await solved(timingId);
    const dip = detail.result?.dips[0];
    const response = await t
      .post(`/api/events/${eventId}/timings/${timingId}/ring-events`)
      .set(w.auth('modeller'))
      .send({ ring: 'R1' })
      .expect(201);
    const id = (response.body as { ringEventIds: string[] }).ringEventIds[0] ?? '';
    const made = await t.orm.em.fork().findOneOrFail(RingEvent, { id });
    expect(made.apparentOpacity).toEqual({
      value: dip?.apparentOpacity,
      sigma: dip?.apparentOpacitySigma,
      lowerLimit: false,
    });
    // The square well's 0.6 within 3 sigma.
    expect(Math.abs((made.apparentOpacity?.value ?? NaN) - RING_DIP.opacity)).toBeLessThan(
      3 * (made.apparentOpacity?.sigma ?? 0),
    );
    const exported = (await t.get(`/api/events/${eventId}/export`).set(w.auth('modeller')).expect(200))
      .body as EventInput;
    expect(exported.ringEvents.at(-1)?.apparentOpacity).toEqual(made.apparentOpacity);
  });

  it('POST …/timings refuses an opening-angle sigma without its angle, naming it', async () => {
    const response = await t
      .post(`/api/events/${eventId}/reports/${reportId}/timings`)
      .set(w.auth('modeller'))
      .send({ ...OPTIONS, ringOpeningAngleSigmaDeg: 1, speedReappearanceKmPerS: 0 })
      .expect(400);
    const issues = (response.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path).sort();
    expect(issues).toEqual(['ringOpeningAngleSigmaDeg', 'speedReappearanceKmPerS']);
  });

  it('POST /api/events/:eventId/reports takes a positive with one time; accepting it makes a single-edge chord', async () => {
    const created = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({
        code: 'Late Start',
        latDeg: -30.5,
        lonDeg: -70.2,
        heightM: 2100,
        observerId: w.userIds.observer,
      })
      .expect(201);
    const station = created.body as { id: string };
    const report = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({
        stationId: station.id,
        result: 'positive',
        reappearance: { time: '2028-03-14T02:14:20.400Z', sigmaSeconds: 0.08 },
        notes: 'the camera started after the disappearance',
      })
      .expect(201);
    const id = (report.body as { id: string }).id;
    await t.post(`/api/reports/${id}/accept`).set(w.auth('coordinator')).expect(200);
    const chord = await t.orm.em.fork().findOneOrFail(Chord, { report: id });
    expect(chord.type).toBe('positive');
    expect(chord.disappearance).toBeNull();
    expect(chord.reappearance).toEqual({ time: '2028-03-14T02:14:20.400Z', sigmaSeconds: 0.08 });
  });
});
