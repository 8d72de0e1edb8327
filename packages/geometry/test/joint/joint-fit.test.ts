import { describe, expect, it } from 'vitest';

import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { fitJointPole } from '../../src/joint/joint-fit.js';
import { poleAspect, unitFromRaDec } from '../../src/joint/pole.js';
import { GeometryInputError } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { syntheticRingEvent, triadTowards, type SyntheticEventSpec } from './synthetic-rings.js';

const DEG = Math.PI / 180;

// An invented ring: pole (RA 41°, Dec +27°), radius 390 km, seen in three events some decades apart so that
// the star direction differs by tens of degrees (the body moves along the ecliptic).
const TRUE_POLE = { raDeg: 41, decDeg: 27 };
const RADIUS_KM = 390;

const EVENTS: SyntheticEventSpec[] = [
  {
    title: 'event A',
    starRaDeg: 250,
    starDecDeg: -21,
    centerFKm: 12,
    centerGKm: -30,
    centerKnown: true,
    velocityFKmPerS: 22,
    velocityGKmPerS: -4,
    pathOffsetsKm: [-300, -170, -40, 90, 210, 330],
    sigmaSeconds: 0.2,
  },
  {
    title: 'event B',
    starRaDeg: 285,
    starDecDeg: -22,
    centerFKm: -5,
    centerGKm: 8,
    centerKnown: true,
    velocityFKmPerS: 18,
    velocityGKmPerS: 6,
    pathOffsetsKm: [-280, -120, 30, 150, 260],
    sigmaSeconds: 0.2,
  },
  {
    title: 'event C',
    starRaDeg: 320,
    starDecDeg: -15,
    centerFKm: 40,
    centerGKm: 15,
    centerKnown: false,
    velocityFKmPerS: 25,
    velocityGKmPerS: 1,
    pathOffsetsKm: [-250, -100, 60, 200],
    sigmaSeconds: 0.2,
  },
];

function angularSeparationDeg(
  a: { raDeg: number; decDeg: number },
  b: { raDeg: number; decDeg: number },
): number {
  const u = unitFromRaDec(a.raDeg * (Math.PI / 180), a.decDeg * (Math.PI / 180));
  const v = unitFromRaDec(b.raDeg * (Math.PI / 180), b.decDeg * (Math.PI / 180));
  const c = Math.min(1, u[0] * v[0] + u[1] * v[1] + u[2] * v[2]);
  return (Math.acos(c) * 180) / Math.PI;
}

/** The axis through a pole: the same line whichever end is named. */
function axisSeparationDeg(
  a: { raDeg: number; decDeg: number },
  b: { raDeg: number; decDeg: number },
): number {
  const d = angularSeparationDeg(a, b);
  return Math.min(d, 180 - d);
}

describe('fitJointPole()', () => {
  it('fitJointPole() recovers the pole and radius of noise-free crossings in three events', () => {
    const events = EVENTS.map((spec) =>
      syntheticRingEvent(spec, TRUE_POLE.raDeg, TRUE_POLE.decDeg, RADIUS_KM),
    );
    expect(events.map((e) => e.crossings.length)).toEqual([12, 10, 8]);
    const fit = fitJointPole(events);
    expect(axisSeparationDeg(fit.pole, TRUE_POLE)).toBeLessThan(1e-5);
    expectClose(fit.radiusKm, RADIUS_KM, 1e-5);
    expect(fit.chi2).toBeLessThan(1e-12);
    expect(fit.dof).toBe(30 - 5);
    expectClose(fit.events[2]?.center.fKm ?? NaN, 40, 1e-5);
    expectClose(fit.events[2]?.center.gKm ?? NaN, 15, 1e-5);
    expect(fit.ambiguityResolved).toBe(true);
    expect(fit.alternative.chi2).toBeGreaterThan(1e3);
  });

  it('fitJointPole() reports the end of the pole whose position angle in the first event lies in [0, 180)', () => {
    const events = EVENTS.map((spec) =>
      syntheticRingEvent(spec, TRUE_POLE.raDeg, TRUE_POLE.decDeg, RADIUS_KM),
    );
    const fit = fitJointPole(events);
    const first = fit.events[0];
    expect(first?.positionAngleDeg).toBeGreaterThanOrEqual(0);
    expect(first?.positionAngleDeg).toBeLessThan(180);
    // Aspect of the true axis in event A from the pinned convention, computed here on its own:
    // sin B = −p·s, tan P = (p·e_f)/(p·e_g), for the end with P in [0°, 180°).
    const { s, eF, eG } = triadTowards(250, -21);
    let p = [
      Math.cos(27 * DEG) * Math.cos(41 * DEG),
      Math.cos(27 * DEG) * Math.sin(41 * DEG),
      Math.sin(27 * DEG),
    ];
    const dot = (a: number[], b: number[]) => a.reduce((sum, ai, i) => sum + ai * (b[i] as number), 0);
    if (dot(p, eF) < 0) p = p.map((x) => -x);
    expectClose(first?.openingAngleDeg ?? NaN, Math.asin(-dot(p, s)) / DEG, 1e-5);
    expectClose(first?.positionAngleDeg ?? NaN, Math.atan2(dot(p, eF), dot(p, eG)) / DEG, 1e-5);
  });

  it('fitJointPole() with timing noise finds the pole within 3σ and keeps the ambiguity resolved', () => {
    const noise = gaussian(mulberry32(20280314));
    const events = EVENTS.map((spec) =>
      syntheticRingEvent(spec, TRUE_POLE.raDeg, TRUE_POLE.decDeg, RADIUS_KM, noise),
    );
    const fit = fitJointPole(events);
    const dRa = Math.abs(fit.pole.raDeg - TRUE_POLE.raDeg);
    const dDec = Math.abs(fit.pole.decDeg - TRUE_POLE.decDeg);
    // The reported end may be the antipode of the one named in TRUE_POLE; compare with the matching end.
    const antipode = { raDeg: (TRUE_POLE.raDeg + 180) % 360, decDeg: -TRUE_POLE.decDeg };
    const near = angularSeparationDeg(fit.pole, TRUE_POLE) < 90 ? TRUE_POLE : antipode;
    expect(Math.abs(fit.pole.raDeg - near.raDeg)).toBeLessThan(3 * fit.uncertainty.raDeg + 1e-9);
    expect(Math.abs(fit.pole.decDeg - near.decDeg)).toBeLessThan(3 * fit.uncertainty.decDeg + 1e-9);
    expect(Math.abs(fit.radiusKm - RADIUS_KM)).toBeLessThan(3 * fit.radiusSigmaKm);
    expect(fit.uncertainty.raDeg).toBeGreaterThan(0);
    expect(fit.uncertainty.decDeg).toBeGreaterThan(0);
    expect(Number.isFinite(dRa + dDec)).toBe(true);
    // χ² of 30 − 5 degrees of freedom: a fit this far below or above would mean mis-weighted residuals.
    expect(fit.chi2).toBeGreaterThan(8);
    expect(fit.chi2).toBeLessThan(55);
    expect(fit.ambiguityResolved).toBe(true);
  });

  it('fitJointPole() of a single event cannot resolve the mirror ambiguity', () => {
    const event = syntheticRingEvent(
      EVENTS[0] as SyntheticEventSpec,
      TRUE_POLE.raDeg,
      TRUE_POLE.decDeg,
      RADIUS_KM,
    );
    const fit = fitJointPole([event]);
    expect(fit.ambiguityResolved).toBe(false);
    expect(fit.chi2).toBeLessThan(1e-12);
    expect(fit.alternative.chi2).toBeLessThan(1e-12);
    const truthAxis = Math.min(
      axisSeparationDeg(fit.pole, TRUE_POLE),
      axisSeparationDeg(fit.alternative.pole, TRUE_POLE),
    );
    expect(truthAxis).toBeLessThan(1e-5);
    // The two survivors are mirror images in the sky plane: same |B| and P, opposite B.
    const a = poleAspect(
      unitFromRaDec(fit.pole.raDeg * (Math.PI / 180), fit.pole.decDeg * (Math.PI / 180)),
      event.triad,
    );
    const b = poleAspect(
      unitFromRaDec(
        fit.alternative.pole.raDeg * (Math.PI / 180),
        fit.alternative.pole.decDeg * (Math.PI / 180),
      ),
      event.triad,
    );
    expectClose(a.openingRad, -b.openingRad, 1e-7);
    expectClose(a.positionRad, b.positionRad, 1e-7);
    // With the tie, the reported pole is the B > 0 one, as poles[0] of the single-event solution.
    expect(fit.events[0]?.openingAngleDeg).toBeGreaterThan(0);
  });

  it('fitJointPole() refuses an event without crossings of the ring, naming it', () => {
    const events = EVENTS.map((spec) =>
      syntheticRingEvent(spec, TRUE_POLE.raDeg, TRUE_POLE.decDeg, RADIUS_KM),
    );
    const empty = { ...events[1]!, crossings: [], errorPath: 'second.json' };
    expect(() => fitJointPole([events[0]!, empty])).toThrow(GeometryInputError);
    expect(() => fitJointPole([events[0]!, empty])).toThrow('second.json: no crossings of this ring');
  });

  it('fitJointPole() refuses fewer crossings than free parameters', () => {
    const event = syntheticRingEvent(
      EVENTS[2] as SyntheticEventSpec,
      TRUE_POLE.raDeg,
      TRUE_POLE.decDeg,
      RADIUS_KM,
    );
    const few = { ...event, crossings: event.crossings.slice(0, 4) };
    expect(() => fitJointPole([few])).toThrow(
      /fewer points than free parameters: 4 ring crossings for 5 parameters/,
    );
  });
});
