import { computeDynamicsContext, type Solution } from '@limbus/geometry';
import { validateContextInput } from '@limbus/schema';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DynamicsContext } from '../../src/dynamics/entities/dynamics-context.entity';
import type { DynamicsView } from '../../src/dynamics/dynamics.service';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { User } from '../../src/users/entities/user.entity';
import { createWorkspace, importExample, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';
import request from 'supertest';
import type { Server } from 'node:http';

/** The invented body of docs/file-formats.md, "Context input". */
const CONTEXT = {
  format: 'limbus-context-input/1',
  body: {
    densityKgM3: 1700,
    densityKgM3Sigma: 200,
    densityKgM3Source: 'invented: assumed icy-rock mix',
    radiusKm: 560,
    radiusKmSigma: 10,
    spinPeriodHours: 8.9,
    spinPeriodHoursSigma: 0.1,
  },
  particleDensityKgM3: 900,
  heliocentricDistanceAu: 43.1,
  satellites: [{ name: 'Oru', semiMajorAxisKm: 14500, semiMajorAxisKmSigma: 50 }],
  rings: [{ ring: 'R1', radiusKm: 2010, radiusKmSigma: 8 }],
};

describe('dynamics context routes', () => {
  let t: TestApp;
  let w: Workspace;
  let eventId: string;

  const put = (actor: Parameters<Workspace['auth']>[0], body: unknown): request.Test =>
    request(t.app.getHttpServer() as Server)
      .put(`/api/events/${eventId}/dynamics`)
      .set('X-Forwarded-For', t.address)
      .set(w.auth(actor))
      .send(body as object);

  const bodyOf = async (id: string) =>
    (await t.orm.em.fork().findOneOrFail(OccultationEvent, { id })).body.id;

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    eventId = await importExample(t, w);
  });
  afterAll(async () => {
    await t.close();
  });

  it('GET /api/events/:eventId/dynamics answers an empty view before any context is stored', async () => {
    const response = await t.get(`/api/events/${eventId}/dynamics`).set(w.auth('observer')).expect(200);
    expect(response.body).toEqual({
      bodyId: await bodyOf(eventId),
      input: null,
      result: null,
      ringFits: [],
      updatedAt: null,
    });
  });

  it('PUT /api/events/:eventId/dynamics stores the input with its sources and returns the geometry result', async () => {
    const response = await put('modeller', CONTEXT).expect(200);
    const view = response.body as DynamicsView;
    const validation = validateContextInput(CONTEXT);
    if (!validation.ok) throw new Error('example context does not validate');
    const { uncertainty, ...figures } = computeDynamicsContext(validation.input);
    expect(view.result).toEqual({
      format: 'limbus-context/1',
      ...figures,
      sources: { 'body.densityKgM3': 'invented: assumed icy-rock mix' },
      notes: view.result.notes,
      uncertainty,
    });
    // Classical fluid Roche limit d = 2.44 R (ρ_body/ρ_particle)^(1/3) (from memory; Roche's coefficient
    // as quoted in planetary-ring texts): 2.44 × 560 × (1700/900)^(1/3) = 1688.9 km.
    expect(Math.abs(view.result.rocheFluidKm - 2.44 * 560 * Math.cbrt(1700 / 900))).toBeLessThan(1e-6);
    const stored = await t.orm.em.fork().findOneOrFail(DynamicsContext, { body: await bodyOf(eventId) });
    expect(stored.document).toEqual({ ...CONTEXT, body: { ...CONTEXT.body } });
  });

  it('PUT /api/events/:eventId/dynamics with bad input answers 400 naming the field and keeps the stored one', async () => {
    const response = await put('modeller', {
      ...CONTEXT,
      body: { ...CONTEXT.body, radiusKm: -5 },
    }).expect(400);
    const paths = (response.body as { issues: Array<{ path: string }> }).issues.map((i) => i.path);
    expect(paths).toEqual(['body.radiusKm']);
    const stored = await t.orm.em.fork().findOneOrFail(DynamicsContext, { body: await bodyOf(eventId) });
    expect(stored.document.body.radiusKm).toBe(560);
  });

  // Every cell of the dynamics rows of docs/authorization.md ("outsider" is the other team's coordinator).
  it('GET and PUT /api/events/:eventId/dynamics answer each role as docs/authorization.md says', async () => {
    const actors = [
      'admin',
      'coordinator',
      'observer',
      'modeller',
      'reviewer',
      'outsider',
      'anonymous',
    ] as const;
    const gets: number[] = [];
    const puts: number[] = [];
    for (const actor of actors) {
      gets.push((await t.get(`/api/events/${eventId}/dynamics`).set(w.auth(actor))).status);
      puts.push((await put(actor, CONTEXT)).status);
    }
    expect(gets).toEqual([200, 200, 200, 200, 200, 404, 401]);
    expect(puts).toEqual([200, 200, 403, 200, 403, 404, 401]);
  });

  it('GET /api/events/:eventId/dynamics sets the latest solved ring fit against the context', async () => {
    const em = t.orm.em.fork();
    const event = await em.findOneOrFail(OccultationEvent, { id: eventId });
    const solution: Solution = {
      format: 'limbus-solution/1',
      chords: [],
      limb: null,
      rings: [
        {
          ring: 'R1',
          centerFKm: 0,
          centerGKm: 0,
          radiusKm: 2030,
          openingAngleDeg: 30,
          positionAngleDeg: 120,
          uncertainty: { radiusKm: 12, openingAngleDeg: 1, positionAngleDeg: 1 },
          poles: [
            { raDeg: 10, decDeg: 20 },
            { raDeg: 190, decDeg: -20 },
          ],
          crossings: [],
          chi2: 1,
          dof: 1,
        },
      ],
      astrometry: null,
      engine: { version: 'e2e', inputSha256: '0'.repeat(64), seed: 1 },
    };
    const fit = new FitRun(event, em.getReference(User, w.userIds.modeller), {
      input: '{}',
      inputSha256: '0'.repeat(64),
      dataSha256: '0'.repeat(64),
      options: {},
      engineVersion: 'e2e',
      seed: 1,
      idempotencyKey: null,
    });
    fit.state = 'solved';
    fit.solution = solution;
    fit.finishedAt = new Date();
    await em.persist(fit).flush();

    const view = (await t.get(`/api/events/${eventId}/dynamics`).set(w.auth('observer')).expect(200))
      .body as DynamicsView;
    expect(view.ringFits).toHaveLength(1);
    const ring = view.ringFits[0];
    if (!ring) throw new Error('no ring fit');
    expect(ring.fitId).toBe(fit.id);
    expect(ring.radiusKm).toBe(2030);
    expect(ring.radiusKmSigma).toBeCloseTo(12, 12);
    // Ratios are the fitted radius over the context's own figures, exactly as computed above.
    expect(Math.abs(ring.inRocheFluid - 2030 / view.result.rocheFluidKm)).toBeLessThan(1e-12);
    expect(Math.abs(ring.inBodyRadii - 2030 / 560)).toBeLessThan(1e-12);
    expect(Math.abs(ring.inSynchronous - 2030 / view.result.synchronousKm)).toBeLessThan(1e-12);
    expect(ring.uncertainty.inBodyRadii).toBeGreaterThan(0);
  });

  it('PUT /api/events/:eventId/dynamics keeps named p:q resonances and sets each ring against its nearest ones', async () => {
    // Oru at 14 500 km: its 6:1 resonance lies at 14 500 × 6^(−2/3) = 4391.37 km (a = a_sat (q/p)^(2/3),
    // Kepler's third law; Murray & Dermott, Solar System Dynamics, 1999, §8.4, from memory). A ring put
    // 20 km outside it, with 8 km 1-sigma against the resonance's 50 × 6^(−2/3) = 15.14 km.
    const sixToOneKm = 14_500 * Math.cbrt(1 / 36);
    const document = {
      ...CONTEXT,
      rings: [{ ring: 'R1', radiusKm: sixToOneKm + 20, radiusKmSigma: 8 }],
      resonances: [{ p: 11, q: 2 }],
    };
    const view = (await put('modeller', document).expect(200)).body as DynamicsView;
    expect(view.input).toMatchObject({ resonances: [{ p: 11, q: 2 }] });
    expect(view.result.meanMotion.find((m) => m.p === 11 && m.q === 2)).toMatchObject({
      satellite: 'Oru',
      named: true,
    });
    const nearest = view.result.ringResonances[0]?.nearest[0];
    expect(nearest).toMatchObject({ kind: 'mean-motion', satellite: 'Oru', p: 6, q: 1 });
    expect(Math.abs((nearest?.radiusKm ?? 0) - 4391.37)).toBeLessThan(0.01);
    expect(Math.abs((nearest?.distanceKm ?? 0) - 20)).toBeLessThan(1e-9);
    expect(Math.abs((nearest?.distanceKmSigma ?? 0) - Math.hypot(8, 50 * Math.cbrt(1 / 36)))).toBeLessThan(
      1e-9,
    );
    // The fitted ring (2030 ± 12 km) is set against the same resonances with its own 1-sigma.
    const fitted = view.ringFits[0]?.nearestResonances ?? [];
    const validation = validateContextInput(document);
    if (!validation.ok) throw new Error('the context does not validate');
    const direct = computeDynamicsContext({
      ...validation.input,
      rings: [{ ring: 'R1', radiusKm: 2030, radiusKmSigma: 12 }],
    });
    expect(fitted).toEqual(direct.ringResonances[0]?.nearest);
    const refused = await put('modeller', { ...document, resonances: [{ p: 4, q: 2 }] }).expect(400);
    expect((refused.body as { issues: Array<{ path: string; message: string }> }).issues).toEqual([
      { path: 'resonances[0]', message: 'write 4:2 in lowest terms, 2:1' },
    ]);
  });
});
