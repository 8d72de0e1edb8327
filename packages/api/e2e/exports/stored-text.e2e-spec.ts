// Issue 13, item 7: every exporter is robust to any text already stored, whatever the input rules say
// now. The titles here are written straight into the database with a NUL and an ESC (the state a title
// accepted before the control-character rule is in), in the events table and in the fits' frozen
// inputs. Before the fix the fit's figure and table answered 500 (its stored input no longer validated),
// the comparison dropped such fits or drew invalid XML, and the shape table carried the NUL into CSV/TeX.
import type { Solution } from '@limbus/geometry';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import Papa from 'papaparse';
import { PDFDocument } from 'pdf-lib';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { User } from '../../src/users/entities/user.entity';
import { attachmentName } from '../uploads/content-disposition';
import { createWorkspace, importExample, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';
import { exampleEvent, exampleSolution } from './example-fixture';

/** Collects a binary body: supertest buffers only text types by default. */
function binary(req: request.Test): request.Test {
  return req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}

const BAD_TITLE = 'Quillon\u0000 night \u001b[31m two';
// What XML 1.0 (5th ed., section 2.2, production [2] Char) forbids: C0 controls but tab, LF and CR.
// eslint-disable-next-line no-control-regex
const XML_FORBIDDEN = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\ufffe\uffff]/;
// eslint-disable-next-line no-control-regex
const CONTROL_BUT_LINE_ENDS = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;

describe('exports of text stored before the input rules', () => {
  let t: TestApp;
  let w: Workspace;
  let bodyId: string;
  const fitIds: string[] = [];

  /** A solved fit as the worker stores one, with the bad title in its frozen input. */
  async function storeFit(eventId: string, shiftYears: number): Promise<string> {
    const em = t.orm.em.fork();
    const input = { ...exampleEvent(), title: BAD_TITLE };
    const base = exampleSolution();
    const astrometry = base.astrometry;
    if (astrometry === null) throw new Error('the example fit has astrometry');
    const when = new Date(Date.parse(astrometry.referenceTimeUtc) + shiftYears * 365.25 * 86_400_000);
    const solution: Solution = {
      ...base,
      astrometry: { ...astrometry, referenceTimeUtc: when.toISOString() },
    };
    const run = new FitRun(
      em.getReference(OccultationEvent, eventId),
      em.getReference(User, w.userIds.modeller),
      {
        input: JSON.stringify(input),
        inputSha256: 'c0ffee'.padEnd(64, '0'),
        dataSha256: '0'.repeat(64),
        options: {},
        engineVersion: 'e2e',
        seed: 1,
        idempotencyKey: null,
      },
    );
    run.state = 'solved';
    run.solution = solution;
    run.finishedAt = new Date('2028-03-15T10:00:00Z');
    await em.persistAndFlush(run);
    return run.id;
  }

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    for (const shift of [0, 1]) {
      const eventId = await importExample(t, w, undefined, { bodyName: 'Quillon' });
      await t.orm.em
        .getConnection()
        .execute('update `events` set `title` = ? where `id` = ?', [BAD_TITLE, eventId]);
      fitIds.push(await storeFit(eventId, shift));
    }
    const bodies = await t.get(`/api/teams/${w.team.id}/bodies`).set(w.auth('observer')).expect(200);
    bodyId = (bodies.body as Array<{ id: string; name: string }>).find((b) => b.name === 'Quillon')?.id ?? '';
    const stored = await t.orm.em.fork().findOneOrFail(OccultationEvent, { body: bodyId });
    expect(stored.title).toBe(BAD_TITLE);
  });
  afterAll(async () => {
    await t.close();
  });

  function expectValidSvg(svg: string): void {
    expect(XMLValidator.validate(svg)).toBe(true);
    expect(XML_FORBIDDEN.test(svg)).toBe(false);
  }

  it('GET /api/fits/:fitId/figure?format=svg is valid XML (fast-xml-parser) with the title in its caption', async () => {
    const res = await t.get(`/api/fits/${fitIds[0]}/figure?format=svg`).set(w.auth('observer')).expect(200);
    const svg = Buffer.isBuffer(res.body) ? res.body.toString('utf8') : res.text;
    expectValidSvg(svg);
    const parsed = new XMLParser({ ignoreAttributes: false }).parse(svg) as { svg: { desc: string } };
    expect(parsed.svg.desc).toContain('Quillon\uFFFD night \uFFFD[31m two');
    expect(attachmentName(String(res.headers['content-disposition'])).name).toBe(
      `limbus-fit-${fitIds[0]}-88mm.svg`,
    );
  });

  it('GET /api/fits/:fitId/figure?format=png and ?format=pdf answer 200 with a PNG and a PDF', async () => {
    const png = await binary(
      t.get(`/api/fits/${fitIds[0]}/figure?format=png`).set(w.auth('observer')),
    ).expect(200);
    expect((png.body as Buffer).subarray(1, 4).toString('latin1')).toBe('PNG');
    const pdf = await binary(
      t.get(`/api/fits/${fitIds[0]}/figure?format=pdf`).set(w.auth('observer')),
    ).expect(200);
    expect((await PDFDocument.load(pdf.body as Buffer)).getPageCount()).toBe(1);
  });

  it('GET /api/fits/:fitId/table answers CSV, TeX and JSON without control characters', async () => {
    for (const format of ['csv', 'tex', 'json']) {
      const res = await t
        .get(`/api/fits/${fitIds[0]}/table?format=${format}`)
        .set(w.auth('observer'))
        .expect(200);
      expect(CONTROL_BUT_LINE_ENDS.test(res.text), format).toBe(false);
    }
    const csv = await t.get(`/api/fits/${fitIds[0]}/table?format=csv`).set(w.auth('observer')).expect(200);
    expect(Papa.parse(csv.text.trim()).errors).toEqual([]);
  });

  it('GET /api/bodies/:bodyId/comparison/figure draws both fits as valid SVG, PNG and PDF', async () => {
    const query = `fits=all&format=`;
    const svgRes = await t
      .get(`/api/bodies/${bodyId}/comparison/figure?${query}svg`)
      .set(w.auth('observer'))
      .expect(200);
    const svg = Buffer.isBuffer(svgRes.body) ? svgRes.body.toString('utf8') : svgRes.text;
    expectValidSvg(svg);
    expect([...svg.matchAll(/<limbus:provenance /g)]).toHaveLength(2);
    expect(svg).toContain('Quillon night [31m two');
    const png = await binary(
      t.get(`/api/bodies/${bodyId}/comparison/figure?${query}png`).set(w.auth('observer')),
    ).expect(200);
    expect((png.body as Buffer).subarray(1, 4).toString('latin1')).toBe('PNG');
    const pdf = await binary(
      t.get(`/api/bodies/${bodyId}/comparison/figure?${query}pdf`).set(w.auth('observer')),
    ).expect(200);
    expect((await PDFDocument.load(pdf.body as Buffer)).getPageCount()).toBe(1);
  });

  it('POST /api/bodies/:bodyId/shape/table answers CSV and TeX without control characters', async () => {
    for (const format of ['csv', 'tex']) {
      const res = await t
        .post(`/api/bodies/${bodyId}/shape/table?format=${format}`)
        .set(w.auth('observer'))
        .send({
          fitIds,
          pole: { raDeg: 52, decDeg: 24 },
          periodHours: 6.71,
          epochUtc: '2028-01-01T00:00:00Z',
          model: 'spheroid',
        });
      expect(res.status, res.text).toBe(200);
      expect(CONTROL_BUT_LINE_ENDS.test(res.text), format).toBe(false);
      expect(res.text).toContain('Quillon night [31m two');
    }
  });
});
