import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { INestApplicationContext } from '@nestjs/common';
import { Queue } from 'bullmq';
import type { Solution } from '@limbus/geometry';
import { PDFDocument } from 'pdf-lib';
import type request from 'supertest';
import { XMLValidator } from 'fast-xml-parser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ComparisonView } from '../../src/comparisons/comparison-view';
import type { JointPoleView } from '../../src/comparisons/comparisons.service';
import { jointPole } from '../../src/comparisons/joint-pole';
import { JOINT_QUEUE } from '../../src/comparisons/joint-queue';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import {
  type Actor,
  createWorkspace,
  exampleEvent,
  importExample,
  type Workspace,
} from '../events/workspace';
import { bootWorker } from '../fits/worker';
import { bootTestApp, type TestApp } from '../setup';

// The CLI's joint-pole fixtures: three invented events of one ring whose pole was put at RA 41°,
// Dec +27° by tools/examples/make-event-examples.ts, seen from three star directions; the 2036 one has
// no positive chord, so its ring centre is free.
const FIXTURES = path.resolve(__dirname, '../../../../tools/cli/test/fixtures');
const fixture = (name: string) =>
  JSON.parse(readFileSync(path.join(FIXTURES, name), 'utf8')) as Record<string, unknown>;
const TRUE_POLE = { raDeg: 41, decDeg: 27 };

/** Collects a binary body: supertest buffers only text types by default. */
function binary(req: request.Test): request.Test {
  return req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}

describe('comparison across events and the joint ring pole job', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext;
  const eventIds: string[] = [];
  const fitIds: string[] = [];

  const solve = async (eventId: string): Promise<string> => {
    const id = (
      (await t.post(`/api/events/${eventId}/fits`).set(w.auth('modeller')).send({ options: {} }).expect(202))
        .body as { id: string }
    ).id;
    const deadline = Date.now() + 60_000;
    for (;;) {
      const state = (
        (await t.get(`/api/fits/${id}`).set(w.auth('observer')).expect(200)).body as { state: string }
      ).state;
      if (state === 'solved') return id;
      if (state === 'failed' || Date.now() > deadline) throw new Error(`fit ended ${state}`);
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  };

  const joint = async (body: Record<string, unknown>): Promise<JointPoleView> => {
    const id = (
      (await t.post(`/api/teams/${w.team.id}/joint-poles`).set(w.auth('modeller')).send(body).expect(202))
        .body as {
        id: string;
      }
    ).id;
    const deadline = Date.now() + 60_000;
    for (;;) {
      const view = (await t.get(`/api/joint-poles/${id}`).set(w.auth('observer')).expect(200))
        .body as JointPoleView;
      if (view.state === 'solved' || view.state === 'failed') return view;
      if (Date.now() > deadline) throw new Error('joint job did not finish');
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  };

  const storedFit = (id: string) =>
    t.orm.em.fork().findOneOrFail(FitRun, { id }, { populate: ['solution', 'input'] });

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    worker = await bootWorker(t.config);
    for (const file of [exampleEvent(), fixture('joint-2031.json'), fixture('joint-2036.json')])
      eventIds.push(await importExample(t, w, file));
    for (const id of eventIds) fitIds.push(await solve(id));
    // Review is another module's flow; here only its outcome matters, so two fits are marked approved.
    await t.orm.em
      .fork()
      .nativeUpdate(FitRun, { id: { $in: fitIds.slice(0, 2) } }, { reviewState: 'approved' });
  }, 180_000);
  afterAll(async () => {
    await worker.close();
    await t.close();
  });

  it('GET /api/teams/:teamId/comparison returns the approved fits by default, by event date, with the stored numbers', async () => {
    const view = (await t.get(`/api/teams/${w.team.id}/comparison`).set(w.auth('observer')).expect(200))
      .body as ComparisonView;
    expect(view.selection).toBe('latest-approved');
    expect(view.fits.map((f) => f.fitId)).toEqual(fitIds.slice(0, 2));
    expect(view.ringLabels).toEqual(['R1']);
    const first = view.fits[0];
    const solution = (await storedFit(fitIds[0] as string)).solution as Solution;
    expect(first?.eventDateUtc).toBe(solution.astrometry?.referenceTimeUtc);
    expect(first?.limb?.equatorialRadiusKm).toEqual({
      value: solution.limb?.equatorialRadiusKm,
      sigma: solution.limb?.uncertainty.equatorialRadiusKm,
    });
    expect(first?.rings[0]?.openingAngleDeg).toEqual({
      value: solution.rings[0]?.openingAngleDeg,
      sigma: solution.rings[0]?.uncertainty.openingAngleDeg,
    });
    expect(first?.rings[0]?.poles).toEqual(solution.rings[0]?.poles);
  });

  it('GET /api/teams/:teamId/comparison?fits=all adds unapproved fits; events= narrows to the chosen events', async () => {
    const all = (
      await t.get(`/api/teams/${w.team.id}/comparison?fits=all`).set(w.auth('observer')).expect(200)
    ).body as ComparisonView;
    expect(all.fits.map((f) => f.fitId)).toEqual(fitIds);
    // The 2036 event has no positive chord: no limb, but its ring is there.
    expect(all.fits[2]?.limb).toBeNull();
    expect(all.fits[2]?.rings).toHaveLength(1);
    const one = (
      await t
        .get(`/api/teams/${w.team.id}/comparison?fits=all&events=${eventIds[2]}`)
        .set(w.auth('observer'))
        .expect(200)
    ).body as ComparisonView;
    expect(one.fits.map((f) => f.fitId)).toEqual([fitIds[2]]);
    await t.get(`/api/teams/${w.team.id}/comparison`).set(w.auth('outsider')).expect(404);
    await t.get(`/api/teams/${w.team.id}/comparison?fits=some`).set(w.auth('observer')).expect(400);
  });

  it('POST /api/teams/:teamId/joint-poles recovers the pole of three events and resolves the ambiguity, as jointPole() does', async () => {
    const view = await joint({ fitIds });
    expect(view.state).toBe('solved');
    const doc = view.result;
    if (doc === null) throw new Error('no result');
    expect(doc.format).toBe('limbus-joint/1');
    expect(doc.ring).toBe('R1');
    expect(Math.abs(doc.pole.raDeg - TRUE_POLE.raDeg)).toBeLessThan(3 * doc.uncertainty.raDeg);
    expect(Math.abs(doc.pole.decDeg - TRUE_POLE.decDeg)).toBeLessThan(3 * doc.uncertainty.decDeg);
    expect(doc.ambiguityResolved).toBe(true);
    expect(doc.alternativePole.chi2 - doc.chi2).toBeGreaterThan(9);
    expect(doc.events.map((e) => e.fitId)).toEqual(fitIds);
    // The worker's answer is the geometry's answer on the stored inputs, exactly (the fit is deterministic).
    const inputs = await Promise.all(
      fitIds.map(async (id) => ({ fitId: id, input: (await storedFit(id)).input })),
    );
    expect(doc).toEqual(JSON.parse(JSON.stringify(jointPole(inputs, null))));
  });

  it('POST /api/teams/:teamId/joint-poles of one event leaves both poles standing, the two of its own ring fit', async () => {
    const view = await joint({ fitIds: [fitIds[0]] });
    const doc = view.result;
    if (doc === null) throw new Error(`no result: ${JSON.stringify(view.issues)}`);
    expect(doc.ambiguityResolved).toBe(false);
    const own = ((await storedFit(fitIds[0] as string)).solution as Solution).rings[0]?.poles ?? [];
    const near = (a: { raDeg: number; decDeg: number }, b: { raDeg: number; decDeg: number }) =>
      Math.abs(a.raDeg - b.raDeg) < 0.05 && Math.abs(a.decDeg - b.decDeg) < 0.05;
    expect(own.some((p) => near(p, doc.pole))).toBe(true);
    expect(own.some((p) => near(p, doc.alternativePole))).toBe(true);
  });

  it('POST /api/teams/:teamId/joint-poles reports a ring the events lack, naming each fit', async () => {
    const view = await joint({ fitIds: fitIds.slice(0, 2), ring: 'R9' });
    expect(view.state).toBe('failed');
    expect(view.issues.map((i) => i.path)).toEqual(
      fitIds.slice(0, 2).map((id) => expect.stringContaining(id)),
    );
    expect(view.issues[0]?.message).toBe('no dips of ring "R9" in this event (its rings: "R1")');
  });

  it('POST /api/teams/:teamId/joint-poles refuses fits of another team, observers and strangers', async () => {
    const bad = await t
      .post(`/api/teams/${w.team.id}/joint-poles`)
      .set(w.auth('modeller'))
      .send({ fitIds: [fitIds[0], 'not-a-fit'] })
      .expect(400);
    expect(JSON.stringify(bad.body)).toContain('fitIds.1');
    await t.post(`/api/teams/${w.team.id}/joint-poles`).set(w.auth('observer')).send({ fitIds }).expect(403);
    await t.post(`/api/teams/${w.team.id}/joint-poles`).set(w.auth('outsider')).send({ fitIds }).expect(404);
    const id = (
      (
        await t
          .post(`/api/teams/${w.team.id}/joint-poles`)
          .set(w.auth('coordinator'))
          .send({ fitIds })
          .expect(202)
      ).body as { id: string }
    ).id;
    await t.get(`/api/joint-poles/${id}`).set(w.auth('outsider')).expect(404);
    await t.get(`/api/joint-poles/00000000-0000-0000-0000-000000000000`).set(w.auth('observer')).expect(404);
  });
  it('POST /api/teams/:teamId/joint-poles answers 503 at once, queueing nothing, when Redis does not answer', async () => {
    // Every joint queue instance, whichever module holds it, stops answering (as with Redis away).
    const add = Queue.prototype.add;
    Queue.prototype.add = function (this: Queue, ...args: Parameters<Queue['add']>) {
      return this.name === JOINT_QUEUE ? new Promise(() => undefined) : add.apply(this, args);
    } as Queue['add'];
    try {
      const started = Date.now();
      const response = await t
        .post(`/api/teams/${w.team.id}/joint-poles`)
        .set(w.auth('modeller'))
        .send({ fitIds })
        .expect(503);
      expect(Date.now() - started).toBeLessThan(10_000);
      expect((response.body as { message: string }).message).toContain('nothing was queued');
    } finally {
      Queue.prototype.add = add;
    }
  });

  it('GET /api/teams/:teamId/comparison/figure draws the chosen fits and a solved joint pole as SVG, PNG and PDF', async () => {
    const view = await joint({ fitIds });
    const base = `/api/teams/${w.team.id}/comparison/figure?fits=all&jointId=${view.id}`;
    const svg = await t.get(`${base}&format=svg&widthMm=180`).set(w.auth('observer')).expect(200);
    const text = Buffer.isBuffer(svg.body) ? svg.body.toString('utf8') : svg.text;
    expect(XMLValidator.validate(text)).toBe(true);
    for (const id of fitIds) expect(text).toContain(`fitId="${id}"`);
    expect(text.match(/data-pole="/g)).toHaveLength(2 * fitIds.length);
    expect(text).toContain('data-role="joint-pole"');
    const png = (
      await binary(t.get(`${base}&format=png&widthMm=88&dpi=600`).set(w.auth('observer'))).expect(200)
    ).body as Buffer;
    expect(png.readUInt32BE(16)).toBe(2079);
    const pdf = (await binary(t.get(`${base}&format=pdf`).set(w.auth('observer'))).expect(200))
      .body as Buffer;
    const doc = await PDFDocument.load(pdf, { updateMetadata: false });
    for (const id of fitIds) expect(doc.getKeywords()).toContain(`fitId=${id}`);
    // A joint job of another team is not found, one that failed cannot be drawn.
    await t
      .get(`/api/teams/${w.team.id}/comparison/figure?format=svg&jointId=nope`)
      .set(w.auth('observer'))
      .expect(404);
    const failed = await joint({ fitIds: fitIds.slice(0, 1), ring: 'R9' });
    await t
      .get(`/api/teams/${w.team.id}/comparison/figure?format=svg&jointId=${failed.id}`)
      .set(w.auth('observer'))
      .expect(409);
  });

  it('every cell of the exports and comparison rows of docs/authorization.md', async () => {
    const jointId = (
      (
        await t
          .post(`/api/teams/${w.team.id}/joint-poles`)
          .set(w.auth('modeller'))
          .send({ fitIds })
          .expect(202)
      ).body as { id: string }
    ).id;
    const fit = fitIds[0] as string;
    const anyone = {
      admin: 200,
      coordinator: 200,
      observer: 200,
      modeller: 200,
      reviewer: 200,
      outsider: 404,
      anonymous: 401,
    };
    const matrix: Array<{
      method: 'get' | 'post';
      url: string;
      body?: object;
      expected: Record<Actor, number>;
    }> = [
      { method: 'get', url: `/api/fits/${fit}/figure?format=svg`, expected: anyone },
      { method: 'get', url: `/api/fits/${fit}/table?format=csv`, expected: anyone },
      { method: 'get', url: `/api/teams/${w.team.id}/comparison`, expected: anyone },
      { method: 'get', url: `/api/teams/${w.team.id}/comparison/figure?format=svg`, expected: anyone },
      {
        method: 'post',
        url: `/api/teams/${w.team.id}/joint-poles`,
        body: { fitIds: [fit] },
        expected: {
          admin: 202,
          coordinator: 202,
          observer: 403,
          modeller: 202,
          reviewer: 403,
          outsider: 404,
          anonymous: 401,
        },
      },
      { method: 'get', url: `/api/joint-poles/${jointId}`, expected: anyone },
    ];
    const seen: string[] = [];
    const wanted: string[] = [];
    for (const row of matrix)
      for (const [actor, status] of Object.entries(row.expected) as Array<[Actor, number]>) {
        const req = row.method === 'get' ? t.get(row.url) : t.post(row.url).send(row.body);
        const res = await req.set(w.auth(actor));
        seen.push(`${row.method} ${row.url} ${actor} ${res.status}`);
        wanted.push(`${row.method} ${row.url} ${actor} ${status}`);
      }
    expect(seen).toEqual(wanted);
  });
});
