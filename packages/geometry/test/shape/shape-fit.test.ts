import { describe, expect, it } from 'vitest';
import { G_SI } from '../../src/dynamics/index.js';
import { DEG, RAD } from '../../src/math.js';
import {
  bodyToEquatorial,
  fitShape,
  jacobiEllipsoid,
  maclaurinOmega2,
  projectEllipsoid,
  skyBasis,
  type SemiAxesKm,
  type ShapeEventInput,
  type ShapeFitInput,
} from '../../src/shape/index.js';
import { GeometryInputError } from '../../src/types.js';
import { seededNormal, standardDeviation } from '../dynamics/random.js';
import { expectClose } from '../expect-close.js';

// An invented body seen at invented events over five years, the star drifting a few degrees as a distant
// body's geocentric direction does.
const POLE = { raDeg: 48, decDeg: 31 };
const EPOCH = '2031-01-01T00:00:00Z';
const SCHEDULE: Array<{ id: string; timeUtc: string; starRaDeg: number; starDecDeg: number }> = [
  { id: 'E1', timeUtc: '2031-03-14T02:10:00Z', starRaDeg: 112.4, starDecDeg: 21.9 },
  { id: 'E2', timeUtc: '2031-11-02T21:47:30Z', starRaDeg: 113.9, starDecDeg: 21.6 },
  { id: 'E3', timeUtc: '2032-09-19T04:03:10Z', starRaDeg: 115.2, starDecDeg: 21.2 },
  { id: 'E4', timeUtc: '2033-12-30T23:15:45Z', starRaDeg: 117.0, starDecDeg: 20.8 },
  { id: 'E5', timeUtc: '2034-05-07T01:30:00Z', starRaDeg: 118.1, starDecDeg: 20.5 },
  { id: 'E6', timeUtc: '2035-10-21T19:58:20Z', starRaDeg: 120.3, starDecDeg: 19.9 },
];
const SIGMA = { equatorialRadiusKm: 4, oblateness: 0.01, positionAngleDeg: 1.5 };

function syntheticEvents(
  axes: SemiAxesKm,
  periodHours: number,
  phaseDeg: number,
  noise?: () => number,
): ShapeEventInput[] {
  const epochMs = Date.parse(EPOCH);
  return SCHEDULE.map((s) => {
    const w =
      phaseDeg * DEG + (2 * Math.PI * (Date.parse(s.timeUtc) - epochMs)) / 1000 / (periodHours * 3600);
    const m = bodyToEquatorial(POLE.raDeg * DEG, POLE.decDeg * DEG, w);
    const e = projectEllipsoid(axes, m, skyBasis(s.starRaDeg * DEG, s.starDecDeg * DEG));
    const n = noise ?? (() => 0);
    return {
      ...s,
      limb: {
        equatorialRadiusKm: e.semiMajorKm + SIGMA.equatorialRadiusKm * n(),
        oblateness: 1 - e.semiMinorKm / e.semiMajorKm + SIGMA.oblateness * n(),
        positionAngleDeg: e.positionAngleRad * RAD + SIGMA.positionAngleDeg * n(),
      },
      sigma: SIGMA,
    };
  });
}

const TRIAXIAL = { aKm: 640, bKm: 520, cKm: 430 };
const PERIOD_H = 7.93;

function input(
  events: ShapeEventInput[],
  extra: Partial<ShapeFitInput['rotation']>,
  model: ShapeFitInput['model'],
) {
  return {
    events,
    pole: POLE,
    rotation: { periodHours: PERIOD_H, referenceEpochUtc: EPOCH, ...extra },
    model,
  } satisfies ShapeFitInput;
}

describe('fitShape()', () => {
  it('fitShape() recovers the semi-axes of a triaxial body from exact silhouettes at a known phase', () => {
    const result = fitShape(input(syntheticEvents(TRIAXIAL, PERIOD_H, 35), { phaseDeg: 35 }, 'triaxial'));
    expectClose(result.semiAxesKm.aKm, 640, 1e-3);
    expectClose(result.semiAxesKm.bKm, 520, 1e-3);
    expectClose(result.semiAxesKm.cKm, 430, 1e-3);
    expectClose(result.chi2, 0, 1e-8);
    expect(result.dof).toBe(18 - 3);
    for (const e of result.events) expectClose(e.rmsRadialKm, 0, 1e-3);
    expect(result.warnings.filter((w) => /exceeds/.test(w))).toEqual([]);
    // 430/640 is far from the Jacobi figure at b/a = 0.8125 (c/a ≈ 0.53): the fit says so.
    expect(result.warnings.some((w) => /off the Jacobi sequence/.test(w))).toBe(true);
  });

  it('fitShape() finds an unknown rotation phase modulo 180°', () => {
    const result = fitShape(input(syntheticEvents(TRIAXIAL, PERIOD_H, 160), {}, 'triaxial'));
    expect(result.phaseFitted).toBe(true);
    expectClose(result.semiAxesKm.aKm, 640, 1e-3);
    expectClose(result.semiAxesKm.bKm, 520, 1e-3);
    expectClose(result.semiAxesKm.cKm, 430, 1e-3);
    expectClose(result.phaseDeg ?? Number.NaN, 160, 1e-4);
  });

  it('fitShape() first-order 1-sigma matches a seeded Monte Carlo of refits', () => {
    const normal = seededNormal(31);
    const first = fitShape(
      input(syntheticEvents(TRIAXIAL, PERIOD_H, 35, normal), { phaseDeg: 35 }, 'triaxial'),
    );
    const samples = { a: [] as number[], b: [] as number[], c: [] as number[] };
    for (let i = 0; i < 150; i++) {
      const r = fitShape(
        input(syntheticEvents(TRIAXIAL, PERIOD_H, 35, normal), { phaseDeg: 35 }, 'triaxial'),
      );
      samples.a.push(r.semiAxesKm.aKm);
      samples.b.push(r.semiAxesKm.bKm);
      samples.c.push(r.semiAxesKm.cKm);
    }
    // 150 refits estimate a sigma to ±6 % (1/√(2N)); 20 % leaves room for the model's curvature.
    expectClose(standardDeviation(samples.a) / first.uncertainty.aKm, 1, 0.2);
    expectClose(standardDeviation(samples.b) / first.uncertainty.bKm, 1, 0.2);
    expectClose(standardDeviation(samples.c) / first.uncertainty.cKm, 1, 0.2);
    // With honest sigmas χ²/dof scatters about 1 (dof = 15: 1 ± 0.37 at 1-sigma).
    expect(first.chi2 / first.dof).toBeGreaterThan(0.2);
    expect(first.chi2 / first.dof).toBeLessThan(2.5);
  });

  it('fitShape() gives the Maclaurin density of an equilibrium spheroid', () => {
    // A Maclaurin spheroid of e = 0.6 (c/a = 0.8) and ρ = 1100 kg/m³ spins with Ω² = q(e)·πGρ.
    const q = maclaurinOmega2(0.6);
    const periodH = (2 * Math.PI) / Math.sqrt(q * Math.PI * G_SI * 1100) / 3600;
    const axes = { aKm: 700, bKm: 700, cKm: 560 };
    const result = fitShape(input(syntheticEvents(axes, periodH, 0), { periodHours: periodH }, 'spheroid'));
    expectClose(result.semiAxesKm.aKm, 700, 1e-3);
    expectClose(result.semiAxesKm.cKm, 560, 1e-3);
    expect(result.equilibrium?.sequence).toBe('Maclaurin');
    expectClose(result.equilibrium?.densityKgM3 ?? 0, 1100, 0.01);
    expect(result.equilibrium?.densityKgM3Sigma).toBeGreaterThan(0);
    expect(result.equilibrium?.caution).toMatch(/hydrostatic equilibrium/);
  });

  it('fitShape() gives the Jacobi density of an equilibrium triaxial body', () => {
    const { cOverA, omega2 } = jacobiEllipsoid(0.7);
    const periodH = (2 * Math.PI) / Math.sqrt(omega2 * Math.PI * G_SI * 2000) / 3600;
    const axes = { aKm: 600, bKm: 420, cKm: 600 * cOverA };
    const result = fitShape(
      input(syntheticEvents(axes, periodH, 80), { periodHours: periodH, periodHoursSigma: 1e-6 }, 'triaxial'),
    );
    expectClose(result.semiAxesKm.aKm, 600, 1e-3);
    expect(result.equilibrium?.sequence).toBe('Jacobi');
    expectClose(result.equilibrium?.densityKgM3 ?? 0, 2000, 0.05);
    expectClose(result.equilibrium?.cOverAOnSequence ?? 0, result.equilibrium?.cOverAFitted ?? 1, 1e-5);
  });

  it('fitShape() fits a spheroid when the phase is unknown and the body is axisymmetric', () => {
    const axes = { aKm: 580, bKm: 580, cKm: 470 };
    const result = fitShape(input(syntheticEvents(axes, PERIOD_H, 0), {}, 'spheroid'));
    expect(result.phaseDeg).toBeNull();
    expectClose(result.semiAxesKm.aKm, 580, 1e-3);
    expectClose(result.semiAxesKm.cKm, 470, 1e-3);
    expect(result.dof).toBe(16);
  });

  it('fitShape() names the input that cannot be used', () => {
    const events = syntheticEvents(TRIAXIAL, PERIOD_H, 35);
    const path = (run: () => unknown): string => {
      try {
        run();
      } catch (error) {
        if (error instanceof GeometryInputError) return error.path;
        throw error;
      }
      return 'no error';
    };
    const oneRadiusOnly = [
      { ...events[0]!, sigma: { equatorialRadiusKm: 3, oblateness: 0, positionAngleDeg: 0 } },
    ];
    expect(path(() => fitShape(input(oneRadiusOnly, { phaseDeg: 0 }, 'triaxial')))).toBe('events');
    const badTime = [{ ...events[0]!, timeUtc: '2031-03-14 02:10' }, ...events.slice(1)];
    expect(path(() => fitShape(input(badTime, { phaseDeg: 0 }, 'triaxial')))).toBe('events[0].timeUtc');
    expect(path(() => fitShape(input(events, { periodHours: -1 }, 'spheroid')))).toBe('rotation.periodHours');
  });
});
