import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Report } from '../../src/reports/entities/report.entity';
import { Upload } from '../../src/uploads/entities/upload.entity';
import { bootTestApp, type TestApp } from '../setup';
import { createWorkspace, importExample, type Workspace } from '../events/workspace';
import { lightCurveCsv } from './light-curve-text';

describe('light-curve uploads', () => {
  let t: TestApp;
  let w: Workspace;
  let reportId: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    const eventId = await importExample(t, w);
    const station = await t
      .post(`/api/events/${eventId}/stations`)
      .set(w.auth('coordinator'))
      .send({ code: 'Corran Hill', latDeg: -29, lonDeg: -71, heightM: 800, observerId: w.userIds.observer })
      .expect(201);
    const report = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({
        stationId: (station.body as { id: string }).id,
        result: 'technical_failure',
        notes: 'camera froze',
      })
      .expect(201);
    reportId = (report.body as { id: string }).id;
  });
  afterAll(async () => {
    await t.close();
  });

  const uploads = () => t.orm.em.fork().count(Upload, { team: w.team.id });
  const send = (bytes: Buffer, actor: 'observer' | 'reviewer' = 'observer') =>
    t
      .post(`/api/reports/${reportId}/light-curve`)
      .set(w.auth(actor))
      .attach('file', bytes, { filename: 'curve.csv', contentType: 'text/csv' });

  it('POST /api/reports/:reportId/light-curve stores a checked CSV and its SHA-256, readable back', async () => {
    const csv = Buffer.from(lightCurveCsv(12, true));
    const response = await send(csv).expect(201);
    const lightCurve = (response.body as { lightCurve: { id: string; sha256: string; sizeBytes: number } })
      .lightCurve;
    expect(lightCurve.sha256).toBe(createHash('sha256').update(csv).digest('hex'));
    expect(lightCurve.sizeBytes).toBe(csv.length);
    const stored = await t.orm.em
      .fork()
      .findOneOrFail(Report, { id: reportId }, { populate: ['lightCurve'] });
    expect(stored.lightCurve?.id).toBe(lightCurve.id);
    const back = await t.get(`/api/reports/${reportId}/light-curve`).set(w.auth('coordinator')).expect(200);
    expect(back.text).toBe(csv.toString());
  });

  it('POST /api/reports/:reportId/light-curve answers 413 over the size limit and stores nothing', async () => {
    const before = await uploads();
    const big = Buffer.from(lightCurveCsv(80_000));
    const response = await send(big).expect(413);
    expect((response.body as { statusCode: number }).statusCode).toBe(413);
    expect(await uploads()).toBe(before);
  });

  it('POST /api/reports/:reportId/light-curve checks the content before storing it', async () => {
    const before = await uploads();
    const bad = lightCurveCsv(12).split('\n');
    bad[2] = bad[2]!.replace(/,1\.00$/, ',bright');
    bad[5] = bad[5]!.replace(/^[^,]+/, '0.16');
    const response = await send(Buffer.from(bad.join('\n'))).expect(400);
    expect((response.body as { issues: Array<{ row: number; column: string }> }).issues).toEqual([
      expect.objectContaining({ row: 3, column: 'flux' }),
      expect.objectContaining({ row: 6, column: 'time' }),
    ]);
    await send(Buffer.from(lightCurveCsv()), 'reviewer').expect(403);
    expect(await uploads()).toBe(before);
  });
});
