import type { INestApplicationContext } from '@nestjs/common';
import { chi2MapOfFit, type Solution } from '@limbus/geometry';
import {
  type Chi2MapList,
  type Chi2MapRequestPayload,
  type Chi2MapView,
  validateEventFile,
} from '@limbus/schema';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import Papa from 'papaparse';
import { PDFDocument } from 'pdf-lib';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Chi2MapRun } from '../../src/chi2-maps/entities/chi2-map-run.entity';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { User } from '../../src/users/entities/user.entity';
import { type Actor, createWorkspace, importExample, type Workspace } from '../events/workspace';
import { bootWorker } from '../fits/worker';
import { bootTestApp, type TestApp } from '../setup';

/** Collects a binary body: supertest buffers only text types by default. */
function binary(req: request.Test): request.Test {
  return req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}

const ACTORS: Actor[] = ['admin', 'coordinator', 'observer', 'modeller', 'reviewer', 'outsider', 'anonymous'];
const REQUEST: Chi2MapRequestPayload = { x: 'centerFKm', y: 'equatorialRadiusKm', steps: 7 };

describe('χ² maps of a fit', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext;
  let eventId: string;
  let fitId: string;
  let fit: FitRun;
  let solution: Solution;
  let mapId: string;

  async function solvedFit(): Promise<string> {
    const id = (
      (await t.post(`/api/events/${eventId}/fits`).set(w.auth('modeller')).send({ options: {} }).expect(202))
        .body as { id: string }
    ).id;
    const deadline = Date.now() + 30_000;
    for (;;) {
      const state = (
        (await t.get(`/api/fits/${id}`).set(w.auth('observer')).expect(200)).body as { state: string }
      ).state;
      if (state === 'solved') return id;
      if (state === 'failed' || Date.now() > deadline) throw new Error(`fit ended ${state}`);
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  }

  async function finished(id: string, of = fitId): Promise<Chi2MapView> {
    const deadline = Date.now() + 45_000;
    for (;;) {
      const view = (await t.get(`/api/fits/${of}/chi2-maps/${id}`).set(w.auth('observer')).expect(200))
        .body as Chi2MapView;
      if (view.state === 'solved' || view.state === 'failed' || Date.now() > deadline) return view;
      await new Promise((resolve) => setTimeout(resolve, 150));
    }
  }

  /** A map row written directly in the given state, with no job: for the 409 and 404 answers. */
  async function storedMap(state: 'failed' | 'running', of = fitId): Promise<string> {
    const em = t.orm.em.fork();
    const row = new Chi2MapRun(
      em.getReference(FitRun, of),
      em.getReference(User, w.userIds.modeller),
      REQUEST,
    );
    row.state = state;
    row.error = state === 'failed' ? 'x: invented for the test' : null;
    await em.persist(row).flush();
    return row.id;
  }

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    worker = await bootWorker(t.config);
    eventId = await importExample(t, w);
    fitId = await solvedFit();
    fit = await t.orm.em.fork().findOneOrFail(FitRun, { id: fitId }, { populate: ['solution'] });
    if (fit.solution === null) throw new Error('solved fit without a solution');
    solution = fit.solution;
  });
  afterAll(async () => {
    await worker.close();
    await t.close();
  });

  it('GET /api/fits/:fitId/chi2-maps lists the fitted parameters with their 1-sigma, and no maps yet', async () => {
    const list = (await t.get(`/api/fits/${fitId}/chi2-maps`).set(w.auth('observer')).expect(200))
      .body as Chi2MapList;
    expect(list.maps).toEqual([]);
    const limb = solution.limb!;
    expect(list.parameters.slice(0, 5).map((p) => p.parameter)).toEqual([
      'centerFKm',
      'centerGKm',
      'equatorialRadiusKm',
      'oblateness',
      'positionAngleDeg',
    ]);
    expect(list.parameters[2]).toEqual({
      parameter: 'equatorialRadiusKm',
      unit: 'km',
      best: limb.equatorialRadiusKm,
      sigma: limb.uncertainty.equatorialRadiusKm,
      min: 1e-6 * limb.equatorialRadiusKm,
      max: null,
    });
    for (const ring of solution.rings)
      expect(list.parameters.map((p) => p.parameter)).toContain(`ring ${ring.ring} radiusKm`);
  });

  it('POST /api/fits/:fitId/chi2-maps queues a map that the worker computes, equal to a direct call', async () => {
    const response = await t
      .post(`/api/fits/${fitId}/chi2-maps`)
      .set(w.auth('modeller'))
      .send(REQUEST)
      .expect(202);
    mapId = (response.body as { id: string }).id;
    const view = await finished(mapId);
    expect(view.error).toBeNull();
    expect(view.state).toBe('solved');
    expect(view.progress).toBe(100);
    expect(view.request).toEqual(REQUEST);
    expect(view.createdBy?.id).toBe(w.userIds.modeller);
    const validation = validateEventFile(JSON.parse(fit.input), { stored: true });
    if (!validation.ok) throw new Error('stored input does not validate');
    // The worker's map is the geometry's, computed from the stored fit row alone.
    expect(view.result).toEqual(
      JSON.parse(JSON.stringify(chi2MapOfFit(validation.event, solution, REQUEST))),
    );
    const result = view.result!;
    expect(result.chi2).toHaveLength(7);
    expect(result.x.values).toHaveLength(7);
    // The default ranges are ±4σ about the stored fit.
    const limb = solution.limb!;
    expect(result.x.values[0]).toBeCloseTo(limb.centerFKm - 4 * limb.uncertainty.centerFKm, 9);
    const row = await t.orm.em.fork().findOneOrFail(Chi2MapRun, { id: mapId }, { populate: ['result'] });
    expect(row.state).toBe('solved');
    expect(row.result).toEqual(result);
    const list = (await t.get(`/api/fits/${fitId}/chi2-maps`).set(w.auth('observer')).expect(200))
      .body as Chi2MapList;
    expect(list.maps.map((m) => m.id)).toEqual([mapId]);
    expect(list.maps[0]).not.toHaveProperty('result');
  });

  it('POST /api/fits/:fitId/chi2-maps refuses, naming the field, what the fit cannot map', async () => {
    const issues = async (body: unknown) =>
      (
        (
          await t
            .post(`/api/fits/${fitId}/chi2-maps`)
            .set(w.auth('modeller'))
            .send(body as object)
            .expect(400)
        ).body as { issues: Array<{ path: string; message: string }> }
      ).issues;
    expect((await issues({ x: 'radius', y: 'centerGKm' }))[0]?.path).toBe('x');
    expect(await issues({ x: 'centerGKm', y: 'centerGKm' })).toEqual([
      { path: 'y', message: 'choose two different parameters' },
    ]);
    expect(await issues({ x: 'centerFKm', y: 'oblateness', ranges: { y: { from: 0, to: 1.5 } } })).toEqual([
      { path: 'ranges.y', message: 'oblateness must stay within [0, 0.999]' },
    ]);
    expect((await issues({ x: 'centerFKm', y: 'centerGKm', steps: 3 })).map((i) => i.path)).toEqual([
      'steps',
    ]);
    expect((await issues({ x: 'centerFKm', y: 'centerGKm', shade: 'red' })).map((i) => i.path)).toEqual([
      'shade',
    ]);
    const rows = await t.orm.em.fork().count(Chi2MapRun, { fit: fitId });
    expect(rows).toBe(1);
  });

  it('POST /api/fits/:fitId/chi2-maps answers 409 for a fit that is not solved', async () => {
    const em = t.orm.em.fork();
    const failed = await em.findOneOrFail(FitRun, { id: fitId });
    const copy = new FitRun(failed.event, em.getReference(User, w.userIds.modeller), {
      input: failed.input,
      inputSha256: failed.inputSha256,
      dataSha256: failed.dataSha256,
      options: {},
      engineVersion: failed.engineVersion,
      seed: failed.seed,
      idempotencyKey: null,
    });
    copy.state = 'failed';
    copy.error = 'invented for the test';
    await em.persist(copy).flush();
    await t.post(`/api/fits/${copy.id}/chi2-maps`).set(w.auth('modeller')).send(REQUEST).expect(409);
    const list = (await t.get(`/api/fits/${copy.id}/chi2-maps`).set(w.auth('observer')).expect(200))
      .body as Chi2MapList;
    expect(list.parameters).toEqual([]);
  });

  it('GET …/chi2-maps/:mapId/table?format=csv has one row per grid point and the provenance', async () => {
    const res = await t
      .get(`/api/fits/${fitId}/chi2-maps/${mapId}/table?format=csv`)
      .set(w.auth('observer'))
      .expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toContain(`limbus-chi2-map-${mapId}.csv`);
    const rows = Papa.parse<string[]>(res.text.trim()).data;
    expect(rows[0]).toEqual(['centerFKm [km]', 'equatorialRadiusKm [km]', 'chi2', 'deltaChi2', 'region']);
    const view = (await t.get(`/api/fits/${fitId}/chi2-maps/${mapId}`).set(w.auth('observer')).expect(200))
      .body as Chi2MapView;
    const map = view.result!;
    const grid = rows.slice(1, 1 + 49);
    expect(grid).toHaveLength(49);
    // Row k is x index k mod 7, y index ⌊k/7⌋, full precision.
    grid.forEach((r, k) => {
      expect(Number(r[0])).toBe(map.x.values[k % 7]);
      expect(Number(r[1])).toBe(map.y.values[Math.floor(k / 7)]);
      expect(Number(r[2])).toBe(map.chi2[Math.floor(k / 7)]![k % 7]);
    });
    const provenance = Object.fromEntries(rows.slice(50).map((r) => [r[1], r[2]]));
    expect(provenance).toMatchObject({ fitId, mapId, inputSha256: fit.inputSha256, chi2Of: map.chi2Of });
    const json = (
      await t
        .get(`/api/fits/${fitId}/chi2-maps/${mapId}/table?format=json`)
        .set(w.auth('observer'))
        .expect(200)
    ).body as { format: string; map: unknown };
    expect(json.format).toBe('limbus-chi2-map/1');
    expect(json.map).toEqual(map);
    await t.get(`/api/fits/${fitId}/chi2-maps/${mapId}/table?format=tex`).set(w.auth('observer')).expect(400);
  });

  it('GET …/chi2-maps/:mapId/figure gives a named SVG with three contours, a PNG and the same PDF twice', async () => {
    const svg = await t
      .get(`/api/fits/${fitId}/chi2-maps/${mapId}/figure?format=svg`)
      .set(w.auth('observer'))
      .expect(200);
    const text = Buffer.isBuffer(svg.body) ? (svg.body as Buffer).toString('utf8') : svg.text;
    expect(XMLValidator.validate(text)).toBe(true);
    const parsed = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '' }).parse(text) as {
      svg: {
        role: string;
        'aria-label': string;
        title: string;
        path: Array<{ 'data-role'?: string; 'data-sigma'?: string }>;
      };
    };
    expect(parsed.svg.role).toBe('img');
    expect(parsed.svg['aria-label']).toBe('Profile χ² of centerFKm and equatorialRadiusKm');
    const contours = parsed.svg.path.filter((p) => p['data-role'] === 'contour').map((p) => p['data-sigma']);
    expect(contours).toEqual(['1', '2', '3']);
    expect(text).toContain('centerFKm (km)');
    expect(text).toContain(`mapId="${mapId}"`);
    const png = (
      await binary(
        t
          .get(`/api/fits/${fitId}/chi2-maps/${mapId}/figure?format=png&widthMm=88&dpi=300`)
          .set(w.auth('observer')),
      ).expect(200)
    ).body as Buffer;
    expect(png.subarray(1, 4).toString('latin1')).toBe('PNG');
    // round(88 / 25.4 × 300) pixels wide (docs/file-formats.md, "Figure").
    expect(png.readUInt32BE(16)).toBe(1039);
    expect(png.includes(Buffer.from(`Limbus mapId\0${mapId}`, 'latin1'))).toBe(true);
    const pdfOf = async () =>
      (
        await binary(
          t.get(`/api/fits/${fitId}/chi2-maps/${mapId}/figure?format=pdf`).set(w.auth('observer')),
        ).expect(200)
      ).body as Buffer;
    const first = await pdfOf();
    expect(first.equals(await pdfOf())).toBe(true);
    const doc = await PDFDocument.load(first);
    expect(doc.getKeywords()).toContain(`mapId=${mapId}`);
  });

  it('GET …/chi2-maps/:mapId answers 404 for another fit’s map or none, downloads 409 until the map is solved', async () => {
    const otherFit = await solvedFit();
    await t.get(`/api/fits/${otherFit}/chi2-maps/${mapId}`).set(w.auth('observer')).expect(404);
    await t
      .get(`/api/fits/${fitId}/chi2-maps/00000000-0000-4000-8000-000000000000`)
      .set(w.auth('observer'))
      .expect(404);
    const failed = await storedMap('failed');
    const view = (await t.get(`/api/fits/${fitId}/chi2-maps/${failed}`).set(w.auth('observer')).expect(200))
      .body as Chi2MapView;
    expect(view).toMatchObject({ state: 'failed', error: 'x: invented for the test', result: null });
    await t
      .get(`/api/fits/${fitId}/chi2-maps/${failed}/figure?format=svg`)
      .set(w.auth('observer'))
      .expect(409);
    await t
      .get(`/api/fits/${fitId}/chi2-maps/${failed}/table?format=csv`)
      .set(w.auth('observer'))
      .expect(409);
  });

  describe('authorization (docs/authorization.md, "χ² maps")', () => {
    // Expected status per actor: members read, modellers and coordinators (and a site admin) ask.
    const read: Record<Actor, number> = {
      admin: 200,
      coordinator: 200,
      observer: 200,
      modeller: 200,
      reviewer: 200,
      outsider: 404,
      anonymous: 401,
    };
    const ask: Record<Actor, number> = {
      ...read,
      admin: 202,
      coordinator: 202,
      modeller: 202,
      observer: 403,
      reviewer: 403,
    };
    for (const actor of ACTORS) {
      it(`every χ² map route answers ${actor} as the table says`, async () => {
        const post = await t
          .post(`/api/fits/${fitId}/chi2-maps`)
          .set(w.auth(actor))
          .send({ ...REQUEST, steps: 5 });
        expect(post.status).toBe(ask[actor]);
        for (const url of [
          `/api/fits/${fitId}/chi2-maps`,
          `/api/fits/${fitId}/chi2-maps/${mapId}`,
          `/api/fits/${fitId}/chi2-maps/${mapId}/table?format=csv`,
          `/api/fits/${fitId}/chi2-maps/${mapId}/figure?format=svg`,
        ])
          expect((await t.get(url).set(w.auth(actor))).status, url).toBe(read[actor]);
        if (post.status === 202)
          expect((await finished((post.body as { id: string }).id)).state).toBe('solved');
      });
    }
  });
});
