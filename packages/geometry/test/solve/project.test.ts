import { describe, expect, it } from 'vitest';
import { projectEvent } from '../../src/project.js';
import type { ChordInput, EventInput } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { AstroTime, BaryState, Body } from 'astronomy-engine';
import {
  STATIONS,
  TT_MINUS_UTC,
  basisOf,
  dot3,
  expectedFG,
  isoUtc,
  scenario,
  type Scenario,
  type V3,
} from './fixtures.js';

/** Milliarcseconds in a radian: 180/π × 3600 × 1000. */
const MAS_PER_RAD_TEST = (180 / Math.PI) * 3_600_000;

const CENTRAL = '2028-03-14T02:10:00.000Z';

function positive(station: string, centralMs: number, fromS: number, toS: number, offset = 0): ChordInput {
  return {
    station,
    type: 'positive',
    disappearance: { time: isoUtc(centralMs + fromS * 1000), sigmaSeconds: 0.05 },
    reappearance: { time: isoUtc(centralMs + toS * 1000), sigmaSeconds: 0.08 },
    timeOffsetSeconds: offset,
  };
}

function withChords(sc: Scenario, chords: ChordInput[], extra: Partial<EventInput> = {}): EventInput {
  return { ...sc.event, chords, ...extra };
}

describe('projectEvent()', () => {
  const sc = scenario(STATIONS, CENTRAL);
  const [a, b] = STATIONS as [(typeof STATIONS)[0], (typeof STATIONS)[0]];

  it('projectEvent() puts the station that sees the body centre at (0, 0) at that instant', () => {
    // Round trip: the body was placed on the station–star line at the central instant (fixtures.ts).
    const p = projectEvent(withChords(sc, [positive(a.id, sc.centralMs, -1, 1)]));
    const mid = {
      fKm: ((p.limbPoints[0]?.fKm ?? NaN) + (p.limbPoints[1]?.fKm ?? NaN)) / 2,
      gKm: ((p.limbPoints[0]?.gKm ?? NaN) + (p.limbPoints[1]?.gKm ?? NaN)) / 2,
    };
    // Station vectors agree with astronomy-engine to ≤ 5 m (test/astro/earth-rotation.test.ts); the chord's
    // curvature over ±1 s is < 1 mm.
    expectClose(mid.fKm, 0, 0.005);
    expectClose(mid.gKm, 0, 0.005);
    expect(p.referenceTimeUtc).toBe(CENTRAL);
  });

  it('projectEvent() gives the independently computed (f, g) for every endpoint within 5 m', () => {
    const chords = [positive(a.id, sc.centralMs, -20, 15), positive(b.id, sc.centralMs, -12, 30)];
    const p = projectEvent(withChords(sc, chords));
    const checks: Array<[string, number]> = [
      [a.id, -20],
      [a.id, 15],
      [b.id, -12],
      [b.id, 30],
    ];
    checks.forEach(([id, seconds], k) => {
      const station = STATIONS.find((s) => s.id === id)!;
      const expected = expectedFG(sc, station, sc.centralMs + seconds * 1000);
      expectClose(p.limbPoints[k]!.fKm, expected.fKm, 0.005);
      expectClose(p.limbPoints[k]!.gKm, expected.gKm, 0.005);
    });
    expect(p.limbPoints.map((q) => q.event)).toEqual([
      'disappearance',
      'reappearance',
      'disappearance',
      'reappearance',
    ]);
    // Reference time = mean of the mid-times (−2.5 s and +9 s) = +3.25 s.
    expect(p.referenceTimeUtc).toBe(isoUtc(sc.centralMs + 3250));
    expectClose(p.distanceKm, Math.hypot(...sc.body(sc.centralMs + 3250)), 1e-3);
  });

  it('projectEvent() velocity is the finite difference of sky positions at the mid-time, and sigmaKm = σt·speed', () => {
    const p = projectEvent(withChords(sc, [positive(b.id, sc.centralMs, -12, 30)]));
    const midMs = sc.centralMs + 9000;
    const ahead = expectedFG(sc, b, midMs + 500);
    const behind = expectedFG(sc, b, midMs - 500);
    const v = p.chords[0]!.velocityKmPerS;
    // ≈ (−22, 3) km/s of body motion plus the station's ≈ 0.4 km/s rotation; central difference error ~1e-7 km/s.
    expectClose(v.f, ahead.fKm - behind.fKm, 2e-5);
    expectClose(v.g, ahead.gKm - behind.gKm, 2e-5);
    const speed = Math.hypot(v.f, v.g);
    expectClose(p.chords[0]!.points[0]!.sigmaKm, 0.05 * speed, 1e-12);
    expectClose(p.chords[0]!.points[1]!.sigmaKm, 0.08 * speed, 1e-12);
    expect(p.limbPoints[0]!.velocity).toEqual(v);
  });

  it('projectEvent() adds timeOffsetSeconds and fitted offsets to the reported times', () => {
    const shifted = projectEvent(withChords(sc, [positive(a.id, sc.centralMs, -20, 15, 0.75)]));
    const moved = projectEvent(withChords(sc, [positive(a.id, sc.centralMs, -19.25, 15.75)]));
    const fitted = projectEvent(withChords(sc, [positive(a.id, sc.centralMs, -20, 15, 0.5)]), {
      timeOffsetsSeconds: { [a.id]: 0.25 },
    });
    for (const k of [0, 1]) {
      expectClose(shifted.limbPoints[k]!.fKm, moved.limbPoints[k]!.fKm, 1e-6);
      expectClose(shifted.limbPoints[k]!.gKm, moved.limbPoints[k]!.gKm, 1e-6);
      expectClose(fitted.limbPoints[k]!.fKm, moved.limbPoints[k]!.fKm, 1e-6);
    }
    // 0.75 s at ≈ 22 km/s moves the points by ≈ 16.5 km.
    const unshifted = projectEvent(withChords(sc, [positive(a.id, sc.centralMs, -20, 15)]));
    expectClose(Math.abs(shifted.limbPoints[0]!.fKm - unshifted.limbPoints[0]!.fKm), 0.75 * 21.6, 0.75);
  });

  it('projectEvent() samples a negative chord from its start to its end, every quarter of the longest chord, at most 5 s', () => {
    const negative: ChordInput = {
      station: b.id,
      type: 'negative',
      start: isoUtc(sc.centralMs - 60_000),
      end: isoUtc(sc.centralMs + 60_000),
      timeOffsetSeconds: 0,
    };
    const p = projectEvent(withChords(sc, [positive(a.id, sc.centralMs, -20, 20), negative]));
    const path = p.negatives[0]!.pathKm;
    expect(p.chords[1]!.path).toBe(path);
    expect(p.chords[1]!.points).toEqual([]);
    const first = expectedFG(sc, b, sc.centralMs - 60_000);
    const last = expectedFG(sc, b, sc.centralMs + 60_000);
    expectClose(path[0]!.fKm, first.fKm, 0.005);
    expectClose(path[path.length - 1]!.gKm, last.gKm, 0.005);
    // 40 s longest chord → 10 s, capped at 5 s → 24 intervals over 120 s.
    expect(path.length).toBe(25);
    const short = projectEvent(withChords(sc, [positive(a.id, sc.centralMs, -4, 4), negative]));
    // 8 s longest chord → 2 s step → 60 intervals.
    expect(short.negatives[0]!.pathKm.length).toBe(61);
  });

  it('projectEvent() puts a ring dip at its mid-time with σt = ½√(σs² + σe²)', () => {
    const event = withChords(sc, [], {
      ringEvents: [
        {
          station: a.id,
          ring: 'inner',
          start: { time: isoUtc(sc.centralMs - 400), sigmaSeconds: 0.03 },
          end: { time: isoUtc(sc.centralMs + 400), sigmaSeconds: 0.04 },
        },
      ],
    });
    const p = projectEvent(event);
    const point = p.ringPoints.get('inner')![0]!;
    expectClose(point.fKm, 0, 0.005);
    expectClose(point.gKm, 0, 0.005);
    expectClose(point.sigmaSeconds, 0.025, 1e-15);
    const dip = p.ringDips.get('inner')![0]!;
    const start = expectedFG(sc, a, sc.centralMs - 400);
    expectClose(dip.start.fKm, start.fKm, 0.005);
    // No positive chord: the reference time is the mean of the dips' mid-times.
    expect(p.referenceTimeUtc).toBe(CENTRAL);
  });

  it('projectEvent() moves chords by D·Δθ when the star has a parallax (≈ 30 km per mas at 41 au)', () => {
    const chords = [positive(a.id, sc.centralMs, -20, 15)];
    const plain = projectEvent(withChords(sc, chords));
    const star = { ...sc.event.star, parallaxMas: 1 };
    const withParallax = projectEvent(withChords(sc, chords, { star }));
    const df = withParallax.limbPoints[0]!.fKm - plain.limbPoints[0]!.fKm;
    const dg = withParallax.limbPoints[0]!.gKm - plain.limbPoints[0]!.gKm;
    // A parallax ϖ turns the star's direction by Δs = −ϖ·b⊥ (b the Earth's barycentric position in au, ⊥
    // to s; the classical parallax displacement, Explanatory Supplement, from memory), which turns the sky
    // plane and moves a point at the body's distance D by D·(Δs·e_f, Δs·e_g). b from astronomy-engine's
    // BaryState at the reference time (the chord's mid-time), basis from the catalogue RA/Dec.
    const midMs = sc.centralMs - 2500;
    const ttDays = (midMs + TT_MINUS_UTC * 1000 - Date.UTC(2000, 0, 1, 12)) / 86_400_000;
    const earth = BaryState(Body.Earth, AstroTime.FromTerrestrialTime(ttDays));
    const { eF, eG } = basisOf(sc.event.star.raDeg, sc.event.star.decDeg);
    const b: V3 = [earth.x, earth.y, earth.z];
    const radians = 1 / MAS_PER_RAD_TEST;
    const distanceKm = plain.distanceKm;
    // Second-order terms (Δs² and the station's offset from the line of sight) are below a millimetre.
    expectClose(df, -distanceKm * radians * dot3(b, eF), 0.001);
    expectClose(dg, -distanceKm * radians * dot3(b, eG), 0.001);
  });

  it('projectEvent() gives a single-edge chord one point, its velocity at that edge, its time as mid-time', () => {
    // Only the reappearance, 30 s after the central instant: (f, g) from the independent fixture, the
    // velocity the finite difference at the edge itself (not at a mid-time, which it does not have).
    const only: ChordInput = {
      station: b.id,
      type: 'positive',
      reappearance: { time: isoUtc(sc.centralMs + 30_000), sigmaSeconds: 0.2 },
      timeOffsetSeconds: 0,
    };
    const p = projectEvent(withChords(sc, [only]));
    expect(p.limbPoints).toHaveLength(1);
    expect(p.chords[0]!.points.map((q) => q.event)).toEqual(['reappearance']);
    const expected = expectedFG(sc, b, sc.centralMs + 30_000);
    expectClose(p.limbPoints[0]!.fKm, expected.fKm, 0.005);
    expectClose(p.limbPoints[0]!.gKm, expected.gKm, 0.005);
    const ahead = expectedFG(sc, b, sc.centralMs + 30_500);
    const behind = expectedFG(sc, b, sc.centralMs + 29_500);
    const v = p.chords[0]!.velocityKmPerS;
    expectClose(v.f, ahead.fKm - behind.fKm, 2e-5);
    expectClose(v.g, ahead.gKm - behind.gKm, 2e-5);
    expect(p.limbPoints[0]!.velocity).toEqual(v);
    expectClose(p.chords[0]!.points[0]!.sigmaKm, 0.2 * Math.hypot(v.f, v.g), 1e-12);
    // Its own time stands in for the mid-time: with a two-edge chord of mid-time −2.5 s the reference
    // time is the mean of −2.5 s and +30 s.
    expect(p.referenceTimeUtc).toBe(isoUtc(sc.centralMs + 30_000));
    const both = projectEvent(withChords(sc, [positive(a.id, sc.centralMs, -20, 15), only]));
    expect(both.referenceTimeUtc).toBe(isoUtc(sc.centralMs + 13_750));
    expect(both.limbPoints.map((q) => `${q.station} ${q.event}`)).toEqual([
      `${a.id} disappearance`,
      `${a.id} reappearance`,
      `${b.id} reappearance`,
    ]);
  });

  it("projectEvent() takes the negative chords' step from chords with both edges only", () => {
    const negative: ChordInput = {
      station: b.id,
      type: 'negative',
      start: isoUtc(sc.centralMs - 60_000),
      end: isoUtc(sc.centralMs + 60_000),
      timeOffsetSeconds: 0,
    };
    const lone: ChordInput = {
      station: a.id,
      type: 'positive',
      disappearance: { time: isoUtc(sc.centralMs), sigmaSeconds: 0.1 },
      timeOffsetSeconds: 0,
    };
    // No chord with a duration: the step is the 5 s cap, 24 intervals over 120 s.
    expect(projectEvent(withChords(sc, [lone, negative])).negatives[0]!.pathKm.length).toBe(25);
    // A 8 s chord beside it: 2 s, 60 intervals, as without the single edge.
    const withFull = projectEvent(withChords(sc, [lone, positive(a.id, sc.centralMs, -4, 4), negative]));
    expect(withFull.negatives[0]!.pathKm.length).toBe(61);
  });

  it('projectEvent() reports bad input at its JSON path', () => {
    expect(() =>
      projectEvent(withChords(sc, [{ station: a.id, type: 'positive', timeOffsetSeconds: 0 }])),
    ).toThrow('chords[0]: a positive chord needs a disappearance, a reappearance or both');
    const outside = positive(a.id, sc.centralMs, -20, 21 * 60);
    expect(() => projectEvent(withChords(sc, [positive(a.id, sc.centralMs, -1, 1), outside]))).toThrow(
      /^chords\[1\]\.reappearance\.time: outside the ephemeris span 2028-03-14T01:51:09\.184 – 02:31:09\.184 TT$/,
    );
    expect(() => projectEvent(withChords(sc, [positive('nowhere', sc.centralMs, -1, 1)]))).toThrow(
      'chords[0].station: unknown station "nowhere"',
    );
    expect(() => projectEvent(withChords(sc, [positive(a.id, sc.centralMs, 1, -1)]))).toThrow(
      'chords[0].reappearance.time: reappearance is not after disappearance',
    );
    expect(() =>
      projectEvent({
        ...sc.event,
        ephemeris: { timeScale: 'TT', rows: sc.event.ephemeris.rows.slice(0, 3) },
      }),
    ).toThrow('ephemeris.rows: at least 4 rows are needed, got 3');
  });
});
