import type { Server } from 'node:http';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MatrixRow } from '../authorization/matrix';
import { type Actor, createWorkspace, importExample, patch, type Workspace } from '../events/workspace';
import { exampleSolution } from '../exports/example-fixture';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { User } from '../../src/users/entities/user.entity';
import { bootTestApp, type TestApp } from '../setup';
import { PLANNING_MATRIX } from './matrix';
import { plannedEvent, quillonFile, SETTINGS } from './planning-fixture';

const ACTORS: Actor[] = ['admin', 'coordinator', 'observer', 'modeller', 'reviewer', 'outsider', 'anonymous'];

interface Call {
  method: 'get' | 'post' | 'patch';
  url: string;
  json?: unknown;
}

/**
 * Walks every cell of PLANNING_MATRIX (the planning rows of docs/authorization.md). Each call gets fresh
 * objects from `prepare`, so one actor's success (a decision on a proposal) cannot change the next answer.
 */
describe('authorization matrix of planning', () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;
  let fitId: string;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await plannedEvent(t, w);
    const earlier = await importExample(t, w, quillonFile(), { bodyName: 'Quillon' });
    await patch(t, `/api/events/${earlier}`)
      .set(w.auth('coordinator'))
      .send({ eventTimeUtc: '2028-01-01T00:00:00Z' })
      .expect(200);
    const em = t.orm.em.fork();
    const fit = new FitRun(
      em.getReference(OccultationEvent, earlier),
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
    fit.state = 'solved';
    fit.solution = exampleSolution();
    await em.persistAndFlush(fit);
    fitId = fit.id;
  });
  afterAll(async () => {
    await t.close();
  });

  const proposal = async (): Promise<string> => {
    const response = await t
      .post(`/api/events/${eventId}/site-proposals`)
      .set(w.auth('observer'))
      .send({ code: `p-${Math.random().toString(36).slice(2, 10)}`, latDeg: 9, lonDeg: 70.8, heightM: 100 })
      .expect(201);
    return (response.body as { id: string }).id;
  };

  const prepare: Record<string, () => Promise<Call>> = {
    'PATCH /api/events/:eventId with prediction': async () => ({
      method: 'patch',
      url: `/api/events/${eventId}`,
      json: { prediction: SETTINGS },
    }),
    'GET /api/events/:eventId/prediction': async () => ({
      method: 'get',
      url: `/api/events/${eventId}/prediction`,
    }),
    'POST /api/events/:eventId/prediction/offset-from-fit': async () => ({
      method: 'post',
      url: `/api/events/${eventId}/prediction/offset-from-fit`,
      json: { fitId },
    }),
    'GET /api/events/:eventId/prediction/map': async () => ({
      method: 'get',
      url: `/api/events/${eventId}/prediction/map`,
    }),
    'GET /api/events/:eventId/prediction.geojson': async () => ({
      method: 'get',
      url: `/api/events/${eventId}/prediction.geojson`,
    }),
    'GET /api/events/:eventId/prediction.kml': async () => ({
      method: 'get',
      url: `/api/events/${eventId}/prediction.kml`,
    }),
    'GET /api/events/:eventId/prediction/figure': async () => ({
      method: 'get',
      url: `/api/events/${eventId}/prediction/figure?format=svg`,
    }),
    'GET /api/events/:eventId/placement': async () => ({
      method: 'get',
      url: `/api/events/${eventId}/placement?sites=1`,
    }),
    'POST /api/events/:eventId/site-proposals': async () => ({
      method: 'post',
      url: `/api/events/${eventId}/site-proposals`,
      json: { code: `s-${Math.random().toString(36).slice(2, 10)}`, latDeg: 9, lonDeg: 70.8, heightM: 100 },
    }),
    'POST /api/events/:eventId/site-proposals/:stationId/accept': async () => ({
      method: 'post',
      url: `/api/events/${eventId}/site-proposals/${await proposal()}/accept`,
      json: { status: 'planned' },
    }),
    'POST /api/events/:eventId/site-proposals/:stationId/decline': async () => ({
      method: 'post',
      url: `/api/events/${eventId}/site-proposals/${await proposal()}/decline`,
      json: { reason: 'r' },
    }),
    'POST /api/events/:eventId/briefings': async () => ({
      method: 'post',
      url: `/api/events/${eventId}/briefings`,
    }),
    'GET /api/events/:eventId/briefing': async () => ({
      method: 'get',
      url: `/api/events/${eventId}/briefing`,
    }),
  };

  const send = (call: Call, actor: Actor) => {
    const agent = request(t.app.getHttpServer() as Server);
    const req = agent[call.method](call.url).set('X-Forwarded-For', t.address).set(w.auth(actor));
    return call.json === undefined ? req : req.send(call.json as object);
  };

  it('every planning route of the matrix has a prepared call, and no prepared call is missing from it', () => {
    expect(Object.keys(prepare).sort()).toEqual(PLANNING_MATRIX.map((r) => r.route).sort());
  });

  it('GET /api/docs-json lists every planning route, each body-taking one with its schema', async () => {
    const doc = (await t.get('/api/docs-json').expect(200)).body as {
      paths: Record<string, Record<string, { requestBody?: unknown }>>;
    };
    const bodyless = new Set(['POST /api/events/:eventId/briefings']);
    const missing: string[] = [];
    for (const { route } of PLANNING_MATRIX) {
      const [method = '', path = ''] = route.split(' ');
      const operation = doc.paths[path.replace(/:(\w+)/g, '{$1}')]?.[method.toLowerCase()];
      if (!operation || (method === 'POST' && !bodyless.has(route) && !operation.requestBody))
        missing.push(route);
    }
    expect(missing).toEqual([]);
  });

  for (const row of PLANNING_MATRIX as MatrixRow[])
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
