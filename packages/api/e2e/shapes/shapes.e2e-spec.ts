import {
  bodyToEquatorial,
  fitShape,
  projectEllipsoid,
  skyBasis,
  type LimbSolution,
  type Solution,
} from '@limbus/geometry';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OccultationEvent } from '../../src/events/entities/occultation-event.entity';
import { FitRun } from '../../src/fits/entities/fit-run.entity';
import type { ShapeView } from '../../src/shapes/shapes.service';
import { User } from '../../src/users/entities/user.entity';
import {
  type Actor,
  createWorkspace,
  exampleEvent,
  importExample,
  type Workspace,
} from '../events/workspace';
import { bootTestApp, type TestApp } from '../setup';

// An invented body seen at four invented events over four years, each with its own star and distance.
// Its limbs are the exact silhouettes of a known ellipsoid, so the route must give those axes back.
const AXES = { aKm: 610, bKm: 500, cKm: 420 };
const POLE = { raDeg: 52, decDeg: 24 };
const PERIOD_H = 6.71;
const PHASE_DEG = 70;
const EPOCH = '2028-01-01T00:00:00Z';
const SIGMA = { equatorialRadiusKm: 3, oblateness: 0.01, positionAngleDeg: 1 };
const DEG = Math.PI / 180;
const RAD = 180 / Math.PI;
// Exact by definition (SI, 17th CGPM 1983).
const C_KM_PER_S = 299_792.458;
const SCHEDULE = [
  { seenUtc: '2028-03-14T02:14:10.000Z', starRaDeg: 285.2, starDecDeg: -21.4, distanceKm: 5.982e9 },
  { seenUtc: '2029-03-20T05:40:00.000Z', starRaDeg: 287.1, starDecDeg: -21.1, distanceKm: 5.951e9 },
  { seenUtc: '2030-04-02T23:05:30.000Z', starRaDeg: 289.3, starDecDeg: -20.8, distanceKm: 5.925e9 },
  { seenUtc: '2031-04-11T03:58:45.000Z', starRaDeg: 291.0, starDecDeg: -20.5, distanceKm: 5.904e9 },
];

const emittedUtc = (s: (typeof SCHEDULE)[number]): string =>
  new Date(Date.parse(s.seenUtc) - (s.distanceKm / C_KM_PER_S) * 1000).toISOString();

function silhouette(s: (typeof SCHEDULE)[number]): LimbSolution {
  const w =
    PHASE_DEG * DEG +
    (2 * Math.PI * (Date.parse(emittedUtc(s)) - Date.parse(EPOCH))) / 1000 / (PERIOD_H * 3600);
  const e = projectEllipsoid(
    AXES,
    bodyToEquatorial(POLE.raDeg * DEG, POLE.decDeg * DEG, w),
    skyBasis(s.starRaDeg * DEG, s.starDecDeg * DEG),
  );
  const ellipse = {
    centerFKm: 0,
    centerGKm: 0,
    equatorialRadiusKm: e.semiMajorKm,
    oblateness: 1 - e.semiMinorKm / e.semiMajorKm,
    positionAngleDeg: e.positionAngleRad * RAD,
  };
  return {
    ...ellipse,
    equivalentRadiusKm: Math.sqrt(e.semiMajorKm * e.semiMinorKm),
    uncertainty: { centerFKm: 1, centerGKm: 1, ...SIGMA, equivalentRadiusKm: 3 },
    chi2: 0,
    dof: 5,
    radialResidualsKm: [],
    negativeChordsClear: true,
    timeOffsets: [],
    band: [],
  };
}

describe('3D shape from several fits', () => {
  let t: TestApp;
  let w: Workspace;
  const fitIds: string[] = [];
  let noLimbFitId = '';
  let queuedFitId = '';
  let otherTeamFitId = '';

  const shape = (body: Record<string, unknown>, actor: Actor = 'observer') =>
    t.post(`/api/teams/${w.team.id}/shape`).set(w.auth(actor)).send(body);

  const storeFit = async (
    eventId: string,
    s: (typeof SCHEDULE)[number],
    limb: LimbSolution | null,
    state: 'solved' | 'queued' = 'solved',
  ): Promise<string> => {
    const em = t.orm.em.fork();
    const file = exampleEvent() as {
      star: Record<string, number>;
      ephemeris: { rows: Array<Record<string, unknown>> };
    };
    file.star = { ...file.star, raDeg: s.starRaDeg, decDeg: s.starDecDeg };
    file.ephemeris.rows = file.ephemeris.rows.map((r) => ({ ...r, distanceKm: s.distanceKm }));
    const run = new FitRun(
      em.getReference(OccultationEvent, eventId),
      em.getReference(User, w.userIds.modeller),
      {
        input: JSON.stringify(file),
        inputSha256: '0'.repeat(64),
        dataSha256: '0'.repeat(64),
        options: {},
        engineVersion: 'e2e',
        seed: 1,
        idempotencyKey: null,
      },
    );
    run.state = state;
    const solution: Solution = {
      format: 'limbus-solution/1',
      chords: [],
      limb,
      rings: [],
      astrometry: {
        referenceTimeUtc: s.seenUtc,
        raOffsetCosDecMas: 0,
        decOffsetMas: 0,
        uncertainty: { raOffsetCosDecMas: 1, decOffsetMas: 1 },
      },
      engine: { version: 'e2e', inputSha256: '0'.repeat(64), seed: 1 },
    };
    run.solution = state === 'solved' ? solution : null;
    await em.persistAndFlush(run);
    return run.id;
  };

  beforeAll(async () => {
    t = await bootTestApp();
    w = await createWorkspace(t);
    const eventId = await importExample(t, w);
    for (const s of SCHEDULE) fitIds.push(await storeFit(eventId, s, silhouette(s)));
    noLimbFitId = await storeFit(eventId, SCHEDULE[0] as (typeof SCHEDULE)[number], null);
    queuedFitId = await storeFit(eventId, SCHEDULE[0] as (typeof SCHEDULE)[number], null, 'queued');
    // The other team's fit: an event imported there by its coordinator ("outsider").
    const other = await t
      .post('/api/events/import')
      .set(w.auth('outsider'))
      .field('teamId', w.otherTeam.id)
      .attach('file', Buffer.from(JSON.stringify(exampleEvent())), {
        filename: 'event.json',
        contentType: 'application/json',
      })
      .expect(201);
    otherTeamFitId = await storeFit(
      (other.body as { id: string }).id,
      SCHEDULE[1] as (typeof SCHEDULE)[number],
      null,
    );
  }, 120_000);
  afterAll(async () => {
    await t.close();
  });

  const triaxial = () => ({
    fitIds,
    pole: POLE,
    periodHours: PERIOD_H,
    epochUtc: EPOCH,
    phaseDeg: PHASE_DEG,
    model: 'triaxial',
  });

  it('POST /api/teams/:teamId/shape recovers the ellipsoid whose silhouettes the fits hold, with light time removed', async () => {
    const started = Date.now();
    const view = (await shape(triaxial()).expect(200)).body as ShapeView;
    expect(Date.now() - started).toBeLessThan(2000);
    expect(Math.abs(view.result.semiAxesKm.aKm - AXES.aKm)).toBeLessThan(0.01);
    expect(Math.abs(view.result.semiAxesKm.bKm - AXES.bKm)).toBeLessThan(0.01);
    expect(Math.abs(view.result.semiAxesKm.cKm - AXES.cKm)).toBeLessThan(0.01);
    expect(view.result.chi2).toBeLessThan(1e-6);
    expect(view.result.events.map((e) => e.id)).toEqual(fitIds);
    for (const e of view.result.events) expect(e.rmsRadialKm).toBeLessThan(0.01);
    expect(view.fits.map((f) => f.emittedUtc)).toEqual(SCHEDULE.map(emittedUtc));
    expect(view.fits.map((f) => f.seenUtc)).toEqual(SCHEDULE.map((s) => s.seenUtc));
    expect(view.pole).toEqual({ ...POLE, source: 'entered', jointPoleId: null });
    expect(view.cautions).toEqual([]);
  });

  it('POST /api/teams/:teamId/shape answers what fitShape() gives for the same limbs, pole and rotation', async () => {
    const view = (await shape({ ...triaxial(), phaseDeg: undefined, periodHoursSigma: 0.01 }).expect(200))
      .body as ShapeView;
    const direct = fitShape({
      events: SCHEDULE.map((s, k) => {
        const limb = silhouette(s);
        return {
          id: fitIds[k] as string,
          timeUtc: emittedUtc(s),
          starRaDeg: s.starRaDeg,
          starDecDeg: s.starDecDeg,
          limb,
          sigma: SIGMA,
        };
      }),
      pole: POLE,
      rotation: { periodHours: PERIOD_H, periodHoursSigma: 0.01, referenceEpochUtc: EPOCH },
      model: 'triaxial',
    });
    expect(view.result).toEqual(JSON.parse(JSON.stringify(direct)));
    expect(view.result.phaseFitted).toBe(true);
  });

  it('POST /api/teams/:teamId/shape fits a spheroid and reports the equilibrium density with its caution', async () => {
    const view = (await shape({ ...triaxial(), model: 'spheroid', phaseDeg: undefined }).expect(200))
      .body as ShapeView;
    expect(view.result.model).toBe('spheroid');
    expect(view.result.semiAxesKm.aKm).toBe(view.result.semiAxesKm.bKm);
    // A triaxial body's silhouettes do not fit a spheroid exactly: the misfit shows in the residuals.
    expect(view.result.chi2).toBeGreaterThan(1);
    const eq = view.result.equilibrium;
    if (eq === null) throw new Error('no equilibrium density for a flattened spheroid');
    expect(eq.sequence).toBe('Maclaurin');
    expect(eq.caution).toMatch(/hydrostatic equilibrium/);
    // Maclaurin spheroid: Ω²/(πGρ) = 2√(1−e²)(3−2e²) arcsin(e)/e³ − 6(1−e²)/e² (Chandrasekhar,
    // Ellipsoidal Figures of Equilibrium, 1969, ch. 5, eq. 3; equation number from memory), with
    // G = 6.67430e-11 m³ kg⁻¹ s⁻² (CODATA 2018) and Ω = 2π/period.
    const e2 = 1 - (view.result.semiAxesKm.cKm / view.result.semiAxesKm.aKm) ** 2;
    const e = Math.sqrt(e2);
    const ratio = ((2 * Math.sqrt(1 - e2)) / e ** 3) * (3 - 2 * e2) * Math.asin(e) - (6 * (1 - e2)) / e2;
    const omega = (2 * Math.PI) / (PERIOD_H * 3600);
    const density = omega ** 2 / (Math.PI * 6.6743e-11 * ratio);
    expect(Math.abs(eq.densityKgM3 / density - 1)).toBeLessThan(1e-9);
    expect(eq.densityKgM3Sigma).toBeGreaterThan(0);
  });

  it('POST /api/teams/:teamId/shape refuses, naming the field, fits without a limb, unsolved, of another team or twice', async () => {
    const body = (
      await shape({
        ...triaxial(),
        fitIds: [noLimbFitId, queuedFitId, otherTeamFitId, fitIds[0], fitIds[0]],
      }).expect(400)
    ).body as { issues: Array<{ path: string; message: string }> };
    const paths = body.issues.map((i) => i.path).sort();
    expect(paths).toEqual(['fitIds', 'fitIds.0', 'fitIds.1', 'fitIds.2']);
    expect(body.issues.find((i) => i.path === 'fitIds.0')?.message).toMatch(/no limb/);
    expect(body.issues.find((i) => i.path === 'fitIds.1')?.message).toMatch(/queued, not solved/);
    expect(body.issues.find((i) => i.path === 'fitIds.2')?.message).toMatch(/no such fit in this team/);
  });

  it('POST /api/teams/:teamId/shape refuses a bad pole, period or epoch, and a joint pole that is not there', async () => {
    const issuePaths = async (body: Record<string, unknown>): Promise<string[]> =>
      ((await shape(body).expect(400)).body as { issues: Array<{ path: string }> }).issues.map((i) => i.path);
    expect(await issuePaths({ ...triaxial(), periodHours: 0 })).toEqual(['periodHours']);
    expect(await issuePaths({ ...triaxial(), epochUtc: '2028-01-01 00:00' })).toEqual(['epochUtc']);
    expect(await issuePaths({ ...triaxial(), pole: { raDeg: 10 } })).toContain('pole');
    expect(await issuePaths({ ...triaxial(), pole: { fromJointPoleId: 'no-such-job' } })).toEqual([
      'pole.fromJointPoleId',
    ]);
  });

  it('POST /api/teams/:teamId/shape is open to every member of the team, 404 to another team, 401 signed out', async () => {
    for (const actor of ['admin', 'coordinator', 'observer', 'modeller', 'reviewer'] as const)
      await shape(triaxial(), actor).expect(200);
    await shape(triaxial(), 'outsider').expect(404);
    await shape(triaxial(), 'anonymous').expect(401);
    // Nothing is stored: the fits are as they were.
    const rows = await t.orm.em.fork().find(FitRun, { id: { $in: fitIds } }, { fields: ['state'] });
    expect(rows.map((r) => r.state)).toEqual(['solved', 'solved', 'solved', 'solved']);
  });

  it('POST /api/teams/:teamId/shape/table gives the same numbers as the fit, with each fit hash as provenance', async () => {
    const view = (await shape({ ...triaxial(), model: 'spheroid', phaseDeg: undefined }).expect(200))
      .body as ShapeView;
    const table = (format: string, actor: Actor = 'observer') =>
      t
        .post(`/api/teams/${w.team.id}/shape/table?format=${format}`)
        .set(w.auth(actor))
        .send({ ...triaxial(), model: 'spheroid', phaseDeg: undefined });
    const json = JSON.parse((await table('json').expect(200)).text) as {
      provenance: Record<string, string>;
      parameters: Array<{ group: string; parameter: string; value: number; sigma: number | null }>;
    };
    const cell = (group: string, parameter: string) =>
      json.parameters.find((p) => p.group === group && p.parameter === parameter);
    expect(cell('shape', 'aKm')).toMatchObject({
      value: view.result.semiAxesKm.aKm,
      sigma: view.result.uncertainty.aKm,
    });
    expect(cell('shape', 'cKm')?.value).toBe(view.result.semiAxesKm.cKm);
    expect(cell('fit', 'chi2')?.value).toBe(view.result.chi2);
    expect(cell('equilibrium (Maclaurin)', 'densityKgM3')?.value).toBe(view.result.equilibrium?.densityKgM3);
    const runs = await t.orm.em.fork().find(FitRun, { id: { $in: fitIds } });
    const sha = new Map(runs.map((r) => [r.id, r.inputSha256]));
    expect(json.provenance.fitIds).toBe(fitIds.join(' '));
    expect(json.provenance.inputSha256).toBe(fitIds.map((id) => sha.get(id)).join(' '));
    expect(json.provenance.cautions).toMatch(/hydrostatic equilibrium/);
    const csv = await table('csv').expect(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.text.split('\r\n')[0]).toBe('group,parameter,value,sigma,unit,status');
    expect(csv.text).toContain(
      `shape,aKm,${view.result.semiAxesKm.aKm},${view.result.uncertainty.aKm},km,fitted`,
    );
    const tex = (await table('tex').expect(200)).text;
    expect(tex).toContain('\\begin{tabular}');
    expect(tex).toContain('\\pm');
    await table('xls').expect(400);
    for (const actor of ['admin', 'coordinator', 'observer', 'modeller', 'reviewer'] as const)
      await table('csv', actor).expect(200);
    await table('csv', 'outsider').expect(404);
    await table('csv', 'anonymous').expect(401);
  });
});
