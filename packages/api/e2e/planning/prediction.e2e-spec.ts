import { execFile } from 'node:child_process';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  briefingSchema,
  briefingsSentSchema,
  offsetFromFitAnswerSchema,
  placementAnswerSchema,
  predictionMapSchema,
} from '@limbus/schema';
import { AuditEntry } from '../../src/audit/entities/audit-entry.entity';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { User } from '../../src/users/entities/user.entity';
import { exampleSolution } from '../exports/example-fixture';
import { createWorkspace, importExample, patch, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';
import { plannedEvent, quillonFile, SETTINGS } from './planning-fixture';

const run = promisify(execFile);
const LIMBUS = path.resolve(__dirname, '../../../../tools/limbus');

const issuesOf = (response: request.Response) =>
  (response.body as { issues: Array<{ path: string; message: string }> }).issues;

interface PredictionDoc {
  format: string;
  closestApproach: { timeUtc: string; distanceKm: number; speedKmPerS: number };
  centralLine: Array<{ timeUtc: string; latDeg: number; lonDeg: number }>;
  stations: Array<{ station: string; crossTrackKm: number; disappearanceUtc: string | null }>;
}

describe("planning: the event's prediction, its map and files, placement and briefings", () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await plannedEvent(t, w);
  });
  afterAll(async () => {
    await t.close();
  });

  /** A fit stored directly, solved with the docs example's solution (its astrometry is known). */
  const storedFit = async (ofEventId: string, state: 'solved' | 'failed' = 'solved', astrometry = true) => {
    const em = t.orm.em.fork();
    const run = new FitRun(
      em.getReference(OccultationEvent, ofEventId),
      em.getReference(User, w.userIds.modeller),
      {
        input: '{}',
        inputSha256: '0'.repeat(64),
        dataSha256: '0'.repeat(64),
        options: {},
        engineVersion: 'e2e',
        seed: 1,
        idempotencyKey: null,
      },
    );
    run.state = state;
    run.reviewState = state === 'solved' ? 'approved' : 'none';
    run.solution =
      state === 'solved' ? { ...exampleSolution(), ...(astrometry ? {} : { astrometry: null }) } : null;
    await em.persistAndFlush(run);
    return run.id;
  };

  it('GET …/prediction answers 409 naming `prediction` while the event has no settings', async () => {
    const bare = await importExample(t, w, quillonFile(), { bodyName: 'Quillon' });
    const answer = await t.get(`/api/events/${bare}/prediction`).set(w.auth('observer')).expect(409);
    expect(answer.body).toMatchObject({
      code: 'no-prediction-settings',
      detail: { issues: [{ path: 'prediction' }] },
    });
    await t.get(`/api/events/${bare}/briefing`).set(w.auth('observer')).expect(409);
    await t.get(`/api/events/${bare}/placement?sites=1`).set(w.auth('coordinator')).expect(409);
  });

  it('PATCH …/events/:eventId stores the settings, shows them in the detail and the export; bad ones are 400 by field and nothing is saved', async () => {
    const detail = (await t.get(`/api/events/${eventId}`).set(w.auth('reviewer')).expect(200)).body as {
      prediction: Record<string, unknown> | null;
    };
    expect(detail.prediction).toMatchObject({ bodyRadiusKm: 365, rings: [{ ring: 'R1', radiusKm: 1100 }] });
    const exported = (await t.get(`/api/events/${eventId}/export`).set(w.auth('observer')).expect(200))
      .body as {
      prediction: Record<string, unknown>;
    };
    expect(exported.prediction).toMatchObject({ bodyRadiusKm: 365 });
    const before = await t.orm.em.fork().findOneOrFail(OccultationEvent, { id: eventId });
    const cases: Array<[Record<string, unknown>, string]> = [
      [{ ...SETTINGS, bodyRadiusKm: -1 }, 'prediction.bodyRadiusKm'],
      [{ ...SETTINGS, colour: 'red' }, 'prediction'],
      [{ ...SETTINGS, stepSeconds: 601 }, 'prediction.stepSeconds'],
      [{ ...SETTINGS, from: '2031-01-01T00:00:00Z' }, 'prediction.from'],
      [{ ...SETTINGS, rings: [{ ring: 'R1', radiusKm: 0 }] }, 'prediction.rings.0.radiusKm'],
    ];
    for (const [prediction, field] of cases) {
      const refused = await patch(t, `/api/events/${eventId}`)
        .set(w.auth('coordinator'))
        .send({ title: 'Renamed by a refused request', prediction })
        .expect(400);
      expect(issuesOf(refused).map((i) => i.path)).toContain(field);
    }
    const after = await t.orm.em.fork().findOneOrFail(OccultationEvent, { id: eventId });
    expect([after.title, after.prediction, after.revision]).toEqual([
      before.title,
      before.prediction,
      before.revision,
    ]);
    // A modeller edits the star and the ephemeris, but not the coordinator's planning.
    await patch(t, `/api/events/${eventId}`)
      .set(w.auth('modeller'))
      .send({ prediction: SETTINGS })
      .expect(403);
  });

  it('GET …/prediction is the document `limbus predict` prints for the exported file', async () => {
    const answer = (await t.get(`/api/events/${eventId}/prediction`).set(w.auth('observer')).expect(200))
      .body as PredictionDoc;
    expect(answer.format).toBe('limbus-prediction/1');
    const exported = (await t.get(`/api/events/${eventId}/export`).set(w.auth('observer')).expect(200))
      .body as unknown;
    const directory = await mkdtemp(path.join(tmpdir(), 'limbus-predict-'));
    try {
      const file = path.join(directory, 'event.json');
      await writeFile(file, JSON.stringify(exported));
      const { stdout } = await run(LIMBUS, ['predict', file], { maxBuffer: 64 * 1024 * 1024 });
      expect(answer).toEqual(JSON.parse(stdout));
    } finally {
      await rm(directory, { recursive: true, force: true });
    }
    // The positive chords' stations lie inside the predicted path (the demo's truth sits within 1σ).
    expect(answer.stations.find((s) => s.station === 'castellan-mesa')?.disappearanceUtc).not.toBeNull();
  });

  it('GET …/prediction is cached per revision: a change of the settings gives the new prediction at once', async () => {
    const first = (await t.get(`/api/events/${eventId}/prediction`).set(w.auth('observer')).expect(200))
      .body as PredictionDoc;
    await patch(t, `/api/events/${eventId}`)
      .set(w.auth('coordinator'))
      .send({ prediction: { ...SETTINGS, offsetMas: { raCosDec: 0, dec: 5 } } })
      .expect(200);
    const moved = (await t.get(`/api/events/${eventId}/prediction`).set(w.auth('observer')).expect(200))
      .body as PredictionDoc;
    // 5 mas at 6.214e9 km is 150.6 km on the sky plane, north: every station's offset changes.
    const delta = (moved.stations[0]?.crossTrackKm ?? 0) - (first.stations[0]?.crossTrackKm ?? 0);
    expect(Math.abs(delta)).toBeGreaterThan(100);
    await patch(t, `/api/events/${eventId}`)
      .set(w.auth('coordinator'))
      .send({ prediction: SETTINGS })
      .expect(200);
  });

  it("POST …/prediction/offset-from-fit takes an earlier fit's offset and σ, says what it assumes, is audited; refusals name fitId", async () => {
    const earlier = await importExample(t, w, quillonFile(), { bodyName: 'Quillon' });
    await patch(t, `/api/events/${earlier}`)
      .set(w.auth('coordinator'))
      .send({ eventTimeUtc: '2028-06-01T00:00:00Z' })
      .expect(200);
    const fitId = await storedFit(earlier);
    const answer = offsetFromFitAnswerSchema.parse(
      (
        await t
          .post(`/api/events/${eventId}/prediction/offset-from-fit`)
          .set(w.auth('coordinator'))
          .send({ fitId })
          .expect(200)
      ).body,
    );
    const astrometry = exampleSolution().astrometry;
    if (!astrometry) throw new Error('the example solution has astrometry');
    expect(answer.prediction).toMatchObject({
      bodyRadiusKm: 365,
      offsetMas: { raCosDec: astrometry.raOffsetCosDecMas, dec: astrometry.decOffsetMas },
      uncertaintyMas: {
        raCosDec: astrometry.uncertainty.raOffsetCosDecMas,
        dec: astrometry.uncertainty.decOffsetMas,
      },
    });
    expect(answer.offsetSource).toMatchObject({
      fitId,
      eventId: earlier,
      referenceTimeUtc: astrometry.referenceTimeUtc,
    });
    expect(answer.assumptions.join(' ')).toContain('taken as constant');
    const detail = (await t.get(`/api/events/${eventId}`).set(w.auth('observer')).expect(200)).body as {
      predictionOffsetSource: { fitId: string } | null;
    };
    expect(detail.predictionOffsetSource?.fitId).toBe(fitId);
    expect(
      await t.orm.em.fork().count(AuditEntry, { eventId, action: 'event.prediction.offset-from-fit' }),
    ).toBe(1);
    // A hand edit of the offset drops the source.
    await patch(t, `/api/events/${eventId}`)
      .set(w.auth('coordinator'))
      .send({ prediction: SETTINGS })
      .expect(200);
    const edited = (await t.get(`/api/events/${eventId}`).set(w.auth('observer')).expect(200)).body as {
      predictionOffsetSource: unknown;
    };
    expect(edited.predictionOffsetSource).toBeNull();

    const refuse = async (id: string, words: RegExp) => {
      const refused = await t
        .post(`/api/events/${eventId}/prediction/offset-from-fit`)
        .set(w.auth('coordinator'))
        .send({ fitId: id })
        .expect(400);
      expect(issuesOf(refused)).toEqual([{ path: 'fitId', message: expect.stringMatching(words) as string }]);
    };
    await refuse('no-such-fit', /no such fit/);
    await refuse(await storedFit(earlier, 'failed'), /failed; only a solved fit/);
    await refuse(await storedFit(earlier, 'solved', false), /no astrometry/);
    await refuse(await storedFit(eventId), /this event itself/);
    const later = await importExample(t, w, quillonFile(), { bodyName: 'Quillon' });
    await patch(t, `/api/events/${later}`)
      .set(w.auth('coordinator'))
      .send({ eventTimeUtc: '2031-01-01T00:00:00Z' })
      .expect(200);
    await refuse(await storedFit(later), /not earlier/);
    const otherBody = await importExample(t, w, quillonFile(), { bodyName: 'Varro' });
    await patch(t, `/api/events/${otherBody}`)
      .set(w.auth('coordinator'))
      .send({ eventTimeUtc: '2027-01-01T00:00:00Z' })
      .expect(200);
    await refuse(await storedFit(otherBody), /of Varro, this event of Quillon/);
    const elsewhere = await createWorkspace(t);
    const foreign = await importExample(t, elsewhere, quillonFile(), { bodyName: 'Quillon' });
    await refuse(await storedFit(foreign), /no such fit in this team/);
  });

  it('GET …/prediction/map, .geojson, .kml and /figure draw the lines and stations of the one description', async () => {
    const map = predictionMapSchema.parse(
      (await t.get(`/api/events/${eventId}/prediction/map`).set(w.auth('reviewer')).expect(200)).body,
    );
    expect(new Set(map.lines.map((l) => l.line))).toEqual(new Set(['central', 'left', 'right']));
    expect(map.lines.filter((l) => l.ring === 'R1')).toHaveLength(2);
    expect(map.lines.filter((l) => l.sigma === 1)).toHaveLength(4);
    // 3σ of the path (about 3 × 119 km = 358 km) nearly reaches the centre from a 365 km limit: an inner edge.
    expect(
      map.lines
        .filter((l) => l.sigma === 3)
        .map((l) => l.edge)
        .sort(),
    ).toEqual(['inner', 'inner', 'outer', 'outer']);
    expect(map.stations.find((s) => s.code === 'castellan-mesa')?.outlook).toBe('inside');
    expect(map.stations.find((s) => s.code === 'pennick-down')?.outlook).toBe('ring-only');

    const geo = await t.get(`/api/events/${eventId}/prediction.geojson`).set(w.auth('observer')).expect(200);
    expect(geo.headers['content-type']).toMatch(/^application\/geo\+json/);
    expect(geo.headers['content-disposition']).toBe(
      `attachment; filename="limbus-prediction-${eventId}.geojson"; filename*=UTF-8''limbus-prediction-${eventId}.geojson`,
    );
    const collection = JSON.parse(geo.text) as {
      type: string;
      features: Array<{ properties: { line: string } }>;
    };
    expect(collection.type).toBe('FeatureCollection');
    expect(new Set(collection.features.map((f) => f.properties.line))).toEqual(
      new Set(['central', 'left', 'right']),
    );
    const kml = await t.get(`/api/events/${eventId}/prediction.kml`).set(w.auth('observer')).expect(200);
    expect(kml.headers['content-type']).toMatch(/^application\/vnd\.google-earth\.kml\+xml/);
    expect(kml.text).toContain('<kml xmlns="http://www.opengis.net/kml/2.2">');

    const svg = await t
      .get(`/api/events/${eventId}/prediction/figure?format=svg`)
      .set(w.auth('observer'))
      .expect(200);
    expect(svg.headers['content-disposition']).toBe(
      `attachment; filename="limbus-shadow-path-${eventId}-180mm.svg"; filename*=UTF-8''limbus-shadow-path-${eventId}-180mm.svg`,
    );
    const text = svg.body instanceof Buffer ? svg.body.toString('utf8') : svg.text;
    expect(text).toContain('aria-label="Shadow path map: ');
    expect(text).toContain('data-path-line="central"');
    const bad = await t
      .get(`/api/events/${eventId}/prediction/figure?format=gif`)
      .set(w.auth('observer'))
      .expect(400);
    expect(issuesOf(bad).map((i) => i.path)).toEqual(['format']);
  });

  it('GET …/placement suggests offsets into the widest gaps with night sites, and a suggestion becomes a planned station', async () => {
    const answer = placementAnswerSchema.parse(
      (
        await t
          .get(`/api/events/${eventId}/placement?sites=2&ringsToo=false`)
          .set(w.auth('coordinator'))
          .expect(200)
      ).body,
    );
    expect(answer.suggestions).toHaveLength(2);
    expect(answer.worstDistanceKmAfter).toBeLessThan(
      answer.worstDistanceKmBefore ?? Number.POSITIVE_INFINITY,
    );
    expect(answer.largestGapKmAfter).toBeLessThanOrEqual(answer.largestGapKmBefore);
    for (const s of answer.suggestions) {
      expect(Math.abs(s.crossTrackKm)).toBeLessThan(365);
      if (!s.site) throw new Error(s.noSiteReason ?? 'no site');
      expect(s.site.sunAltitudeDeg).toBeLessThan(-12);
      expect(s.site.starAltitudeDeg).toBeGreaterThan(20);
    }
    const first = answer.suggestions[0];
    if (!first?.site) throw new Error('no site');
    const made = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({
        code: first.code,
        latDeg: first.site.latDeg,
        lonDeg: first.site.lonDeg,
        heightM: 0,
        status: 'planned',
      })
      .expect(201);
    expect((made.body as { status: string }).status).toBe('planned');
    const predicted = (
      await t.get(`/api/events/${eventId}/prediction`).set(w.auth('coordinator')).expect(200)
    ).body as PredictionDoc;
    const placed = predicted.stations.find((s) => s.station === first.code);
    // The station stands on the suggested offset line: its predicted offset is the suggestion's (the
    // Earth turns a little between the line's grid time and the station's own closest approach).
    expect(Math.abs((placed?.crossTrackKm ?? Number.NaN) - first.crossTrackKm)).toBeLessThan(5);

    const bad = await t
      .get(`/api/events/${eventId}/placement?sites=0&ringsToo=maybe&region=10,5,60,80`)
      .set(w.auth('coordinator'))
      .expect(400);
    expect(
      issuesOf(bad)
        .map((i) => i.path)
        .sort(),
    ).toEqual(['region', 'ringsToo', 'sites']);
    const elsewhere = await t
      .get(`/api/events/${eventId}/placement?sites=1&region=-60,-50,-100,-90`)
      .set(w.auth('coordinator'))
      .expect(200);
    expect(
      (elsewhere.body as { suggestions: Array<{ site: unknown; noSiteReason: string }> }).suggestions[0],
    ).toMatchObject({
      site: null,
      noSiteReason: 'the line at this offset does not pass through the region',
    });
  });

  it('POST …/briefings e-mails each observer their stations; GET …/briefing shows an observer their own', async () => {
    const station = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({
        code: 'briefed-site',
        latDeg: 8.9885,
        lonDeg: 70.8207,
        heightM: 420,
        observerId: w.userIds.observer,
        status: 'planned',
      })
      .expect(201);
    const sent = briefingsSentSchema.parse(
      (await t.post(`/api/events/${eventId}/briefings`).set(w.auth('coordinator')).expect(200)).body,
    );
    expect(sent.sent).toEqual([
      { userId: w.userIds.observer, name: expect.any(String) as string, stations: ['briefed-site'] },
    ]);
    expect(sent.withoutObserver.length).toBeGreaterThan(0);
    const email = (await t.orm.em.fork().findOneOrFail(User, { id: w.userIds.observer })).email;
    const mail = await t.mailAbout(email, 'Briefing: ');
    expect(mail.kind).toBe('briefing');
    expect(mail.text).toMatch(/Disappearance 2029-09-07 21:41:\d\d\.\d UTC ± \d+\.\d s/);
    expect(mail.text).toContain('Record from 2029-09-07 21:');
    expect(mail.text).toContain('Private land');
    expect(mail.text).toContain(`/events/${eventId}?section=briefing`);
    expect(await t.orm.em.fork().count(AuditEntry, { eventId, action: 'event.briefing.send' })).toBe(1);

    const own = briefingSchema.parse(
      (await t.get(`/api/events/${eventId}/briefing`).set(w.auth('observer')).expect(200)).body,
    );
    expect(own.stations.map((s) => s.stationId)).toEqual([(station.body as { id: string }).id]);
    const mine = own.stations[0];
    expect(mine?.outlook).toBe('inside');
    expect(mine?.disappearance?.sigmaSeconds).toBeGreaterThan(0);
    expect(mine?.pointing.starAltitudeDeg).toBeGreaterThan(80);
    expect(Date.parse(mine?.watch.fromUtc ?? '')).toBeLessThan(
      Date.parse(mine?.disappearance?.timeUtc ?? ''),
    );
    expect(own.safetyCautions.length).toBeGreaterThanOrEqual(4);
    const modeller = briefingSchema.parse(
      (await t.get(`/api/events/${eventId}/briefing`).set(w.auth('modeller')).expect(200)).body,
    );
    expect(modeller.stations).toEqual([]);
    const all = briefingSchema.parse(
      (await t.get(`/api/events/${eventId}/briefing`).set(w.auth('coordinator')).expect(200)).body,
    );
    expect(all.stations.length).toBeGreaterThan(10);
  });
});
