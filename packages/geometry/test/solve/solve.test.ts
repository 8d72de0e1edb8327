import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ringPoleVector } from '../../src/astro/ring-pole.js';
import { skyPlaneBasis } from '../../src/astro/star.js';
import { fromRaDec } from '../../src/astro/vec3.js';
import { DEG, MAS_PER_RAD } from '../../src/math.js';
import { solveEvent } from '../../src/solve.js';
import { ENGINE_VERSION } from '../../src/version.js';
import { expectClose } from '../expect-close.js';
import { CENTRAL, HASH, RING, TRUE_CENTER, TRUE_RADIUS_KM, limbEvent, ringDips } from './events.js';
import { LIMB_STATIONS, scenario } from './fixtures.js';

describe('solveEvent()', () => {
  it('ENGINE_VERSION equals packages/geometry/package.json version', () => {
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as {
      version: string;
    };
    expect(ENGINE_VERSION).toBe(pkg.version);
  });

  it('solveEvent() recovers a circular limb and its astrometric offset from exact chords', () => {
    const { event, distanceKm } = limbEvent();
    const positives = event.chords.filter((c) => c.type === 'positive').length;
    expect(positives).toBe(7);
    expect(event.chords[7]?.type).toBe('negative');
    const solution = solveEvent(event, { inputSha256: HASH });
    const limb = solution.limb!;
    // Chord endpoints were placed on the circle to 1 µs (≈ 0.02 m); the projection agrees with the
    // generator to ≤ 5 m (test/solve/project.test.ts), so the fit must land within ~10 m.
    expectClose(limb.centerFKm, TRUE_CENTER.fKm, 0.02);
    expectClose(limb.centerGKm, TRUE_CENTER.gKm, 0.02);
    expectClose(limb.equatorialRadiusKm * Math.sqrt(1 - limb.oblateness), TRUE_RADIUS_KM, 0.02);
    expectClose(limb.oblateness, 0, 1e-3);
    // Astrometry: the centre over the distance at the reference time (≈ 41.2 au), in mas.
    const astro = solution.astrometry!;
    expectClose(astro.raOffsetCosDecMas, (TRUE_CENTER.fKm / distanceKm) * MAS_PER_RAD, 0.01);
    expectClose(astro.decOffsetMas, (TRUE_CENTER.gKm / distanceKm) * MAS_PER_RAD, 0.01);
    expect(astro.uncertainty.raOffsetCosDecMas).toBeGreaterThan(0);
    expect(solution.engine).toEqual({ version: ENGINE_VERSION, inputSha256: HASH, seed: 1 });
    // Solution chords in event order; points disappearance then reappearance; negatives carry a path.
    expect(solution.chords.map((c) => c.station)).toEqual(event.chords.map((c) => c.station));
    for (const c of solution.chords) {
      if (c.type === 'positive')
        expect(c.points.map((p) => p.event)).toEqual(['disappearance', 'reappearance']);
      else expect(c.path.length).toBeGreaterThan(10);
    }
    expect(limb.negativeChordsClear).toBe(true);
    expect(solution.rings).toEqual([]);
  });

  it('solveEvent() is deterministic for the same input and seed', () => {
    const { event } = limbEvent();
    const a = solveEvent({ ...event, fit: { ...event.fit, seed: 7 } }, { inputSha256: HASH });
    const b = solveEvent({ ...event, fit: { ...event.fit, seed: 7 } }, { inputSha256: HASH });
    expect(JSON.stringify(a)).toBe(JSON.stringify(b));
    expect(a.engine.seed).toBe(7);
  });

  it('solveEvent() fits a clock offset and re-projects that station with the corrected times', () => {
    const { event } = limbEvent({ 'marrow-hill': 0.4 });
    const fitted = solveEvent(
      { ...event, fit: { ...event.fit, limb: { ...event.fit.limb, fitTimeOffsets: ['marrow-hill'] } } },
      { inputSha256: HASH },
    );
    const offset = fitted.limb!.timeOffsets[0]!;
    expect(offset.station).toBe('marrow-hill');
    expectClose(offset.seconds, 0.4, 2e-3);
    // With the fitted offset applied, the solution's points for that station equal those of the clean event.
    const clean = solveEvent(limbEvent().event, { inputSha256: HASH });
    const k = event.chords.findIndex((c) => c.station === 'marrow-hill');
    for (const j of [0, 1]) {
      // 2 ms of offset error at ≈ 22 km/s → ≤ 44 m.
      expectClose(fitted.chords[k]!.points[j]!.fKm, clean.chords[k]!.points[j]!.fKm, 0.05);
      expectClose(fitted.chords[k]!.points[j]!.gKm, clean.chords[k]!.points[j]!.gKm, 0.05);
    }
    expectClose(fitted.limb!.centerFKm, TRUE_CENTER.fKm, 0.1);
    expect(fitted.astrometry!.referenceTimeUtc).toBe(clean.astrometry!.referenceTimeUtc);
  });

  it('solveEvent() solves a ring-only event with a free centre, both poles and radial widths', () => {
    const sc = scenario(LIMB_STATIONS, CENTRAL);
    const ring = RING;
    const ringEvents = ringDips(sc, ring);
    const solution = solveEvent({ ...sc.event, ringEvents }, { inputSha256: HASH });
    expect(solution.limb).toBeNull();
    const r = solution.rings[0]!;
    // The dips' mid-times are not exactly on the mid-radius circle (the two edges are not equally
    // foreshortened), ≲ 0.1 km here; the radius and angles must match to that level.
    expectClose(r.radiusKm, ring.radiusKm, 0.5);
    expectClose(r.openingAngleDeg, ring.bDeg, 0.05);
    expectClose(r.positionAngleDeg, ring.pDeg, 0.05);
    expectClose(r.centerFKm, ring.fKm, 0.5);
    expectClose(r.centerGKm, ring.gKm, 0.5);
    for (const c of r.crossings) expectClose(c.radialWidthKm, ring.widthKm, 0.5);
    expect(r.crossings).toHaveLength(ringEvents.length);
    // Pole for B = +28°, P = 35° from the star's direction (no parallax, no proper motion here).
    const basis = skyPlaneBasis(fromRaDec(sc.event.star.raDeg * DEG, sc.event.star.decDeg * DEG));
    const expected = ringPoleVector(basis, ring.bDeg * DEG, ring.pDeg * DEG);
    const got = fromRaDec(r.poles[0].raDeg * DEG, r.poles[0].decDeg * DEG);
    for (let k = 0; k < 3; k++) expectClose(got[k]!, expected[k]!, 2e-3);
    // Astrometry from the ring's centre at the mean of its dips' mid-times.
    const astro = solution.astrometry!;
    expectClose(astro.raOffsetCosDecMas, (r.centerFKm / sc.distanceKm) * MAS_PER_RAD, 1e-3);
    expect(solution.rings).toHaveLength(1);
  });

  it('solveEvent() fixes the ring centre at the limb centre with centerFrom "limb" and frees it with "free"', () => {
    const { event } = limbEvent();
    const sc = scenario(LIMB_STATIONS, CENTRAL);
    // The ring is concentric with the limb here, so both settings must find the limb's centre.
    const ringEvents = ringDips(sc, { ...RING, fKm: TRUE_CENTER.fKm, gKm: TRUE_CENTER.gKm });
    const fixed = solveEvent({ ...event, ringEvents }, { inputSha256: HASH });
    expect(fixed.rings[0]!.centerFKm).toBe(fixed.limb!.centerFKm);
    expect(fixed.rings[0]!.centerGKm).toBe(fixed.limb!.centerGKm);
    const free = solveEvent(
      { ...event, ringEvents, fit: { ...event.fit, ring: { centerFrom: 'free' } } },
      { inputSha256: HASH },
    );
    expect(free.rings[0]!.centerFKm).not.toBe(free.limb!.centerFKm);
    expectClose(free.rings[0]!.centerFKm, TRUE_CENTER.fKm, 0.5);
    expectClose(free.rings[0]!.radiusKm, RING.radiusKm, 0.5);
    // With a limb, astrometry comes from the limb, not the ring.
    expect(free.astrometry!.raOffsetCosDecMas).toBe(fixed.astrometry!.raOffsetCosDecMas);
  });

  it('solveEvent() returns no limb, rings or astrometry for an event with only negative chords', () => {
    const { event } = limbEvent();
    const negatives = event.chords.filter((c) => c.type === 'negative');
    const solution = solveEvent({ ...event, chords: negatives }, { inputSha256: HASH });
    expect(negatives).toHaveLength(1);
    expect(solution.limb).toBeNull();
    expect(solution.astrometry).toBeNull();
    expect(solution.chords).toHaveLength(1);
    expect(solution.chords[0]!.path.length).toBeGreaterThan(10);
  });
});
