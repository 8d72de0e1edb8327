import type { INestApplicationContext } from '@nestjs/common';
import type { Server } from 'node:http';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { bootTestApp, type TestApp } from '../setup';
import {
  type Actor,
  createWorkspace,
  exampleEvent,
  importExample,
  type Workspace,
} from '../events/workspace';
import { bootWorker } from '../fits/worker';
import { MATRIX, type MatrixRow } from './matrix';
import { lightCurveCsv } from '../uploads/light-curve-text';

const ACTORS: Actor[] = ['admin', 'coordinator', 'observer', 'modeller', 'reviewer', 'outsider', 'anonymous'];

interface Call {
  method: 'get' | 'post' | 'patch' | 'delete';
  url: string;
  json?: unknown;
  file?: { field: string; bytes: Buffer; name: string };
}

/**
 * Walks every cell of MATRIX (the event rows of docs/authorization.md). Each call gets fresh objects
 * from `prepare`, so that one actor's success (a delete, an accept) cannot change the next actor's answer.
 */
describe('authorization matrix of the event workspace', () => {
  let t: TestApp;
  let w: Workspace;
  let worker: INestApplicationContext;
  let eventId: string;
  let stationCode: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    worker = await bootWorker(t.config);
    eventId = await importExample(t, w);
    stationCode = (exampleEvent().stations as Array<{ id: string }>)[0]?.id ?? '';
  });
  afterAll(async () => {
    await worker.close();
    await t.close();
  });

  const coordinator = () => w.auth('coordinator');

  const newStation = async (observerId?: string): Promise<string> => {
    const code = `site-${Math.random().toString(36).slice(2, 10)}`;
    const response = await t
      .post(`/api/events/${eventId}/stations`)
      .set(coordinator())
      .send({ code, latDeg: -20, lonDeg: 70, heightM: 10, ...(observerId ? { observerId } : {}) })
      .expect(201);
    return (response.body as { id: string }).id;
  };
  const newReport = async (): Promise<string> => {
    const stationId = await newStation(w.userIds.observer);
    const response = await t
      .post(`/api/events/${eventId}/reports`)
      .set(w.auth('observer'))
      .send({ stationId, result: 'clouded_out' })
      .expect(201);
    return (response.body as { id: string }).id;
  };
  const acceptedReport = async (): Promise<string> => {
    const id = await newReport();
    await t.post(`/api/reports/${id}/accept`).set(coordinator()).expect(200);
    return id;
  };
  const pendingCorrection = async (): Promise<string> => {
    const id = await acceptedReport();
    const response = await t
      .post(`/api/reports/${id}/corrections`)
      .set(w.auth('observer'))
      .send({ changes: { notes: 'the sky cleared at 02:12' }, message: 'I left out a note' })
      .expect(201);
    return `/api/reports/${id}/corrections/${(response.body as { id: string }).id}`;
  };
  const newChord = async (): Promise<string> => {
    const response = await t
      .post(`/api/events/${eventId}/chords`)
      .set(coordinator())
      .send({
        station: stationCode,
        type: 'negative',
        start: '2028-03-14T02:10:00Z',
        end: '2028-03-14T02:12:00Z',
      })
      .expect(201);
    return (response.body as { id: string }).id;
  };
  const solvedFit = async (reviewState: 'none' | 'in_review' = 'none'): Promise<string> => {
    const response = await t.post(`/api/events/${eventId}/fits`).set(w.auth('modeller')).send({}).expect(202);
    const id = (response.body as { id: string }).id;
    const deadline = Date.now() + 30_000;
    while ((await t.orm.em.fork().findOneOrFail(FitRun, { id })).state !== 'solved') {
      if (Date.now() > deadline) throw new Error('fit not solved');
      await new Promise((resolve) => setTimeout(resolve, 50));
    }
    if (reviewState === 'in_review')
      await t.post(`/api/fits/${id}/review-request`).set(w.auth('modeller')).expect(200);
    return id;
  };
  let sharedFit: string | null = null;
  const readableFit = async () => (sharedFit ??= await solvedFit());
  const eventFile = () => ({
    field: 'file',
    bytes: Buffer.from(JSON.stringify(exampleEvent())),
    name: 'event.json',
  });
  const star = exampleEvent().star;

  const prepare: Record<string, () => Promise<Call>> = {
    'GET /api/events': async () => ({ method: 'get', url: '/api/events' }),
    'POST /api/events': async () => ({
      method: 'post',
      url: '/api/events',
      json: { teamId: w.team.id, title: 'm', star, ephemeris: exampleEvent().ephemeris },
    }),
    'POST /api/events/import': async () => ({
      method: 'post',
      url: `/api/events/import?teamId=${w.team.id}`,
      file: eventFile(),
    }),
    'GET /api/events/:eventId': async () => ({ method: 'get', url: `/api/events/${eventId}` }),
    'PATCH /api/events/:eventId': async () => ({
      method: 'patch',
      url: `/api/events/${eventId}`,
      json: { title: exampleEvent().title },
    }),
    'DELETE /api/events/:eventId': async () => ({
      method: 'delete',
      url: `/api/events/${await importExample(t, w)}`,
    }),
    'POST /api/events/:eventId/restore': async () => {
      const id = await importExample(t, w);
      await request(t.app.getHttpServer() as Server)
        .delete(`/api/events/${id}`)
        .set(coordinator())
        .expect(204);
      return { method: 'post', url: `/api/events/${id}/restore` };
    },
    'GET /api/events/:eventId/export': async () => ({ method: 'get', url: `/api/events/${eventId}/export` }),
    'GET /api/events/:eventId/audit': async () => ({ method: 'get', url: `/api/events/${eventId}/audit` }),
    'GET /api/events/:eventId/reviews': async () => ({
      method: 'get',
      url: `/api/events/${eventId}/reviews`,
    }),
    'GET /api/events?archived=true&teamId=:teamId': async () => ({
      method: 'get',
      url: `/api/events?archived=true&teamId=${w.team.id}`,
    }),
    'POST /api/events/:eventId/stations': async () => ({
      method: 'post',
      url: `/api/events/${eventId}/stations`,
      json: { code: `new-${Math.random().toString(36).slice(2, 10)}`, latDeg: 1, lonDeg: 2, heightM: 3 },
    }),
    'PATCH /api/events/:eventId/stations/:stationId': async () => ({
      method: 'patch',
      url: `/api/events/${eventId}/stations/${await newStation()}`,
      json: { heightM: 12 },
    }),
    'DELETE /api/events/:eventId/stations/:stationId': async () => ({
      method: 'delete',
      url: `/api/events/${eventId}/stations/${await newStation()}`,
    }),
    'GET /api/events/:eventId/reports': async () => ({
      method: 'get',
      url: `/api/events/${eventId}/reports`,
    }),
    'POST /api/events/:eventId/reports': async () => ({
      method: 'post',
      url: `/api/events/${eventId}/reports`,
      json: { stationId: await newStation(w.userIds.observer), result: 'technical_failure' },
    }),
    'PATCH /api/reports/:reportId': async () => ({
      method: 'patch',
      url: `/api/reports/${await newReport()}`,
      json: { notes: 'n' },
    }),
    'POST /api/reports/:reportId/accept': async () => ({
      method: 'post',
      url: `/api/reports/${await newReport()}/accept`,
    }),
    'POST /api/reports/:reportId/reject': async () => ({
      method: 'post',
      url: `/api/reports/${await newReport()}/reject`,
      json: { reason: 'r' },
    }),
    'POST /api/reports/:reportId/corrections': async () => ({
      method: 'post',
      url: `/api/reports/${await acceptedReport()}/corrections`,
      json: { changes: { notes: 'n' }, message: 'm' },
    }),
    'POST /api/reports/:reportId/corrections/:correctionId/accept': async () => ({
      method: 'post',
      url: `${await pendingCorrection()}/accept`,
    }),
    'POST /api/reports/:reportId/corrections/:correctionId/reject': async () => ({
      method: 'post',
      url: `${await pendingCorrection()}/reject`,
      json: { reason: 'r' },
    }),
    'POST /api/reports/:reportId/light-curve': async () => ({
      method: 'post',
      url: `/api/reports/${await newReport()}/light-curve`,
      file: { field: 'file', bytes: Buffer.from(lightCurveCsv()), name: 'lc.csv' },
    }),
    'GET /api/reports/:reportId/light-curve': async () => {
      const id = await newReport();
      await t
        .post(`/api/reports/${id}/light-curve`)
        .set(w.auth('observer'))
        .attach('file', Buffer.from(lightCurveCsv()), 'lc.csv')
        .expect(201);
      return { method: 'get', url: `/api/reports/${id}/light-curve` };
    },
    'GET /api/events/:eventId/chords': async () => ({ method: 'get', url: `/api/events/${eventId}/chords` }),
    'POST /api/events/:eventId/chords': async () => ({
      method: 'post',
      url: `/api/events/${eventId}/chords`,
      json: {
        station: stationCode,
        type: 'negative',
        start: '2028-03-14T02:10:00Z',
        end: '2028-03-14T02:11:00Z',
      },
    }),
    'POST /api/events/:eventId/chords/import': async () => ({
      method: 'post',
      url: `/api/events/${eventId}/chords/import`,
      file: {
        field: 'file',
        bytes: Buffer.from(
          `station,type,start_utc,end_utc\n${stationCode},negative,2028-03-14T02:10:00Z,2028-03-14T02:11:00Z\n`,
        ),
        name: 'c.csv',
      },
    }),
    'PATCH /api/chords/:chordId': async () => ({
      method: 'patch',
      url: `/api/chords/${await newChord()}`,
      json: { timeOffsetSeconds: 0.1 },
    }),
    'DELETE /api/chords/:chordId': async () => ({ method: 'delete', url: `/api/chords/${await newChord()}` }),
    'POST /api/events/:eventId/fits': async () => ({
      method: 'post',
      url: `/api/events/${eventId}/fits`,
      json: {},
    }),
    'GET /api/events/:eventId/fits': async () => ({ method: 'get', url: `/api/events/${eventId}/fits` }),
    'GET /api/fits/:fitId': async () => ({ method: 'get', url: `/api/fits/${await readableFit()}` }),
    'POST /api/fits/:fitId/stream-ticket': async () => ({
      method: 'post',
      url: `/api/fits/${await readableFit()}/stream-ticket`,
    }),
    'POST /api/fits/:fitId/review-request': async () => ({
      method: 'post',
      url: `/api/fits/${await solvedFit()}/review-request`,
    }),
    'POST /api/fits/:fitId/reviews': async () => ({
      method: 'post',
      url: `/api/fits/${await solvedFit('in_review')}/reviews`,
      json: { decision: 'approve', comment: '' },
    }),
    'GET /api/fits/:fitId/reviews': async () => ({
      method: 'get',
      url: `/api/fits/${await readableFit()}/reviews`,
    }),
  };

  const send = (call: Call, actor: Actor) => {
    const server = t.app.getHttpServer() as Server;
    let req = request(server)[call.method](call.url).set('X-Forwarded-For', t.address).set(w.auth(actor));
    if (call.file) {
      // Multipart: teamId travels as a field, which the import route reads from the body.
      const url = new URL(call.url, 'http://x');
      req = request(server)[call.method](url.pathname).set('X-Forwarded-For', t.address).set(w.auth(actor));
      const teamId = url.searchParams.get('teamId');
      if (teamId) req = req.field('teamId', teamId);
      return req.attach(call.file.field, call.file.bytes, call.file.name);
    }
    return call.json === undefined ? req : req.send(call.json as object);
  };

  it('every route of the matrix has a prepared call, and no prepared call is missing from the matrix', () => {
    expect(Object.keys(prepare).sort()).toEqual(MATRIX.map((r) => r.route).sort());
  });

  for (const row of MATRIX as MatrixRow[])
    it(`${row.route} answers each role as docs/authorization.md says`, async () => {
      const got: Record<string, number> = {};
      const want: Record<string, number> = {};
      for (const actor of ACTORS) {
        const call = await (prepare[row.route] as () => Promise<Call>)();
        const cell = row.cells[actor];
        want[actor] = cell === 'ok' ? row.ok : cell;
        got[actor] = (await send(call, actor)).status;
      }
      expect(got).toEqual(want);
    });
});
