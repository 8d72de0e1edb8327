import {
  AstroTime,
  Body,
  Equator,
  EquatorFromVector,
  Horizon,
  Observer,
  RotateVector,
  Rotation_EQJ_EQD,
  Vector,
} from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { EarthOrientation, geodeticToEarthFixedKm } from '../../src/astro/station.js';
import { predictEvent } from '../../src/predict/predict-event.js';
import type { PathPoint, PredictionSettings } from '../../src/predict/types.js';
import { utcIsoToTtSeconds } from '../../src/time/scales.js';
import { GeometryInputError, type EventInput, type StationInput } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { dot3, type V3 } from '../solve/fixtures.js';
import {
  AU_KM,
  fixedStar,
  groundDistanceKm,
  predictScenario,
  settings,
  type PredictScenario,
} from './fixtures.js';

const J2000_MS = Date.UTC(2000, 0, 1, 12);
const MAS_PER_RAD = (180 / Math.PI) * 3_600_000;

/** UT1 as astronomy-engine takes it (its `ut` is UT1), at a UTC ms instant. */
function ut1Time(ms: number, dut1Seconds: number): AstroTime {
  return new AstroTime((ms - J2000_MS) / 86_400_000 + dut1Seconds / 86_400);
}

/** Geometric altitude of a J2000 direction from astronomy-engine: precess to date, then Horizon (no refraction). */
function aeAltitudeDeg(
  direction: V3,
  site: { latDeg: number; lonDeg: number },
  ms: number,
  dut1: number,
): number {
  const time = ut1Time(ms, dut1);
  const ofDate = RotateVector(
    Rotation_EQJ_EQD(time),
    new Vector(direction[0], direction[1], direction[2], time),
  );
  const eq = EquatorFromVector(ofDate);
  return Horizon(time, new Observer(site.latDeg, site.lonDeg, 0), eq.ra, eq.dec).altitude;
}

/** The engine's own station chain (the solve's station vectors: TR8350.2 eq. 4-14 + EarthOrientation). */
function solveChainFg(
  sc: PredictScenario,
  site: { latDeg: number; lonDeg: number; heightM: number },
  ms: number,
) {
  const orientation = new EarthOrientation(sc.dut1Seconds);
  const tt = utcIsoToTtSeconds(new Date(ms).toISOString());
  const o = orientation.celestialState(
    geodeticToEarthFixedKm(site.latDeg, site.lonDeg, site.heightM),
    tt,
  ).positionKm;
  const bp = sc.bodyPrime(ms);
  const { eF, eG } = sc.basis(ms);
  const rel: V3 = [o[0] - bp[0], o[1] - bp[1], o[2] - bp[2]];
  return { fKm: dot3(rel, eF), gKm: dot3(rel, eG) };
}

function leftNormal(sc: PredictScenario, ms: number): { f: number; g: number } {
  const v = sc.shadowVelocity(ms);
  const speed = Math.hypot(v.f, v.g);
  return { f: -v.g / speed, g: v.f / speed };
}

/** Independent search along a station's track: golden section on |(f, g)| then bisection for |(f, g)| = r. */
function independentStation(sc: PredictScenario, site: StationInput, fromMs: number, toMs: number) {
  const dist = (ms: number) => {
    const p = sc.fg(site, ms);
    return Math.hypot(p.fKm, p.gKm);
  };
  let lo = fromMs;
  let hi = toMs;
  // Coarse scan at 20 s, then golden section on the best bracket.
  let best = lo;
  for (let ms = lo; ms <= hi; ms += 20_000) if (dist(ms) < dist(best)) best = ms;
  lo = Math.max(fromMs, best - 20_000);
  hi = Math.min(toMs, best + 20_000);
  const r = (3 - Math.sqrt(5)) / 2;
  while (hi - lo > 0.01) {
    const a = lo + r * (hi - lo);
    const b = hi - r * (hi - lo);
    if (dist(a) < dist(b)) hi = b;
    else lo = a;
  }
  const closestMs = (lo + hi) / 2;
  const crossing = (level: number, direction: 1 | -1): number => {
    let a = closestMs;
    let b = closestMs + direction * 1000;
    while (dist(b) < level) {
      a = b;
      b += direction * 1000;
    }
    while (Math.abs(b - a) > 0.001) {
      const m = (a + b) / 2;
      if (dist(m) < level) a = m;
      else b = m;
    }
    return (a + b) / 2;
  };
  return { closestMs, distanceKm: dist(closestMs), crossing };
}

const ms = (iso: string | null) => Date.parse(iso ?? 'NaN');

// 1. A distant slow body with a ring: the invented "Brennock" at 41.2 au, its shadow centre over
// (−24.6°, −70.4°) at 02:10 UTC; fixed star; TT rows every 20 min; DUT1 −0.21 s.
const DISTANT: PredictScenario = predictScenario({
  title: 'Brennock occults an invented star',
  star: fixedStar(201.37, -8.62),
  centre: { latDeg: -24.6, lonDeg: -70.4 },
  centralUtc: '2028-03-14T02:10:00.000Z',
  distanceKm: 41.2 * AU_KM,
  velocityKmPerS: [-22, 3, 5],
  dut1Seconds: -0.21,
  stations: [
    { id: 'quarry-top', latDeg: -24.6, lonDeg: -70.4, heightM: 0 },
    { id: 'dry-lake', latDeg: -23.0, lonDeg: -69.0, heightM: 1200 },
    { id: 'far-south', latDeg: -33.2, lonDeg: -70.9, heightM: 600 },
  ],
});
const DISTANT_SETTINGS: PredictionSettings = settings({
  bodyRadiusKm: 555,
  uncertaintyMas: { raCosDec: 8, dec: 12 },
  rings: [{ ring: 'R1', radiusKm: 4100 }],
});

// 2. A fast main-belt-like body far north: 1.9 au, ≈ 16 km/s, star at Dec +71.3° with proper motion and
// parallax, an astrometric offset, TDB rows every 5 min, DUT1 +0.37 s.
const NORTHERN: PredictScenario = predictScenario({
  title: 'Ostrel occults an invented northern star',
  star: {
    raDeg: 105.2,
    decDeg: 71.3,
    catalogEpochJyear: 2016,
    pmRaCosDecMasPerYear: -35.2,
    pmDecMasPerYear: 12.8,
    parallaxMas: 4.1,
  },
  centre: { latDeg: 64.1, lonDeg: 25.5 },
  centralUtc: '2029-01-18T21:30:00.000Z',
  distanceKm: 1.9 * AU_KM,
  velocityKmPerS: [14.5, -7.2, -3],
  offsetMas: { raCosDec: 25, dec: -40 },
  dut1Seconds: 0.37,
  timeScale: 'TDB',
  rowMinutes: [-30, -20, -10, -5, 0, 5, 10, 20, 30],
  stations: [
    { id: 'fjord-end', latDeg: 64.1, lonDeg: 25.5, heightM: 0 },
    { id: 'birch-hill', latDeg: 64.02, lonDeg: 25.9, heightM: 180 },
    { id: 'tundra-hut', latDeg: 66.4, lonDeg: 27.1, heightM: 300 },
  ],
});
const NORTHERN_SETTINGS: PredictionSettings = settings({
  bodyRadiusKm: 48,
  uncertaintyMas: { raCosDec: 15, dec: 9 },
  offsetMas: { raCosDec: 25, dec: -40 },
  stepSeconds: 5,
});

// 3. A path across longitude ±180: 5.2 au, star with proper motion and parallax, an offset, DUT1 −0.48 s.
const DATELINE: PredictScenario = predictScenario({
  title: 'Wendry occults an invented star near the date line',
  star: {
    raDeg: 294.0,
    decDeg: -21.0,
    catalogEpochJyear: 2016,
    pmRaCosDecMasPerYear: 8,
    pmDecMasPerYear: -15,
    parallaxMas: 2.3,
  },
  centre: { latDeg: -17.5, lonDeg: 179.6 },
  centralUtc: '2030-08-02T11:00:00.000Z',
  distanceKm: 5.2 * AU_KM,
  velocityKmPerS: [-18, 4, 2],
  offsetMas: { raCosDec: -12, dec: 30 },
  dut1Seconds: -0.48,
  rowMinutes: [-40, -20, 0, 20, 40],
  stations: [{ id: 'reef-point', latDeg: -17.6, lonDeg: -179.8, heightM: 20 }],
});
const DATELINE_SETTINGS: PredictionSettings = settings({
  bodyRadiusKm: 120,
  offsetMas: { raCosDec: -12, dec: 30 },
  stepSeconds: 2,
  from: '2030-08-02T10:58:00Z',
  to: '2030-08-02T11:02:00Z',
});

const distant = predictEvent(DISTANT.event, DISTANT_SETTINGS);
const northern = predictEvent(NORTHERN.event, NORTHERN_SETTINGS);
const dateline = predictEvent(DATELINE.event, DATELINE_SETTINGS);

function everyNth<T>(list: T[], n: number): T[] {
  return list.filter((_, i) => i % n === 0 || i === list.length - 1);
}

/** Every listed point's (f, g) equals d·n: astronomy-engine's ground vector to 10 m, the solve's own to 1 m. */
function checkLine(sc: PredictScenario, points: PathPoint[], offsetKm: number): void {
  expect(points.length).toBeGreaterThan(0);
  for (const p of everyNth(points, 7)) {
    const t = ms(p.timeUtc);
    const n = leftNormal(sc, t);
    const site = { latDeg: p.latDeg, lonDeg: p.lonDeg, heightM: 0 };
    const ae = sc.fg(site, t);
    // astronomy-engine's Earth rotation and ellipsoid differ from WGS84 + IAU 1982 GMST by ≤ 5 m, and a
    // ground offset grows by 1/sin(altitude) on the sky plane's scale where the star is low: 10 m.
    expectClose(ae.fKm, offsetKm * n.f, 0.01);
    expectClose(ae.gKm, offsetKm * n.g, 0.01);
    const own = solveChainFg(sc, site, t);
    expectClose(own.fKm, offsetKm * n.f, 0.001);
    expectClose(own.gKm, offsetKm * n.g, 0.001);
    expect(aeAltitudeDeg(sc.basis(t).s, p, t, sc.dut1Seconds)).toBeGreaterThan(0);
    expect(p.lonDeg >= -180 && p.lonDeg < 180).toBe(true);
  }
}

describe('predictEvent()', () => {
  it('predictEvent() returns the document of the contract, with a rings list everywhere', () => {
    expect(distant.format).toBe('limbus-prediction/1');
    expect(Object.keys(distant).sort()).toEqual(
      ['centralLine', 'closestApproach', 'format', 'limits', 'rings', 'stations'].sort(),
    );
    expect(distant.rings.map((r) => r.ring)).toEqual(['R1']);
    expect(northern.rings).toEqual([]);
    for (const s of [...distant.stations, ...northern.stations]) expect(Array.isArray(s.rings)).toBe(true);
    expect(distant.stations.map((s) => s.station)).toEqual(['quarry-top', 'dry-lake', 'far-south']);
    for (const t of [distant.closestApproach.timeUtc, ...distant.centralLine.map((p) => p.timeUtc)])
      expect(t).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
  });

  it('predictEvent() grid runs from `from` in steps of stepSeconds, `to` included when on the grid', () => {
    // DISTANT: rows from 01:10 to 03:10 UTC (labelled in TT), default window, 10 s steps: every listed
    // time is a whole multiple of 10 s after 01:10 (the line exists only while the shadow is on the Earth).
    const first = Date.parse('2028-03-14T01:10:00.000Z');
    for (const p of distant.centralLine) expect(((ms(p.timeUtc) - first) / 1000) % 10).toBe(0);
    // DATELINE: 10:58 to 11:02 in 2 s steps, the shadow on the Earth throughout: 121 times, both ends.
    const times = dateline.centralLine.map((p) => ms(p.timeUtc));
    expect(times[0]).toBe(Date.parse('2030-08-02T10:58:00Z'));
    expect(times.at(-1)).toBe(Date.parse('2030-08-02T11:02:00Z'));
    expect(times.length).toBe(121);
    // 4 min in 7 s steps: 10:58:00 + 34·7 s = 11:01:58 is the last; 11:02:00 is off the grid.
    const odd = predictEvent(DATELINE.event, { ...DATELINE_SETTINGS, stepSeconds: 7 });
    expect(odd.centralLine.at(-1)!.timeUtc).toBe('2030-08-02T11:01:58.000Z');
    // NORTHERN: TDB rows, so the first row is not on a whole millisecond of UTC; grid times are.
    for (const p of northern.centralLine) expect(p.timeUtc).toMatch(/\.\d{3}Z$/);
  });

  it('predictEvent() closest approach of the geocentre is the straight-line minimum of |B′ on the sky plane|', () => {
    // B′ moves on a straight line (fixtures.ts) and the star is fixed: |B′_fg(t)| = |c₀ + w·Δt|, least at
    // Δt = −c₀·w/|w|² with distance |c₀ × w|/|w| and speed |w| (plane geometry).
    const sc = DISTANT;
    const { eF, eG } = sc.basis(sc.centralMs);
    const b0 = sc.bodyPrime(sc.centralMs);
    const b1 = sc.bodyPrime(sc.centralMs + 1000);
    const c0 = { f: dot3(b0, eF), g: dot3(b0, eG) };
    const w = { f: dot3(b1, eF) - c0.f, g: dot3(b1, eG) - c0.g };
    const speed = Math.hypot(w.f, w.g);
    const dt = -(c0.f * w.f + c0.g * w.g) / (speed * speed);
    expectClose(ms(distant.closestApproach.timeUtc), sc.centralMs + dt * 1000, 1);
    expectClose(distant.closestApproach.distanceKm, Math.abs(c0.f * w.g - c0.g * w.f) / speed, 1e-4);
    expectClose(distant.closestApproach.speedKmPerS, speed, 1e-6);
  });

  it('predictEvent() central line, limits and ring limits sit at d·n on the sky plane, on the ground, star up', () => {
    checkLine(DISTANT, distant.centralLine, 0);
    checkLine(DISTANT, distant.limits.left, 555);
    checkLine(DISTANT, distant.limits.right, -555);
    checkLine(DISTANT, distant.rings[0]!.left, 4100);
    checkLine(NORTHERN, northern.centralLine, 0);
    checkLine(NORTHERN, northern.limits.left, 48);
    checkLine(NORTHERN, northern.limits.right, -48);
    checkLine(DATELINE, dateline.centralLine, 0);
    checkLine(DATELINE, dateline.limits.left, 120);
  });

  it('predictEvent() puts the central line through the ground point the body was aimed at', () => {
    // fixtures.ts places B′ on the line from (−24.6°, −70.4°, 0 m) to the star at 02:10:00 UTC, with
    // astronomy-engine's Earth: the engine's point there agrees to the ≤ 5 m the two Earths differ by.
    const p = distant.centralLine.find((q) => q.timeUtc === '2028-03-14T02:10:00.000Z')!;
    expect(groundDistanceKm(p, { latDeg: -24.6, lonDeg: -70.4 })).toBeLessThan(0.005);
    const q = northern.centralLine.find((r) => r.timeUtc === '2029-01-18T21:30:00.000Z')!;
    expect(groundDistanceKm(q, { latDeg: 64.1, lonDeg: 25.5 })).toBeLessThan(0.005);
  });

  it('predictEvent() lists a central-line point exactly while the shadow centre is on the Earth', () => {
    // The WGS84 spheroid seen along s (declination δ) has the outline (f/a)² + (g/b′)² = 1 on the sky plane,
    // b′ = √(a² sin²δ + b² cos²δ) (the apparent polar semi-diameter of an oblate spheroid; from memory).
    // The Earth's axis is the pole of date, 0.4° from J2000's in 2028: the outline moves by < 1 km, so
    // times within 2e-3 of the outline (≈ 6 km) are not judged.
    const a = 6378.137;
    const b = a * (1 - 1 / 298.257223563);
    const dec = (-8.62 * Math.PI) / 180;
    const bPrime = Math.sqrt(a * a * Math.sin(dec) ** 2 + b * b * Math.cos(dec) ** 2);
    const listed = new Set(distant.centralLine.map((p) => ms(p.timeUtc)));
    const counts = { inside: 0, outside: 0 };
    for (let t = Date.parse('2028-03-14T01:10:00Z'); t <= Date.parse('2028-03-14T03:10:00Z'); t += 10_000) {
      const { eF, eG } = DISTANT.basis(t);
      const bp = DISTANT.bodyPrime(t);
      const m = (dot3(bp, eF) / a) ** 2 + (dot3(bp, eG) / bPrime) ** 2;
      if (m < 1 - 2e-3) {
        expect(listed.has(t)).toBe(true);
        counts.inside++;
      } else if (m > 1 + 2e-3) {
        expect(listed.has(t)).toBe(false);
        counts.outside++;
      }
    }
    expect(counts.inside).toBeGreaterThan(40);
    expect(counts.outside).toBeGreaterThan(600);
    // The right ring limit (−4100 km) never reaches the Earth: the geocentre passes 2966 km to the other side.
    expect(distant.rings[0]!.right).toEqual([]);
  });

  it('predictEvent() times, distances and cross-track offsets agree with an independent search', () => {
    for (const [sc, prediction, s] of [
      [DISTANT, distant, DISTANT_SETTINGS],
      [NORTHERN, northern, NORTHERN_SETTINGS],
    ] as const) {
      const fromMs = ms(sc.event.ephemeris.rows[0]!.time + 'Z') - 69_184;
      const toMs = ms(sc.event.ephemeris.rows.at(-1)!.time + 'Z') - 69_184;
      prediction.stations.forEach((station, i) => {
        const site = sc.event.stations[i]!;
        const ref = independentStation(sc, site, fromMs + 5000, toMs - 5000);
        // astronomy-engine's station vector differs by ≤ 5 m; at ≥ 15 km/s that is ≤ 0.4 ms.
        expectClose(ms(station.closestTimeUtc), ref.closestMs, 5);
        expectClose(station.distanceKm, ref.distanceKm, 0.01);
        // Cross-track: (f, g)(t*)·n_s, n_s the station's velocity turned +90°, by central differences.
        const a = sc.fg(site, ref.closestMs - 500);
        const b = sc.fg(site, ref.closestMs + 500);
        const v = { f: b.fKm - a.fKm, g: b.gKm - a.gKm };
        const p = sc.fg(site, ref.closestMs);
        const cross = (p.fKm * -v.g + p.gKm * v.f) / Math.hypot(v.f, v.g);
        expectClose(station.crossTrackKm, cross, 0.01);
        if (ref.distanceKm < s.bodyRadiusKm) {
          expectClose(ms(station.disappearanceUtc), ref.crossing(s.bodyRadiusKm, -1), 2);
          expectClose(ms(station.reappearanceUtc), ref.crossing(s.bodyRadiusKm, 1), 2);
        } else {
          expect(station.disappearanceUtc).toBeNull();
          expect(station.reappearanceUtc).toBeNull();
        }
        s.rings.forEach((ring, k) => {
          const window = station.rings[k]!.window;
          expect(station.rings[k]!.ring).toBe(ring.ring);
          if (ref.distanceKm < ring.radiusKm) {
            expectClose(ms(window![0]), ref.crossing(ring.radiusKm, -1), 2);
            expectClose(ms(window![1]), ref.crossing(ring.radiusKm, 1), 2);
          } else expect(window).toBeNull();
        });
      });
    }
    // The scenarios hold stations inside and outside: both branches ran.
    expect(distant.stations.filter((s) => s.disappearanceUtc !== null).length).toBe(2);
    expect(distant.stations.filter((s) => s.disappearanceUtc === null).length).toBe(1);
    expect(northern.stations.filter((s) => s.disappearanceUtc === null).length).toBeGreaterThan(0);
  });

  it('predictEvent() gives a station on the central line cross-track 0 and D, R symmetric about t*', () => {
    const p = distant.centralLine.find((q) => q.timeUtc === '2028-03-14T02:08:30.000Z')!;
    const event: EventInput = {
      ...DISTANT.event,
      stations: [{ id: 'on-the-line', latDeg: p.latDeg, lonDeg: p.lonDeg, heightM: 0 }],
    };
    const [s] = predictEvent(event, DISTANT_SETTINGS).stations;
    // At the grid time its (f, g) is 0 (to < 1 m, the check above), so that is its closest instant.
    expectClose(ms(s!.closestTimeUtc), ms(p.timeUtc), 1);
    expectClose(s!.distanceKm, 0, 0.001);
    expectClose(s!.crossTrackKm, 0, 0.001);
    const before = ms(s!.closestTimeUtc) - ms(s!.disappearanceUtc);
    const after = ms(s!.reappearanceUtc) - ms(s!.closestTimeUtc);
    // A chord through the centre of a circle is bisected by t*; the station's ≈ 0.03 m/s² acceleration
    // makes the halves differ by far less than a millisecond (rounding to 1 ms each: ≤ 2 ms).
    expectClose(before, after, 2);
    // 2R/v: 1110 km at the station's sky-plane speed.
    expectClose(before + after, (2 * 555 * 1000) / 22.2, 0.03 * ((2 * 555 * 1000) / 22.2));
  });

  it('predictEvent() signs: a station on the left limit passes left (crossTrackKm ≈ +R), on the right ≈ −R', () => {
    for (const [list, sign] of [
      [distant.limits.left, 1],
      [distant.limits.right, -1],
    ] as const) {
      const p = list.find((q) => q.timeUtc === '2028-03-14T02:10:00.000Z')!;
      const site = { id: 'limit', latDeg: p.latDeg, lonDeg: p.lonDeg, heightM: 0 };
      const [s] = predictEvent({ ...DISTANT.event, stations: [site] }, DISTANT_SETTINGS).stations;
      // At the grid time the station sits at ±R·n; its own track is tilted from the shadow's by the Earth's
      // rotation, so its least distance is R·(n·n_s) with n_s from its own (independent) velocity.
      const t = ms(p.timeUtc);
      const a = DISTANT.fg(site, t - 500);
      const b = DISTANT.fg(site, t + 500);
      const speed = Math.hypot(b.fKm - a.fKm, b.gKm - a.gKm);
      const ns = { f: -(b.gKm - a.gKm) / speed, g: (b.fKm - a.fKm) / speed };
      const n = leftNormal(DISTANT, t);
      expectClose(s!.crossTrackKm, sign * 555 * (n.f * ns.f + n.g * ns.g), 0.05);
      expect(Math.sign(s!.crossTrackKm)).toBe(sign);
    }
  });

  it('predictEvent() sigmaCrossTrackKm is √((D·σα*·n_f)² + (D·σδ·n_g)²) with D = |B(t*)|', () => {
    for (const [sc, prediction, s] of [
      [DISTANT, distant, DISTANT_SETTINGS],
      [NORTHERN, northern, NORTHERN_SETTINGS],
    ] as const) {
      for (const station of prediction.stations) {
        const t = ms(station.closestTimeUtc);
        const n = leftNormal(sc, t);
        // D = |B(t*)|, the ephemeris body's distance (not B′'s): fixtures.ts's B = B′ − |B|·w.
        const d = Math.hypot(...sc.body(t));
        const expected = Math.hypot(
          (d * s.uncertaintyMas.raCosDec * n.f) / MAS_PER_RAD,
          (d * s.uncertaintyMas.dec * n.g) / MAS_PER_RAD,
        );
        expectClose(station.sigmaCrossTrackKm, expected, 1e-3);
      }
    }
  });

  it('predictEvent() star and Sun altitudes agree with astronomy-engine Horizon at t*', () => {
    for (const [sc, prediction] of [
      [DISTANT, distant],
      [NORTHERN, northern],
      [DATELINE, dateline],
    ] as const) {
      prediction.stations.forEach((station, i) => {
        const site = sc.event.stations[i]!;
        const t = ms(station.closestTimeUtc);
        // Star: the same geocentric direction, precessed to date and put through Horizon: ≤ 0.001°.
        expectClose(station.starAltitudeDeg, aeAltitudeDeg(sc.basis(t).s, site, t, sc.dut1Seconds), 0.002);
        // Sun: astronomy-engine's topocentric apparent position (Equator, of date, with aberration), whose
        // parallax (8.8″) and aberration (20.5″) the geocentric geometric altitude leaves out: ≤ 0.01°.
        const time = ut1Time(t, sc.dut1Seconds);
        const observer = new Observer(site.latDeg, site.lonDeg, site.heightM);
        const sun = Equator(Body.Sun, time, observer, true, true);
        expectClose(station.sunAltitudeDeg, Horizon(time, observer, sun.ra, sun.dec).altitude, 0.015);
      });
    }
  });

  it('predictEvent() writes longitudes in [−180, 180) and keeps a path continuous across ±180', () => {
    const lons = dateline.centralLine.map((p) => p.lonDeg);
    expect(lons.every((lon) => lon >= -180 && lon < 180)).toBe(true);
    expect(lons.some((lon) => lon > 179)).toBe(true);
    expect(lons.some((lon) => lon < -179)).toBe(true);
    // Where the sign flips, the two points 2 s apart are neighbours on the ground (haversine), not 360° apart.
    const flip = lons.findIndex((lon, i) => i > 0 && Math.sign(lon) !== Math.sign(lons[i - 1]!));
    expect(flip).toBeGreaterThan(0);
    expect(groundDistanceKm(dateline.centralLine[flip - 1]!, dateline.centralLine[flip]!)).toBeLessThan(100);
    const station = dateline.stations[0]!;
    expect(station.closestTimeUtc > '2030-08-02T10:50' && station.closestTimeUtc < '2030-08-02T11:10').toBe(
      true,
    );
  });

  it('predictEvent() limits close onto the central line as R → 0, and D, R onto t*', () => {
    const tiny = predictEvent(
      { ...DISTANT.event, stations: [DISTANT.event.stations[0]!] },
      { ...DISTANT_SETTINGS, bodyRadiusKm: 1e-3 },
    );
    const central = new Map(tiny.centralLine.map((p) => [p.timeUtc, p]));
    for (const side of [tiny.limits.left, tiny.limits.right])
      for (const p of side) {
        const c = central.get(p.timeUtc)!;
        const altitude = aeAltitudeDeg(DISTANT.basis(ms(p.timeUtc)).s, c, ms(p.timeUtc), DISTANT.dut1Seconds);
        // 1 m on the sky plane is 1 m/sin(altitude) on the ground.
        if (altitude > 2)
          expect(groundDistanceKm(p, c)).toBeLessThan(1e-3 / Math.sin((altitude * Math.PI) / 180) + 1e-4);
      }
    const s = tiny.stations[0]!;
    // quarry-top is the aimed-at point: its distance (≤ 1 mm here) is below 1 m, so it is inside.
    expect(s.disappearanceUtc).not.toBeNull();
    expectClose(ms(s.disappearanceUtc), ms(s.closestTimeUtc), 1);
    expectClose(ms(s.reappearanceUtc), ms(s.closestTimeUtc), 1);
  });

  it('predictEvent() moves the path west by ω·ΔDUT1 when UT1 − UTC grows (Meeus eq. 12.4 rate)', () => {
    const shifted = predictEvent(
      { ...DISTANT.event, earthRotation: { dut1Seconds: DISTANT.dut1Seconds + 0.7 } },
      DISTANT_SETTINGS,
    );
    // The same celestial geometry on an Earth turned further by 360.98564736629°/day × 0.7 s.
    const dLon = -(360.98564736629 / 86_400) * 0.7;
    const before = new Map(distant.centralLine.map((p) => [p.timeUtc, p]));
    let compared = 0;
    for (const p of shifted.centralLine) {
      const q = before.get(p.timeUtc);
      if (!q) continue;
      expectClose(p.latDeg, q.latDeg, 1e-9);
      expectClose(p.lonDeg - q.lonDeg, dLon, 1e-9);
      compared++;
    }
    expect(compared).toBeGreaterThan(40);
  });

  it('predictEvent() refuses degenerate input naming the JSON path', () => {
    const refusal = (event: EventInput, s: PredictionSettings): GeometryInputError => {
      try {
        predictEvent(event, s);
      } catch (error) {
        if (error instanceof GeometryInputError) return error;
        throw error;
      }
      throw new Error('not refused');
    };
    const rows = DISTANT.event.ephemeris.rows;
    const still = {
      ...DISTANT.event,
      ephemeris: {
        ...DISTANT.event.ephemeris,
        rows: rows.map((r) => ({ ...r, raDeg: 201.37, decDeg: -8.62, distanceKm: 6e9 })),
      },
    };
    expect(refusal(still, DISTANT_SETTINGS).path).toBe('ephemeris.rows');
    expect(refusal(DISTANT.event, { ...DISTANT_SETTINGS, from: '2028-03-14T01:00:00Z' }).path).toBe(
      'prediction.from',
    );
    expect(refusal(DISTANT.event, { ...DISTANT_SETTINGS, to: '2028-03-14T03:30:00Z' }).path).toBe(
      'prediction.to',
    );
    const backwards = refusal(DISTANT.event, {
      ...DISTANT_SETTINGS,
      from: '2028-03-14T02:00:00Z',
      to: '2028-03-14T02:00:00Z',
    });
    expect(backwards.path).toBe('prediction.to');
    expect(refusal(DISTANT.event, { ...DISTANT_SETTINGS, stepSeconds: 0.5 }).path).toBe(
      'prediction.stepSeconds',
    );
    expect(refusal(DISTANT.event, { ...DISTANT_SETTINGS, bodyRadiusKm: 0 }).path).toBe(
      'prediction.bodyRadiusKm',
    );
    const twice = {
      ...DISTANT_SETTINGS,
      rings: [
        { ring: 'R1', radiusKm: 4100 },
        { ring: 'R1', radiusKm: 4200 },
      ],
    };
    expect(refusal(DISTANT.event, twice).path).toBe('prediction.rings[1].ring');
    const dup = { ...DISTANT.event, stations: [DISTANT.event.stations[0]!, DISTANT.event.stations[0]!] };
    expect(refusal(dup, DISTANT_SETTINGS).path).toBe('stations[1].id');
  });
});
