import type { INestApplicationContext } from '@nestjs/common';
import type { Solution } from '@limbus/geometry';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import Papa from 'papaparse';
import { PDFDocument } from 'pdf-lib';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { createWorkspace, importExample, type Workspace } from '../events/workspace';
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

function pngSize(png: Buffer): { width: number; height: number } {
  expect(png.subarray(1, 4).toString('latin1')).toBe('PNG');
  expect(png.subarray(12, 16).toString('latin1')).toBe('IHDR');
  return { width: png.readUInt32BE(16), height: png.readUInt32BE(20) };
}

describe('figure and table exports of a fit', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext;
  let fitId: string;
  let stored: FitRun;
  let solution: Solution;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    worker = await bootWorker(t.config);
    const eventId = await importExample(t, w);
    fitId = (
      (await t.post(`/api/events/${eventId}/fits`).set(w.auth('modeller')).send({ options: {} }).expect(202))
        .body as { id: string }
    ).id;
    const deadline = Date.now() + 30_000;
    for (;;) {
      const state = (
        (await t.get(`/api/fits/${fitId}`).set(w.auth('observer')).expect(200)).body as { state: string }
      ).state;
      if (state === 'solved') break;
      if (state === 'failed' || Date.now() > deadline) throw new Error(`fit ended ${state}`);
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    stored = await t.orm.em.fork().findOneOrFail(FitRun, { id: fitId }, { populate: ['solution'] });
    if (stored.solution === null) throw new Error('solved fit without a solution');
    solution = stored.solution;
  });
  afterAll(async () => {
    await worker.close();
    await t.close();
  });

  it('GET /api/fits/:fitId/figure?format=svg is well-formed, one element per stored chord, with the stored provenance', async () => {
    const res = await t.get(`/api/fits/${fitId}/figure?format=svg`).set(w.auth('observer')).expect(200);
    expect(res.headers['content-type']).toMatch(/^image\/svg\+xml/);
    expect(res.headers['content-disposition']).toBe(
      `attachment; filename="limbus-fit-${fitId}-88mm.svg"; filename*=UTF-8''limbus-fit-${fitId}-88mm.svg`,
    );
    const svg = Buffer.isBuffer(res.body) ? res.body.toString('utf8') : res.text;
    expect(XMLValidator.validate(svg)).toBe(true);
    const stations = [...svg.matchAll(/data-chord="([^"]+)"/g)].map((m) => m[1]);
    expect(stations).toEqual(solution.chords.map((c) => c.station));
    const parsed = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '' }).parse(svg) as {
      svg: { metadata: { 'limbus:provenance': Record<string, string> } };
    };
    expect(parsed.svg.metadata['limbus:provenance']).toMatchObject({
      fitId,
      inputSha256: stored.inputSha256,
      engineVersion: stored.engineVersion,
      seed: String(stored.seed),
      date: stored.finishedAt?.toISOString(),
      approvalState: 'none',
    });
  });

  it('GET /api/fits/:fitId/figure?format=png decodes at the asked width for 88 mm/300 dpi and 180 mm/600 dpi', async () => {
    const single = await binary(
      t.get(`/api/fits/${fitId}/figure?format=png&widthMm=88&dpi=300`).set(w.auth('observer')),
    ).expect(200);
    expect(mimeType(single)).toBe('image/png');
    expect(pngSize(single.body as Buffer).width).toBe(1039);
    const double = await binary(
      t.get(`/api/fits/${fitId}/figure?format=png&widthMm=180&dpi=600`).set(w.auth('observer')),
    ).expect(200);
    expect(pngSize(double.body as Buffer).width).toBe(4252);
  });

  it('GET /api/fits/:fitId/figure?format=pdf parses, carries the provenance, and is the same file twice', async () => {
    const get = () =>
      binary(t.get(`/api/fits/${fitId}/figure?format=pdf&widthMm=180`).set(w.auth('modeller'))).expect(200);
    const a = (await get()).body as Buffer;
    const b = (await get()).body as Buffer;
    expect(a.equals(b)).toBe(true);
    const doc = await PDFDocument.load(a, { updateMetadata: false });
    expect(doc.getPageCount()).toBe(1);
    expect(Math.abs(doc.getPage(0).getWidth() - (180 * 72) / 25.4)).toBeLessThan(0.01);
    expect(doc.getSubject()).toContain(fitId);
    expect(doc.getKeywords()).toContain(`inputSha256=${stored.inputSha256}`);
  });

  it('GET /api/fits/:fitId/table?format=json states the stored numbers exactly', async () => {
    const res = await t.get(`/api/fits/${fitId}/table?format=json`).set(w.auth('reviewer')).expect(200);
    const doc = JSON.parse(Buffer.isBuffer(res.body) ? res.body.toString('utf8') : res.text) as {
      provenance: Record<string, unknown>;
      parameters: Array<{ group: string; parameter: string; value: number; sigma: number | null }>;
    };
    const limb = solution.limb;
    const ring = solution.rings[0];
    if (limb === null || ring === undefined) throw new Error('example lost its limb or ring');
    const get = (group: string, parameter: string) =>
      doc.parameters.find((p) => p.group === group && p.parameter === parameter);
    expect(get('limb', 'equatorialRadiusKm')).toMatchObject({
      value: limb.equatorialRadiusKm,
      sigma: limb.uncertainty.equatorialRadiusKm,
    });
    expect(get(`ring ${ring.ring}`, 'radiusKm')).toMatchObject({
      value: ring.radiusKm,
      sigma: ring.uncertainty.radiusKm,
    });
    expect(doc.provenance).toMatchObject({ fitId, inputSha256: stored.inputSha256, seed: stored.seed });
  });

  it('GET /api/fits/:fitId/table?format=csv and tex carry the same numbers and the provenance', async () => {
    const csv = await t.get(`/api/fits/${fitId}/table?format=csv`).set(w.auth('observer')).expect(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    const rows = Papa.parse<string[]>(csv.text.trim(), { newline: '\r\n' }).data;
    const limb = solution.limb;
    if (limb === null) throw new Error('example lost its limb');
    expect(Number(rows.find((r) => r[0] === 'limb' && r[1] === 'oblateness')?.[2])).toBe(limb.oblateness);
    expect(rows.find((r) => r[0] === 'provenance' && r[1] === 'fitId')?.[2]).toBe(fitId);
    const tex = await t.get(`/api/fits/${fitId}/table?format=tex`).set(w.auth('observer')).expect(200);
    expect(tex.text).toContain('\\pm');
    expect(tex.text).toContain(`% inputSha256: ${stored.inputSha256}`);
  });

  it('GET /api/fits/:fitId/figure refuses a bad format, a stranger, and a fit that is not solved', async () => {
    const bad = await t.get(`/api/fits/${fitId}/figure?format=gif`).set(w.auth('observer')).expect(400);
    expect(JSON.stringify(bad.body)).toContain('format');
    await t.get(`/api/fits/${fitId}/figure?format=svg`).set(w.auth('outsider')).expect(404);
    await t.get(`/api/fits/${fitId}/table?format=csv`).expect(401);
    const em = t.orm.em.fork();
    const queued = em.create(FitRun, {
      event: stored.event,
      createdBy: stored.createdBy,
      input: stored.input,
      inputSha256: stored.inputSha256,
      dataSha256: stored.dataSha256,
      options: {},
      engineVersion: stored.engineVersion,
      seed: stored.seed,
      idempotencyKey: null,
    });
    await em.persist(queued).flush();
    await t.get(`/api/fits/${queued.id}/table?format=csv`).set(w.auth('observer')).expect(409);
  });
});

function mimeType(res: request.Response): string {
  return String(res.headers['content-type']).split(';')[0] ?? '';
}
