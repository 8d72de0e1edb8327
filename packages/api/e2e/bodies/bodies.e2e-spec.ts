import type { Server } from 'node:http';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BodyDetail, BodySummary } from '@limbus/schema';
import { AuditEntry } from '../../src/audit/entities/audit-entry.entity';
import { Body } from '../../src/bodies/entities/body.entity';
import { DynamicsContext } from '../../src/dynamics/entities/dynamics-context.entity';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { User } from '../../src/users/entities/user.entity';
import { exampleSolution } from '../exports/example-fixture';
import {
  type Actor,
  createWorkspace,
  exampleEvent,
  importExample,
  patch,
  type Workspace,
} from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';

// Invented physical parameters of an invented body, for the dynamics routes.
const CONTEXT = {
  format: 'limbus-context-input/1',
  body: { densityKgM3: 1700, radiusKm: 560, radiusKmSigma: 10, spinPeriodHours: 8.9 },
  particleDensityKgM3: 900,
  heliocentricDistanceAu: 43.1,
  satellites: [],
  rings: [],
};

const issuesOf = (response: request.Response) =>
  (response.body as { issues: Array<{ path: string; message: string }> }).issues;

describe('bodies: a team groups its events by the body they observe', () => {
  let t: TestApp;
  let w: Workspace;
  const server = () => t.app.getHttpServer() as Server;
  const del = (url: string) => request(server()).delete(url).set('X-Forwarded-For', t.address);
  const put = (url: string) => request(server()).put(url).set('X-Forwarded-For', t.address);

  const createBody = (name: string, actor: Actor = 'coordinator', designation?: string) =>
    t
      .post(`/api/teams/${w.team.id}/bodies`)
      .set(w.auth(actor))
      .send({ name, ...(designation === undefined ? {} : { designation }) });

  const createEvent = (fields: Record<string, unknown>) => {
    const file = exampleEvent();
    return t
      .post('/api/events')
      .set(w.auth('coordinator'))
      .send({
        teamId: w.team.id,
        title: `Created ${Math.random().toString(36).slice(2, 8)}`,
        star: file.star,
        ephemeris: file.ephemeris,
        ...fields,
      });
  };

  /** A solved, approved fit stored directly: the solve itself is the fits module's to test. */
  const storedFit = async (eventId: string): Promise<string> => {
    const em = t.orm.em.fork();
    const run = new FitRun(
      em.getReference(OccultationEvent, eventId),
      em.getReference(User, w.userIds.modeller),
      {
        input: JSON.stringify(exampleEvent()),
        inputSha256: '0'.repeat(64),
        dataSha256: '0'.repeat(64),
        options: {},
        engineVersion: 'e2e',
        seed: 1,
        idempotencyKey: null,
      },
    );
    run.state = 'solved';
    run.reviewState = 'approved';
    run.solution = exampleSolution();
    await em.persistAndFlush(run);
    return run.id;
  };

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
  });
  afterAll(async () => {
    await t.close();
  });

  it('POST /api/teams/:teamId/bodies makes a body; a name the team already has (in any case) is refused on `name`', async () => {
    const made = (await createBody('Varro', 'coordinator', '2027 VR3').expect(201)).body as BodySummary;
    expect(made).toMatchObject({ name: 'Varro', designation: '2027 VR3', eventCount: 0, hasContext: false });
    const stored = await t.orm.em.fork().findOneOrFail(Body, { id: made.id }, { populate: ['team'] });
    expect(stored.team.id).toBe(w.team.id);
    expect(await t.orm.em.fork().count(AuditEntry, { objectId: made.id, action: 'body.create' })).toBe(1);
    const twice = await createBody('varro').expect(400);
    expect(issuesOf(twice)).toEqual([{ path: 'name', message: 'the team already has a body named "varro"' }]);
    const long = await createBody('x'.repeat(201)).expect(400);
    expect(issuesOf(long).map((i) => i.path)).toEqual(['name']);
    const control = await createBody('Var\u0000ro').expect(400);
    expect(issuesOf(control)[0]?.message).toBe('must not contain control characters');
    expect(await t.orm.em.fork().count(Body, { team: w.team.id })).toBe(1);
  });

  it('the same name made by two requests at once gives one body and one refusal, never a 500', async () => {
    const answers = await Promise.all([createBody('Twin'), createBody('Twin')]);
    expect(answers.map((r) => r.status).sort()).toEqual([201, 400]);
    expect(await t.orm.em.fork().count(Body, { team: w.team.id, name: 'Twin' })).toBe(1);
  });

  it('body routes answer each role as docs/authorization.md says', async () => {
    const body = ((await createBody('Roles check').expect(201)).body as BodySummary).id;
    const status = async (actor: Actor) => ({
      list: (await t.get(`/api/teams/${w.team.id}/bodies`).set(w.auth(actor))).status,
      read: (await t.get(`/api/bodies/${body}`).set(w.auth(actor))).status,
      create: (await createBody(`By ${actor} ${Math.random()}`, actor)).status,
      rename: (await patch(t, `/api/bodies/${body}`).set(w.auth(actor)).send({ designation: actor })).status,
    });
    expect(await status('admin')).toEqual({ list: 200, read: 200, create: 201, rename: 200 });
    expect(await status('coordinator')).toEqual({ list: 200, read: 200, create: 201, rename: 200 });
    for (const actor of ['observer', 'modeller', 'reviewer'] as const)
      expect(await status(actor)).toEqual({ list: 200, read: 200, create: 403, rename: 403 });
    expect(await status('outsider')).toEqual({ list: 404, read: 404, create: 404, rename: 404 });
    expect(await status('anonymous')).toEqual({ list: 401, read: 401, create: 401, rename: 401 });
    await del(`/api/bodies/${body}`).set(w.auth('modeller')).expect(403);
    await del(`/api/bodies/${body}`).set(w.auth('outsider')).expect(404);
    await del(`/api/bodies/${body}`).set(w.auth('coordinator')).expect(204);
    expect(await t.orm.em.fork().count(Body, { id: body })).toBe(0);
  });

  it('POST /api/events takes an existing body or makes a new one; several bodies and none chosen is refused on `bodyId`', async () => {
    const quillon = ((await createBody('Quillon-like').expect(201)).body as BodySummary).id;
    const byId = (await createEvent({ bodyId: quillon }).expect(201)).body as { id: string };
    const made = (await createEvent({ newBody: { name: 'Brand new', designation: 'BN1' } }).expect(201))
      .body as { id: string };
    const em = t.orm.em.fork();
    expect((await em.findOneOrFail(OccultationEvent, { id: byId.id })).body.id).toBe(quillon);
    const newBody = (await em.findOneOrFail(OccultationEvent, { id: made.id }, { populate: ['body'] })).body;
    expect({ name: newBody.name, designation: newBody.designation }).toEqual({
      name: 'Brand new',
      designation: 'BN1',
    });
    const none = await createEvent({}).expect(400);
    expect(issuesOf(none)).toEqual([
      { path: 'bodyId', message: 'the team has several bodies: choose the one this event observes' },
    ]);
    const foreign = await t
      .post(`/api/teams/${w.otherTeam.id}/bodies`)
      .set(w.auth('outsider'))
      .send({ name: 'Other team body' })
      .expect(201);
    const refused = await createEvent({ bodyId: (foreign.body as BodySummary).id }).expect(400);
    expect(issuesOf(refused)).toEqual([{ path: 'bodyId', message: 'no such body in this team' }]);
    const both = await createEvent({ bodyId: quillon, newBody: { name: 'x' } }).expect(400);
    expect(issuesOf(both).map((i) => i.path)).toEqual(['newBody']);
  });

  it('POST /api/events without a time takes the middle of the ephemeris, in UTC to the second', async () => {
    const body = ((await createBody('Timed').expect(201)).body as BodySummary).id;
    const { ephemeris } = exampleEvent() as {
      ephemeris: { timeScale: string; rows: Array<{ time: string }> };
    };
    const rows = ephemeris.rows;
    expect(ephemeris.timeScale).toBe('TDB');
    const id = ((await createEvent({ bodyId: body }).expect(201)).body as { id: string }).id;
    const detail = (await t.get(`/api/events/${id}`).set(w.auth('observer')).expect(200)).body as {
      eventTimeUtc: string;
    };
    // The middle of the table in TDB, less TT − UTC = 32.184 s + 37 s of leap seconds (IERS Bulletin C
    // since 2017; from memory) and the ≤ 2 ms TDB − TT, rounded down to the second.
    const first = Date.parse(`${rows[0]?.time}Z`);
    const last = Date.parse(`${rows.at(-1)?.time}Z`);
    const middleUtcMs = (first + last) / 2 - 69_184;
    expect(detail.eventTimeUtc).toBe(
      `${new Date(Math.floor(middleUtcMs / 1000) * 1000).toISOString().slice(0, 19)}Z`,
    );
    const given = (await createEvent({ bodyId: body, eventTimeUtc: '2031-05-20T03:14:15.75Z' }).expect(201))
      .body as { id: string };
    const stored = await t.orm.em.fork().findOneOrFail(OccultationEvent, { id: given.id });
    expect(stored.eventTimeUtc).toBe('2031-05-20T03:14:15Z');
  });

  it('POST /api/events/import takes the body from bodyName, else the file, and the export names it', async () => {
    const byField = await importExample(t, w, exampleEvent() as unknown as Record<string, unknown>, {
      bodyName: 'Imported by name',
    });
    const file = { ...exampleEvent(), body: { name: 'Named in the file', designation: 'NF1' } };
    const byFile = await importExample(t, w, file as unknown as Record<string, unknown>);
    const em = t.orm.em.fork();
    expect(
      (await em.findOneOrFail(OccultationEvent, { id: byField }, { populate: ['body'] })).body.name,
    ).toBe('Imported by name');
    const fileBody = (await em.findOneOrFail(OccultationEvent, { id: byFile }, { populate: ['body'] })).body;
    expect([fileBody.name, fileBody.designation]).toEqual(['Named in the file', 'NF1']);
    const exported = (await t.get(`/api/events/${byFile}/export`).set(w.auth('observer')).expect(200))
      .body as {
      body: unknown;
    };
    expect(exported.body).toEqual({ name: 'Named in the file', designation: 'NF1' });
    // Importing the export again finds the same body instead of making a second one.
    const again = await importExample(t, w, exported as Record<string, unknown>);
    expect((await em.fork().findOneOrFail(OccultationEvent, { id: again })).body.id).toBe(fileBody.id);
    const bad = await t
      .post('/api/events/import')
      .set(w.auth('coordinator'))
      .field('teamId', w.team.id)
      .field('bodyName', 'y'.repeat(201))
      .attach('file', Buffer.from(JSON.stringify(exampleEvent())), 'event.json')
      .expect(400);
    expect(issuesOf(bad).map((i) => i.path)).toEqual(['bodyName']);
  });

  it('PATCH /api/events/:eventId moves an event to another body of the team, and a rename shows in its detail', async () => {
    const a = ((await createBody('Move from').expect(201)).body as BodySummary).id;
    const b = ((await createBody('Move to').expect(201)).body as BodySummary).id;
    const id = ((await createEvent({ bodyId: a }).expect(201)).body as { id: string }).id;
    const before = (await t.get(`/api/events/${id}`).set(w.auth('observer')).expect(200)).body as {
      bodyName: string;
    };
    expect(before.bodyName).toBe('Move from');
    await patch(t, `/api/events/${id}`).set(w.auth('modeller')).send({ bodyId: b }).expect(200);
    await patch(t, `/api/bodies/${b}`)
      .set(w.auth('coordinator'))
      .send({ name: 'Moved to, renamed' })
      .expect(200);
    const after = (await t.get(`/api/events/${id}`).set(w.auth('observer')).expect(200)).body as {
      bodyId: string;
      bodyName: string;
    };
    expect(after).toMatchObject({ bodyId: b, bodyName: 'Moved to, renamed' });
    const foreign = await t
      .post(`/api/teams/${w.otherTeam.id}/bodies`)
      .set(w.auth('outsider'))
      .send({ name: 'Not yours' })
      .expect(201);
    const refused = await patch(t, `/api/events/${id}`)
      .set(w.auth('modeller'))
      .send({ bodyId: (foreign.body as BodySummary).id })
      .expect(400);
    expect(issuesOf(refused)).toEqual([{ path: 'bodyId', message: 'no such body in this team' }]);
    await del(`/api/bodies/${b}`).set(w.auth('coordinator')).expect(409);
  });

  it('GET /api/bodies/:bodyId lists its events with the latest approved fit and its limb ± σ', async () => {
    const body = ((await createBody('With fits').expect(201)).body as BodySummary).id;
    const id = ((await createEvent({ bodyId: body }).expect(201)).body as { id: string }).id;
    const fitId = await storedFit(id);
    const detail = (await t.get(`/api/bodies/${body}`).set(w.auth('observer')).expect(200))
      .body as BodyDetail;
    const row = detail.events.find((e) => e.id === id);
    const limb = exampleSolution().limb;
    expect(row?.approvedFit).toMatchObject({
      id: fitId,
      reviewState: 'approved',
      // Stored with a made-up data hash: not the event's data, so based on older data.
      inputMatchesEvent: false,
      limb: {
        equatorialRadiusKm: { value: limb?.equatorialRadiusKm, sigma: limb?.uncertainty.equatorialRadiusKm },
        oblateness: { value: limb?.oblateness, sigma: limb?.uncertainty.oblateness },
      },
    });
    const list = (await t.get(`/api/teams/${w.team.id}/bodies`).set(w.auth('observer')).expect(200))
      .body as BodySummary[];
    expect(list.find((b) => b.id === body)).toMatchObject({ eventCount: 1, approvedFitCount: 1 });
  });

  it('physical parameters belong to the body: one stored through an event is read by its other events', async () => {
    const body = ((await createBody('Shared parameters').expect(201)).body as BodySummary).id;
    const first = ((await createEvent({ bodyId: body }).expect(201)).body as { id: string }).id;
    const second = ((await createEvent({ bodyId: body }).expect(201)).body as { id: string }).id;
    await put(`/api/events/${first}/dynamics`).set(w.auth('modeller')).send(CONTEXT).expect(200);
    const seen = (await t.get(`/api/events/${second}/dynamics`).set(w.auth('observer')).expect(200)).body as {
      bodyId: string;
      input: unknown;
    };
    expect(seen).toMatchObject({ bodyId: body, input: CONTEXT });
    const updated = { ...CONTEXT, heliocentricDistanceAu: 44 };
    await put(`/api/bodies/${body}/dynamics`).set(w.auth('coordinator')).send(updated).expect(200);
    const stored = await t.orm.em.fork().findOneOrFail(DynamicsContext, { body });
    expect(stored.document.heliocentricDistanceAu).toBe(44);
    expect(await t.orm.em.fork().count(DynamicsContext, { body })).toBe(1);
    await put(`/api/bodies/${body}/dynamics`).set(w.auth('observer')).send(updated).expect(403);
    await put(`/api/bodies/${body}/dynamics`).set(w.auth('outsider')).send(updated).expect(404);
    const bad = await put(`/api/bodies/${body}/dynamics`)
      .set(w.auth('modeller'))
      .send({ ...CONTEXT, body: { ...CONTEXT.body, radiusKm: -1 } })
      .expect(400);
    expect(issuesOf(bad).map((i) => i.path)).toEqual(['body.radiusKm']);
    const detail = (await t.get(`/api/bodies/${body}`).set(w.auth('observer')).expect(200))
      .body as BodyDetail;
    expect(detail).toMatchObject({ hasContext: true, context: { heliocentricDistanceAu: 44 } });
  });

  describe('fits of two bodies are never combined', () => {
    let bodyA = '';
    let bodyB = '';
    let fitA = '';
    let fitB = '';

    beforeAll(async () => {
      bodyA = ((await createBody('Alder').expect(201)).body as BodySummary).id;
      bodyB = ((await createBody('Birch').expect(201)).body as BodySummary).id;
      fitA = await storedFit(((await createEvent({ bodyId: bodyA }).expect(201)).body as { id: string }).id);
      fitB = await storedFit(((await createEvent({ bodyId: bodyB }).expect(201)).body as { id: string }).id);
    });

    it('GET /api/teams/:teamId/comparison over several bodies is refused on `bodyId`; one body is compared', async () => {
      const refused = await t.get(`/api/teams/${w.team.id}/comparison`).set(w.auth('observer')).expect(400);
      expect(issuesOf(refused)[0]?.path).toBe('bodyId');
      expect(issuesOf(refused)[0]?.message).toMatch(/Alder/);
      const one = (await t.get(`/api/bodies/${bodyA}/comparison`).set(w.auth('observer')).expect(200))
        .body as {
        body: { id: string };
        selection: string;
        fits: Array<{ fitId: string }>;
      };
      expect(one.body.id).toBe(bodyA);
      expect(one.selection).toBe('latest-approved');
      expect(one.fits.map((f) => f.fitId)).toEqual([fitA]);
      const byQuery = (
        await t.get(`/api/teams/${w.team.id}/comparison?bodyId=${bodyB}`).set(w.auth('observer')).expect(200)
      ).body as { fits: Array<{ fitId: string }> };
      expect(byQuery.fits.map((f) => f.fitId)).toEqual([fitB]);
    });

    it('POST /api/teams/:teamId/joint-poles with fits of two bodies is refused on the odd fit; nothing is queued', async () => {
      const refused = await t
        .post(`/api/teams/${w.team.id}/joint-poles`)
        .set(w.auth('modeller'))
        .send({ fitIds: [fitA, fitB] })
        .expect(400);
      expect(issuesOf(refused)).toEqual([
        {
          path: 'fitIds.1',
          message: 'a fit of Birch, while fitIds.0 is of Alder: fits of different bodies cannot be combined',
        },
      ]);
      const onPage = await t
        .post(`/api/bodies/${bodyA}/joint-poles`)
        .set(w.auth('modeller'))
        .send({ fitIds: [fitB] })
        .expect(400);
      expect(issuesOf(onPage)[0]).toEqual({
        path: 'fitIds.0',
        message: 'a fit of Birch, not of Alder: fits of different bodies cannot be combined',
      });
    });

    it('POST /api/bodies/:bodyId/shape refuses a fit of another body, naming it', async () => {
      const refused = await t
        .post(`/api/bodies/${bodyB}/shape`)
        .set(w.auth('observer'))
        .send({
          fitIds: [fitB, fitA],
          pole: { raDeg: 40, decDeg: 20 },
          periodHours: 8,
          epochUtc: '2030-01-01T00:00:00Z',
          model: 'spheroid',
        })
        .expect(400);
      expect(issuesOf(refused).map((i) => i.path)).toEqual(['fitIds.1']);
      await t
        .post(`/api/bodies/${bodyB}/shape`)
        .set(w.auth('outsider'))
        .send({
          fitIds: [fitB],
          pole: { raDeg: 40, decDeg: 20 },
          periodHours: 8,
          epochUtc: '2030-01-01T00:00:00Z',
          model: 'spheroid',
        })
        .expect(404);
    });
  });
});
