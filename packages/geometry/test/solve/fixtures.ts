// Invented test scenarios built WITHOUT the projection code under test: station vectors come from
// astronomy-engine's ObserverVector, the body is placed by hand on the line from a station to the star,
// UTC→UT1/TT by plain arithmetic (no leap second near 2028: TT − UTC = 32.184 + 37 s, IERS Bulletin C).
import { AstroTime, KM_PER_AU, Observer, ObserverVector } from 'astronomy-engine';
import type { EventInput, StationInput } from '../../src/types.js';

export type V3 = [number, number, number];
export const TT_MINUS_UTC = 69.184;
const J2000_MS = Date.UTC(2000, 0, 1, 12);

export function utcMs(text: string): number {
  return Date.parse(text);
}

/** e_f, e_g, s of the brief for a star at (α, δ) in degrees. */
export function basisOf(raDeg: number, decDeg: number): { eF: V3; eG: V3; s: V3 } {
  const a = (raDeg * Math.PI) / 180;
  const d = (decDeg * Math.PI) / 180;
  return {
    eF: [-Math.sin(a), Math.cos(a), 0],
    eG: [-Math.sin(d) * Math.cos(a), -Math.sin(d) * Math.sin(a), Math.cos(d)],
    s: [Math.cos(d) * Math.cos(a), Math.cos(d) * Math.sin(a), Math.sin(d)],
  };
}

export function dot3(a: V3, b: V3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

/** Geocentric station vector, km, J2000 axes, from astronomy-engine at UTC ms with DUT1. */
export function observerKm(station: StationInput, ms: number, dut1Seconds: number): V3 {
  const time = new AstroTime((ms - J2000_MS) / 86_400_000 + dut1Seconds / 86_400);
  const v = ObserverVector(time, new Observer(station.latDeg, station.lonDeg, station.heightM), false);
  return [v.x * KM_PER_AU, v.y * KM_PER_AU, v.z * KM_PER_AU];
}

function pad(n: number): string {
  return String(n).padStart(2, '0');
}

/** ISO text (no zone) of a ms count, for TT ephemeris rows. */
export function isoNoZone(ms: number): string {
  const d = new Date(ms);
  return `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())}T${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())}:${pad(d.getUTCSeconds())}.${String(d.getUTCMilliseconds()).padStart(3, '0')}`;
}

export function isoUtc(ms: number): string {
  return new Date(ms).toISOString();
}

export interface Scenario {
  event: EventInput;
  /** Body geocentric vector (km, J2000) at a UTC ms instant. */
  body: (ms: number) => V3;
  centralMs: number;
  basis: { eF: V3; eG: V3; s: V3 };
  distanceKm: number;
}

/**
 * The invented body "Tarnwick" (distance ≈ 41 au) passes exactly in front of the star for station `central`
 * at `centralUtc`, moving on a straight line (any spline reproduces it) with a sky velocity of ≈ (−22, 3) km/s.
 */
export function scenario(stations: StationInput[], centralUtc: string, dut1Seconds = -0.21): Scenario {
  const raDeg = 201.37;
  const decDeg = -8.62;
  const basis = basisOf(raDeg, decDeg);
  const distanceKm = 41.2 * KM_PER_AU;
  const centralMs = utcMs(centralUtc);
  const o = observerKm(stations[0] as StationInput, centralMs, dut1Seconds);
  const v: V3 = [0, 1, 2].map((i) => -22 * basis.eF[i]! + 3 * basis.eG[i]! + 5 * basis.s[i]!) as V3;
  const b0: V3 = [0, 1, 2].map((i) => o[i]! + distanceKm * basis.s[i]!) as V3;
  const body = (ms: number): V3 => {
    const dt = (ms - centralMs) / 1000;
    return [b0[0] + v[0] * dt, b0[1] + v[1] * dt, b0[2] + v[2] * dt];
  };
  const rows = [-20, -10, 0, 10, 20].map((minutes) => {
    const ms = centralMs + minutes * 60_000;
    const r = body(ms);
    const dist = Math.hypot(...r);
    let ra = (Math.atan2(r[1], r[0]) * 180) / Math.PI;
    if (ra < 0) ra += 360;
    return {
      time: isoNoZone(ms + TT_MINUS_UTC * 1000),
      raDeg: ra,
      decDeg: (Math.asin(r[2] / dist) * 180) / Math.PI,
      distanceKm: dist,
    };
  });
  // Rows are labelled in TT; the body function takes UTC: shift the row times by TT − UTC.
  const event: EventInput = {
    format: 'limbus-event/1',
    title: 'Tarnwick occults an invented star',
    star: {
      raDeg,
      decDeg,
      catalogEpochJyear: 2016,
      pmRaCosDecMasPerYear: 0,
      pmDecMasPerYear: 0,
      parallaxMas: 0,
    },
    ephemeris: { timeScale: 'TT', rows },
    earthRotation: { dut1Seconds },
    stations,
    chords: [],
    ringEvents: [],
    fit: { limb: { fixed: {}, modelErrorKm: 0, fitTimeOffsets: [] }, ring: { centerFrom: 'limb' } },
  };
  return { event, body, centralMs, basis, distanceKm };
}

/** The brief's (f, g) for a station at a UTC ms instant, computed independently of src/project.ts. */
export function expectedFG(sc: Scenario, station: StationInput, ms: number): { fKm: number; gKm: number } {
  const o = observerKm(station, ms, sc.event.earthRotation.dut1Seconds);
  const b = sc.body(ms);
  const rel: V3 = [o[0] - b[0], o[1] - b[1], o[2] - b[2]];
  return { fKm: dot3(rel, sc.basis.eF), gKm: dot3(rel, sc.basis.eG) };
}

export const STATIONS: StationInput[] = [
  { id: 'quillfort', latDeg: -24.61, lonDeg: -70.4, heightM: 2400 },
  { id: 'marrow-hill', latDeg: -22.95, lonDeg: -68.2, heightM: 2200 },
  { id: 'saltpan', latDeg: -27.1, lonDeg: -70.9, heightM: 350 },
];

/**
 * Times (UTC ms) in [fromMs, toMs] where `inside(fg)` changes sign along the station's independently
 * computed sky track: 1 s scan, then bisection to 1 µs.
 */
export function crossings(
  sc: Scenario,
  station: StationInput,
  fromMs: number,
  toMs: number,
  level: (p: { fKm: number; gKm: number }) => number,
): number[] {
  const at = (ms: number): number => level(expectedFG(sc, station, ms));
  const out: number[] = [];
  let prevMs = fromMs;
  let prev = at(fromMs);
  for (let ms = fromMs + 1000; ms <= toMs; ms += 1000) {
    const cur = at(ms);
    if (prev * cur < 0) {
      let lo = prevMs;
      let hi = ms;
      while (hi - lo > 1e-3) {
        const mid = (lo + hi) / 2;
        if (at(mid) * prev < 0) hi = mid;
        else lo = mid;
      }
      out.push((lo + hi) / 2);
    }
    prevMs = ms;
    prev = cur;
  }
  return out;
}

/** Stations spread across the track, ≈ 60–100 km apart on the sky plane (invented sites); the last misses. */
export const LIMB_STATIONS: StationInput[] = [
  { id: 'quillfort', latDeg: -24.61, lonDeg: -70.4, heightM: 2400 },
  { id: 'marrow-hill', latDeg: -23.7, lonDeg: -70.1, heightM: 2200 },
  { id: 'saltpan', latDeg: -25.5, lonDeg: -70.6, heightM: 350 },
  { id: 'brackenridge', latDeg: -22.9, lonDeg: -69.9, heightM: 1300 },
  { id: 'old-lantern', latDeg: -26.4, lonDeg: -70.8, heightM: 90 },
  { id: 'cinder-flat', latDeg: -22.1, lonDeg: -69.7, heightM: 1800 },
  { id: 'farrow', latDeg: -27.6, lonDeg: -71.0, heightM: 40 },
  // Far enough south to miss the body: a negative chord.
  { id: 'windle-gap', latDeg: -31.5, lonDeg: -71.4, heightM: 600 },
];
