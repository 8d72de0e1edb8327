// Issue 13, item 8: a light curve's file name, however it was sent (RFC 7578 filename in UTF-8, an
// RFC 8187 filename*, with a NUL or a line separator), is stored as a safe name, and every download
// answers an RFC 6266 header with an ASCII fallback and the UTF-8 name, which the tests decode with
// their own reader (./content-disposition.ts). Before the fix such names answered 500 on download and
// plain UTF-8 names came back as Latin-1 mojibake.
import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Report } from '../../src/reports/entities/report.entity';
import { Upload } from '../../src/uploads/entities/upload.entity';
import { createWorkspace, importExample, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';
import { attachmentName } from './content-disposition';
import { lightCurveCsv } from './light-curve-text';

/** A multipart body with the file part's disposition parameters written byte for byte. */
function multipart(fileParams: Buffer): { boundary: string; body: Buffer } {
  const boundary = `limbus-${randomBytes(8).toString('hex')}`;
  const body = Buffer.concat([
    Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; `),
    fileParams,
    Buffer.from('\r\nContent-Type: text/csv\r\n\r\n'),
    Buffer.from(lightCurveCsv(12)),
    Buffer.from(`\r\n--${boundary}--\r\n`),
  ]);
  return { boundary, body };
}

describe('file names of uploads and downloads', () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;
  let reportId: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
    const station = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: 'Corran Hill', latDeg: -29, lonDeg: -71, heightM: 800, observerId: w.userIds.observer })
      .expect(201);
    const report = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId: (station.body as { id: string }).id, result: 'technical_failure' })
      .expect(201);
    reportId = (report.body as { id: string }).id;
  });
  afterAll(async () => {
    await t.close();
  });

  async function upload(fileParams: Buffer): Promise<string> {
    const { boundary, body } = multipart(fileParams);
    const res = await t
      .post(`/api/reports/${reportId}/light-curve`)
      .set(w.auth('observer'))
      .set('Content-Type', `multipart/form-data; boundary=${boundary}`)
      .send(body);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const stored = await t.orm.em
      .fork()
      .findOneOrFail(Report, { id: reportId }, { populate: ['lightCurve'] });
    return stored.lightCurve?.name ?? '';
  }

  async function downloadName(): Promise<{ name: string; fallback: string }> {
    const res = await t.get(`/api/reports/${reportId}/light-curve`).set(w.auth('coordinator'));
    expect(res.status).toBe(200);
    expect(res.text).toBe(lightCurveCsv(12));
    const header = String(res.headers['content-disposition']);
    const parsed = attachmentName(header);
    expect(parsed.fallback).toMatch(/^[\x20-\x7e]*$/);
    return parsed;
  }

  const cases: Array<{ name: string; params: Buffer; stored: string; fallback: string }> = [
    {
      name: "filename*=UTF-8''🌑κυrve.csv (RFC 8187, percent-encoded UTF-8)",
      params: Buffer.from(`filename*=UTF-8''${encodeURIComponent('🌑κυrve.csv')}`),
      stored: '🌑κυrve.csv',
      fallback: '___rve.csv',
    },
    {
      name: 'a plain UTF-8 filename (RFC 7578 section 4.2)',
      params: Buffer.from('filename="κύκλος φωτός.csv"', 'utf8'),
      stored: 'κύκλος φωτός.csv',
      fallback: '______ _____.csv',
    },
    {
      name: 'a NUL inside filename*',
      params: Buffer.from("filename*=UTF-8''night%00one.csv"),
      stored: 'nightone.csv',
      fallback: 'nightone.csv',
    },
    {
      name: 'a line separator (U+2028) and a paragraph separator (U+2029) inside filename*',
      params: Buffer.from("filename*=UTF-8''night%E2%80%A8one%E2%80%A9.csv"),
      stored: 'nightone.csv',
      fallback: 'nightone.csv',
    },
    {
      name: 'a right-to-left override (U+202E) and accents, which the fallback spells without',
      params: Buffer.from(`filename*=UTF-8''${encodeURIComponent('Café\u202Evsc.csv')}`),
      stored: 'Cafévsc.csv',
      fallback: 'Cafevsc.csv',
    },
  ];

  for (const c of cases)
    it(`POST and GET /api/reports/:reportId/light-curve with ${c.name} store a safe name and give it back`, async () => {
      expect(await upload(c.params)).toBe(c.stored);
      expect(await downloadName()).toEqual({ name: c.stored, fallback: c.fallback });
    });

  it('GET /api/reports/:reportId/light-curve answers a valid header for a name stored before the rule (written by SQL)', async () => {
    await upload(Buffer.from('filename="curve.csv"'));
    const stored = await t.orm.em
      .fork()
      .findOneOrFail(Report, { id: reportId }, { populate: ['lightCurve'] });
    await t.orm.em
      .getConnection()
      .execute('update `uploads` set `name` = ? where `id` = ?', [
        'old\u0000\u2028"name"\r\n.csv',
        stored.lightCurve?.id,
      ]);
    expect((await t.orm.em.fork().findOneOrFail(Upload, { id: stored.lightCurve?.id })).name).toContain(
      '\u0000',
    );
    expect(await downloadName()).toEqual({ name: 'old"name".csv', fallback: 'old_name_.csv' });
  });

  it('GET /api/events/:eventId/export names its file with the same header', async () => {
    const res = await t.get(`/api/events/${eventId}/export`).set(w.auth('observer')).expect(200);
    expect(attachmentName(String(res.headers['content-disposition']))).toEqual({
      name: `event-${eventId}.json`,
      fallback: `event-${eventId}.json`,
    });
  });
});
