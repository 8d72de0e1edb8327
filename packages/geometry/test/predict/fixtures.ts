// Invented prediction scenarios built WITHOUT the prediction code under test. The station and ground
// vectors come from astronomy-engine's ObserverVector (its own Earth rotation and IERS 2003 ellipsoid:
// ≤ 5 m from the WGS84 chain the engine uses, test/astro/earth-rotation.test.ts); the star direction from
// the Hipparcos linear model written out here with astronomy-engine's BaryState for the parallax; the body
// B' is placed by hand on the line from a chosen ground point to the star at a chosen instant and moves
// on a straight line, and the ephemeris rows are B = B' − |B|·w (w the stated offset), so that the
// engine's B' = B + |B|·w is the line again. UTC → TT by plain arithmetic: no leap second near 2028,
// TT − UTC = 32.184 + 37 s (IERS Bulletin C).
import { AstroTime, BaryState, Body, KM_PER_AU } from 'astronomy-engine';
import type { EphemerisRow, EventInput, StarInput, StationInput } from '../../src/types.js';
import type { PredictionSettings } from '../../src/predict/types.js';
import { TT_MINUS_UTC, basisOf, dot3, isoNoZone, observerKm, type V3 } from '../solve/fixtures.js';

const J2000_TT_MS = Date.UTC(2000, 0, 1, 12);
const MAS_PER_RAD = (180 / Math.PI) * 3_600_000;

export interface ScenarioOptions {
  title: string;
  star: StarInput;
  /** The ground point (height 0) the shadow centre crosses at `centralUtc`. */
  centre: { latDeg: number; lonDeg: number };
  centralUtc: string;
  distanceKm: number;
  /** Body velocity along e_f, e_g and s at the central instant, km/s. */
  velocityKmPerS: V3;
  offsetMas?: { raCosDec: number; dec: number };
  dut1Seconds?: number;
  timeScale?: 'TT' | 'TDB';
  /** Row times, minutes from the central instant. */
  rowMinutes?: number[];
  stations?: StationInput[];
}

export interface PredictScenario {
  event: EventInput;
  centralMs: number;
  /** Independent sky-plane basis at a UTC ms instant (star moved by proper motion and parallax). */
  basis: (ms: number) => { eF: V3; eG: V3; s: V3 };
  /** B, the ephemeris body (km, J2000 axes), at a UTC ms instant. */
  body: (ms: number) => V3;
  /** B', the shifted body (km, J2000 axes), at a UTC ms instant. */
  bodyPrime: (ms: number) => V3;
  /** Independent (f, g) of a geodetic point at a UTC ms instant. */
  fg: (site: { latDeg: number; lonDeg: number; heightM: number }, ms: number) => { fKm: number; gKm: number };
  /** The shadow-centre velocity −d/dt(B'·e_f, B'·e_g) by a central difference (exact for a straight line). */
  shadowVelocity: (ms: number) => { f: number; g: number };
  dut1Seconds: number;
}

/** TDB − TT, s: the main periodic terms (Explanatory Supplement to the Astronomical Almanac; from memory). */
export function tdbMinusTtSeconds(secondsFromJ2000: number): number {
  const g = ((357.53 + 0.98560028 * (secondsFromJ2000 / 86_400)) * Math.PI) / 180;
  return 0.001657 * Math.sin(g) + 0.000014 * Math.sin(2 * g);
}

/** Star direction by the Hipparcos linear model (ESA SP-1200, vol. 1, sec. 1.2.8) with BaryState parallax. */
export function starUnit(star: StarInput, utcMs: number): V3 {
  const ttMs = utcMs + TT_MINUS_UTC * 1000;
  const { eF: p, eG: q, s: u0 } = basisOf(star.raDeg, star.decDeg);
  const epochMs = J2000_TT_MS + (star.catalogEpochJyear - 2000) * 365.25 * 86_400_000;
  const years = (ttMs - epochMs) / (365.25 * 86_400_000);
  const earth = BaryState(Body.Earth, AstroTime.FromTerrestrialTime((ttMs - J2000_TT_MS) / 86_400_000));
  const e: V3 = [earth.x, earth.y, earth.z];
  const v: V3 = [0, 1, 2].map(
    (i) =>
      u0[i]! +
      (years * (star.pmRaCosDecMasPerYear * p[i]! + star.pmDecMasPerYear * q[i]!)) / MAS_PER_RAD -
      (star.parallaxMas * e[i]!) / MAS_PER_RAD,
  ) as V3;
  const n = Math.hypot(...v);
  return [v[0] / n, v[1] / n, v[2] / n];
}

function basisFromUnit(s: V3): { eF: V3; eG: V3; s: V3 } {
  const ra = Math.atan2(s[1], s[0]);
  const dec = Math.atan2(s[2], Math.hypot(s[0], s[1]));
  const b = basisOf((ra * 180) / Math.PI, (dec * 180) / Math.PI);
  return { eF: b.eF, eG: b.eG, s };
}

function raDecRow(time: string, r: V3): EphemerisRow {
  const dist = Math.hypot(...r);
  let ra = (Math.atan2(r[1], r[0]) * 180) / Math.PI;
  if (ra < 0) ra += 360;
  return { time, raDeg: ra, decDeg: (Math.asin(r[2] / dist) * 180) / Math.PI, distanceKm: dist };
}

export function predictScenario(o: ScenarioOptions): PredictScenario {
  const dut1Seconds = o.dut1Seconds ?? 0;
  const centralMs = Date.parse(o.centralUtc);
  const basis = (ms: number) => basisFromUnit(starUnit(o.star, ms));
  const b0basis = basis(centralMs);
  const origin = observerKm({ id: 'centre', ...o.centre, heightM: 0 }, centralMs, dut1Seconds);
  const [vf, vg, vs] = o.velocityKmPerS;
  const v: V3 = [0, 1, 2].map((i) => vf * b0basis.eF[i]! + vg * b0basis.eG[i]! + vs * b0basis.s[i]!) as V3;
  const b0: V3 = [0, 1, 2].map((i) => origin[i]! + o.distanceKm * b0basis.s[i]!) as V3;
  const bodyPrime = (ms: number): V3 => {
    const dt = (ms - centralMs) / 1000;
    return [b0[0] + v[0] * dt, b0[1] + v[1] * dt, b0[2] + v[2] * dt];
  };
  const off = o.offsetMas ?? { raCosDec: 0, dec: 0 };
  // B = B' − |B|·w by fixed-point iteration (|w| ~ 1e-7: two rounds reach the last digit).
  const body = (ms: number): V3 => {
    const bp = bodyPrime(ms);
    const { eF, eG } = basis(ms);
    const w: V3 = [0, 1, 2].map((i) => (off.raCosDec * eF[i]! + off.dec * eG[i]!) / MAS_PER_RAD) as V3;
    let b = bp;
    for (let k = 0; k < 4; k++) {
      const d = Math.hypot(...b);
      b = [bp[0] - d * w[0], bp[1] - d * w[1], bp[2] - d * w[2]];
    }
    return b;
  };
  const scale = o.timeScale ?? 'TT';
  const rows = (o.rowMinutes ?? [-60, -40, -20, 0, 20, 40, 60]).map((minutes) => {
    // The row's label is a round instant of its own scale; the body is placed at the UTC instant it names.
    const labelMs = centralMs + minutes * 60_000 + TT_MINUS_UTC * 1000;
    const utcMs =
      scale === 'TT'
        ? labelMs - TT_MINUS_UTC * 1000
        : labelMs - tdbMinusTtSeconds((labelMs - J2000_TT_MS) / 1000) * 1000 - TT_MINUS_UTC * 1000;
    return raDecRow(isoNoZone(labelMs), body(utcMs));
  });
  const event: EventInput = {
    format: 'limbus-event/1',
    title: o.title,
    star: o.star,
    ephemeris: { timeScale: scale, rows },
    earthRotation: { dut1Seconds },
    stations: o.stations ?? [],
    chords: [],
    ringEvents: [],
    fit: { limb: { fixed: {}, modelErrorKm: 0, fitTimeOffsets: [] }, ring: { centerFrom: 'limb' } },
  };
  const fg = (site: { latDeg: number; lonDeg: number; heightM: number }, ms: number) => {
    const obs = observerKm({ id: 'site', ...site }, ms, dut1Seconds);
    const bp = bodyPrime(ms);
    const { eF, eG } = basis(ms);
    const rel: V3 = [obs[0] - bp[0], obs[1] - bp[1], obs[2] - bp[2]];
    return { fKm: dot3(rel, eF), gKm: dot3(rel, eG) };
  };
  const shadowVelocity = (ms: number) => {
    const h = 500;
    const at = (t: number) => {
      const { eF, eG } = basis(t);
      const bp = bodyPrime(t);
      return { f: dot3(bp, eF), g: dot3(bp, eG) };
    };
    const a = at(ms - h);
    const b = at(ms + h);
    return { f: -(b.f - a.f) / ((2 * h) / 1000), g: -(b.g - a.g) / ((2 * h) / 1000) };
  };
  return { event, centralMs, basis, body, bodyPrime, fg, shadowVelocity, dut1Seconds };
}

export function settings(
  partial: Partial<PredictionSettings> & { bodyRadiusKm: number },
): PredictionSettings {
  return {
    uncertaintyMas: { raCosDec: 0, dec: 0 },
    offsetMas: { raCosDec: 0, dec: 0 },
    rings: [],
    stepSeconds: 10,
    ...partial,
  };
}

/** A star with no proper motion or parallax (the basis is then fixed). */
export function fixedStar(raDeg: number, decDeg: number): StarInput {
  return {
    raDeg,
    decDeg,
    catalogEpochJyear: 2016,
    pmRaCosDecMasPerYear: 0,
    pmDecMasPerYear: 0,
    parallaxMas: 0,
  };
}

/** Great-circle distance on a sphere of radius 6371 km (haversine; from memory), km. */
export function groundDistanceKm(
  a: { latDeg: number; lonDeg: number },
  b: { latDeg: number; lonDeg: number },
): number {
  const r = Math.PI / 180;
  const dLat = (b.latDeg - a.latDeg) * r;
  const dLon = (b.lonDeg - a.lonDeg) * r;
  const h =
    Math.sin(dLat / 2) ** 2 + Math.cos(a.latDeg * r) * Math.cos(b.latDeg * r) * Math.sin(dLon / 2) ** 2;
  return 2 * 6371 * Math.asin(Math.sqrt(h));
}

export const AU_KM = KM_PER_AU;
