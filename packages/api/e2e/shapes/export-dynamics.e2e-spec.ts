import type { Server } from 'node:http';
import type { LimbSolution, RingSolution, Solution } from '@limbus/geometry';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import { User } from '../../src/users/entities/user.entity';
import { createWorkspace, exampleEvent, importExample, type Workspace } from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';

// An invented body of radius 560 km and density 1700 kg/m³ with ring particles of 900 kg/m³, and a fitted
// ring of radius 1120 km: two body radii exactly.
const CONTEXT = {
  format: 'limbus-context-input/1',
  body: {
    densityKgM3: 1700,
    densityKgM3Sigma: 200,
    densityKgM3Source: 'invented',
    radiusKm: 560,
    radiusKmSigma: 10,
    spinPeriodHours: 8.9,
    spinPeriodHoursSigma: 0.1,
  },
  particleDensityKgM3: 900,
  heliocentricDistanceAu: 43.1,
  satellites: [],
  rings: [],
};
const RING_KM = 1120;
// Roche limits d = k R (ρ_body/ρ_particle)^(1/3) with k = 2.44 for a fluid satellite and 2^(1/3) for a
// rigid one: Murray & Dermott, Solar System Dynamics, 1999, §4.12 (section number from memory).
const DENSITY_RATIO_CUBE_ROOT = Math.cbrt(1700 / 900);
const ROCHE_FLUID_KM = 2.44 * 560 * DENSITY_RATIO_CUBE_ROOT;
const ROCHE_RIGID_KM = Math.cbrt(2) * 560 * DENSITY_RATIO_CUBE_ROOT;

const LIMB: LimbSolution = {
  centerFKm: 0,
  centerGKm: 0,
  equatorialRadiusKm: 570,
  oblateness: 0.08,
  positionAngleDeg: 20,
  equivalentRadiusKm: 546.7,
  uncertainty: {
    centerFKm: 1,
    centerGKm: 1,
    equatorialRadiusKm: 3,
    oblateness: 0.01,
    positionAngleDeg: 1,
    equivalentRadiusKm: 3,
  },
  chi2: 4.2,
  dof: 6,
  radialResidualsKm: [],
  negativeChordsClear: true,
  timeOffsets: [],
  band: [],
};
const RING: RingSolution = {
  ring: 'R1',
  centerFKm: 0,
  centerGKm: 0,
  radiusKm: RING_KM,
  openingAngleDeg: 31,
  positionAngleDeg: 20,
  uncertainty: { radiusKm: 5, openingAngleDeg: 0.5, positionAngleDeg: 0.5 },
  poles: [
    { raDeg: 40, decDeg: 20 },
    { raDeg: 80, decDeg: -10 },
  ],
  crossings: [],
  chi2: 1,
  dof: 2,
};

type TableJson = {
  parameters: Array<{ group: string; parameter: string; value: number; sigma: number | null }>;
};

describe('fit exports with the event body context', () => {
  let t: TestApp;
  let w: Workspace;
  let withContext = '';
  let withoutContext = '';

  const storeFit = async (eventId: string): Promise<string> => {
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
    const solution: Solution = {
      format: 'limbus-solution/1',
      chords: [],
      limb: LIMB,
      rings: [RING],
      astrometry: null,
      engine: { version: 'e2e', inputSha256: '0'.repeat(64), seed: 1 },
    };
    run.solution = solution;
    await em.persistAndFlush(run);
    return run.id;
  };

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    // Physical parameters belong to the body: the event without them observes another body.
    const eventWith = await importExample(t, w);
    const eventWithout = await importExample(t, w, exampleEvent(), { bodyName: 'Body without parameters' });
    await request(t.app.getHttpServer() as Server)
      .put(`/api/events/${eventWith}/dynamics`)
      .set('X-Forwarded-For', t.address)
      .set(w.auth('modeller'))
      .send(CONTEXT)
      .expect(200);
    withContext = await storeFit(eventWith);
    withoutContext = await storeFit(eventWithout);
  }, 120_000);
  afterAll(async () => {
    await t.close();
  });

  const table = async (fitId: string, format: 'json' | 'csv' | 'tex'): Promise<string> =>
    (await t.get(`/api/fits/${fitId}/table?format=${format}`).set(w.auth('observer')).expect(200)).text;

  it('GET /api/fits/:fitId/table?format=json adds the ring in body radii and against the Roche limits', async () => {
    const doc = JSON.parse(await table(withContext, 'json')) as TableJson;
    const row = (parameter: string) =>
      doc.parameters.find((p) => p.group === 'ring R1 context' && p.parameter === parameter);
    expect(Math.abs((row('radiusInBodyRadii')?.value ?? 0) - 2)).toBeLessThan(1e-9);
    expect(Math.abs((row('radiusOverRocheFluid')?.value ?? 0) - RING_KM / ROCHE_FLUID_KM)).toBeLessThan(1e-6);
    expect(Math.abs((row('radiusOverRocheRigid')?.value ?? 0) - RING_KM / ROCHE_RIGID_KM)).toBeLessThan(1e-6);
    // 1-sigma of R_ring/R_body from both radii's 1-sigma, first order: 2·√((5/1120)² + (10/560)²).
    const sigma = 2 * Math.hypot(5 / 1120, 10 / 560);
    expect(Math.abs((row('radiusInBodyRadii')?.sigma ?? 0) - sigma)).toBeLessThan(1e-6);
    expect(row('radiusOverSynchronous')).toBeDefined();
  });

  it('GET /api/fits/:fitId/table?format=csv and tex carry the same rows; a fit of an event without a context has none', async () => {
    expect(await table(withContext, 'csv')).toMatch(/ring R1 context,radiusOverRocheFluid,/);
    expect(await table(withContext, 'tex')).toMatch(/ring R1 context/);
    const doc = JSON.parse(await table(withoutContext, 'json')) as TableJson;
    expect(doc.parameters.filter((p) => p.group.endsWith('context'))).toEqual([]);
    expect(doc.parameters.some((p) => p.group === 'ring R1' && p.parameter === 'radiusKm')).toBe(true);
  });

  it('GET /api/fits/:fitId/figure?format=svg says in the caption where the ring lies against the Roche limits', async () => {
    const caption = async (fitId: string): Promise<string> => {
      // supertest buffers only text types by default; an SVG comes as image/svg+xml.
      const response = await t
        .get(`/api/fits/${fitId}/figure?format=svg`)
        .set(w.auth('observer'))
        .buffer(true)
        .parse((res, done) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () => done(null, Buffer.concat(chunks)));
        })
        .expect(200);
      const svg = (response.body as Buffer).toString('utf8');
      const element = /<text data-role="caption"[\s\S]*?<\/text>/.exec(svg)?.[0] ?? '';
      return element
        .replace(/<[^>]+>/g, ' ')
        .replace(/\s+/g, ' ')
        .trim();
    };
    const text = await caption(withContext);
    // 1120 km against 1689 km (fluid, inside) and 872 km (rigid, outside).
    // 1-sigma to two significant digits, the value to the same place: 2·√((5/1120)² + (10/560)²) = 0.037.
    expect(text).toMatch(/ring R1 lies at 2\.000 ± 0\.037 body radii/);
    expect(text).toMatch(/ 0\.663 ± 0\.\d{3} of the fluid Roche limit \(inside\)/);
    expect(text).toMatch(/ 1\.284 ± 0\.\d{3} of the rigid one \(outside\)/);
    expect(await caption(withoutContext)).not.toMatch(/Roche/);
  });
});
