import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { ringPoleVector } from '../../src/astro/ring-pole.js';
import { skyPlaneBasis } from '../../src/astro/star.js';
import { fromRaDec } from '../../src/astro/vec3.js';
import { DEG, MAS_PER_RAD } from '../../src/math.js';
import { solveEvent } from '../../src/solve.js';
import type { ChordInput, EventInput, RingEventInput } from '../../src/types.js';
import { ENGINE_VERSION } from '../../src/version.js';
import { expectClose } from '../expect-close.js';
import { LIMB_STATIONS, crossings, isoUtc, scenario, type Scenario } from './fixtures.js';

const CENTRAL = '2028-03-14T02:10:00.000Z';
const HASH = 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855';

/** True limb: a circle of 320 km centred 42 km east and 17 km south of the ephemeris position. */
const TRUE_CENTER = { fKm: 42, gKm: -17 };
const TRUE_RADIUS_KM = 320;

function limbEvent(offsets: Record<string, number> = {}): { event: EventInput; distanceKm: number } {
  const sc = scenario(LIMB_STATIONS, CENTRAL);
  const chords: ChordInput[] = LIMB_STATIONS.map((station) => {
    const times = crossings(
      sc,
      station,
      sc.centralMs - 60_000,
      sc.centralMs + 60_000,
      (p) => Math.hypot(p.fKm - TRUE_CENTER.fKm, p.gKm - TRUE_CENTER.gKm) - TRUE_RADIUS_KM,
    );
    // A station's clock that runs late by δ reports every time δ too late: reported = true − offset.
    const shift = (ms: number): string => isoUtc(ms - (offsets[station.id] ?? 0) * 1000);
    if (times.length === 2)
      return {
        station: station.id,
        type: 'positive',
        disappearance: { time: shift(times[0]!), sigmaSeconds: 0.02 },
        reappearance: { time: shift(times[1]!), sigmaSeconds: 0.02 },
        timeOffsetSeconds: 0,
      };
    return {
      station: station.id,
      type: 'negative',
      start: isoUtc(sc.centralMs - 60_000),
      end: isoUtc(sc.centralMs + 60_000),
      timeOffsetSeconds: 0,
    };
  });
  return { event: { ...sc.event, chords }, distanceKm: sc.distanceKm };
}

/** Invented ring: R = 1500 km, width 12 km, B = 28°, pole P = 35°, centred 30 km west and 12 km north. */
const RING = { fKm: -30, gKm: 12, radiusKm: 1500, widthKm: 12, bDeg: 28, pDeg: 35 };

/** Dips of a ring on the first five stations' independently computed tracks: edge crossings to 1 µs. */
function ringDips(sc: Scenario, ring: typeof RING): RingEventInput[] {
  const radius = (p: { fKm: number; gKm: number }): number => {
    const df = p.fKm - ring.fKm;
    const dg = p.gKm - ring.gKm;
    const pRad = ring.pDeg * DEG;
    const u = df * Math.cos(pRad) - dg * Math.sin(pRad);
    const w = (df * Math.sin(pRad) + dg * Math.cos(pRad)) / Math.sin(ring.bDeg * DEG);
    return Math.hypot(u, w);
  };
  const ringEvents: RingEventInput[] = [];
  for (const station of LIMB_STATIONS.slice(0, 5)) {
    const from = sc.centralMs - 150_000;
    const to = sc.centralMs + 150_000;
    const outer = crossings(sc, station, from, to, (p) => radius(p) - (ring.radiusKm + ring.widthKm / 2));
    const inner = crossings(sc, station, from, to, (p) => radius(p) - (ring.radiusKm - ring.widthKm / 2));
    if (outer.length !== 2 || inner.length !== 2)
      throw new Error(`${station.id} does not cross the ring twice`);
    // Ingress dip: outer edge then inner edge; egress dip: inner then outer.
    for (const [start, end] of [
      [outer[0]!, inner[0]!],
      [inner[1]!, outer[1]!],
    ] as const) {
      ringEvents.push({
        station: station.id,
        ring: 'alpha',
        start: { time: isoUtc(start), sigmaSeconds: 0.01 },
        end: { time: isoUtc(end), sigmaSeconds: 0.01 },
      });
    }
  }
  return ringEvents;
}

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
