// Writes the invented example events: docs/examples/event-example.json and the joint-pole fixtures of the
// CLI tests. Each event is built from a known limb ellipse (and ring) in its sky plane: stations are
// placed so that their tracks cross at chosen offsets, and every timing is refined with the geometry
// package's own projection until the projected point lies on the ellipse (|Δt| < 1 µs) before rounding
// to 1 ms. Run: pnpm --filter @limbus/geometry exec tsx ../../tools/examples/make-event-examples.ts
//
// Everything here is invented: the body "Tessivane", its star, the stations and their places.

import { writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

import { projectEvent } from '../../packages/geometry/src/project.js';
import type {
  ChordInput,
  EventInput,
  RingEventInput,
  SkyPointKm,
  StationInput,
  VelocityKmPerS,
} from '../../packages/geometry/src/types.js';

type V3 = [number, number, number];
const DEG = Math.PI / 180;
const ROOT = join(dirname(fileURLToPath(import.meta.url)), '../..');

interface Ellipse {
  centerFKm: number;
  centerGKm: number;
  semiMajorKm: number;
  semiMinorKm: number;
  positionAngleDeg: number;
}

export interface EventSpec {
  file: string;
  title: string;
  star: {
    raDeg: number;
    decDeg: number;
    pmRaCosDecMasPerYear: number;
    pmDecMasPerYear: number;
    parallaxMas: number;
  };
  /** UTC time of closest approach to the sub-star point, ISO. */
  centralUtc: string;
  distanceKm: number;
  /** Station motion relative to the body in the sky plane (km/s); the body moves the other way. */
  relativeVelocity: VelocityKmPerS;
  limb: Ellipse;
  ring: { label: string; radiusKm: number; poleRaDeg: number; poleDecDeg: number } | null;
  /** Cross-track offsets (km, from the limb centre) of the stations with positive chords. */
  positiveOffsetsKm: number[];
  /** Cross-track offsets of stations that saw no occultation by the body. */
  negativeOffsetsKm: number[];
  /** Station names, one per offset (positives first). */
  stationNames: string[];
  /** Longitude step between stations (degrees); the first one has the star on its meridian. */
  lonStepDeg: number;
  sigmaSeconds: number;
}

const dot = (a: readonly number[], b: readonly number[]) =>
  a.reduce((s, ai, i) => s + ai * (b[i] as number), 0);

function isoUtc(seconds: number): string {
  return new Date(Math.round(seconds * 1000)).toISOString();
}

function isoZoneless(seconds: number): string {
  return new Date(Math.round(seconds * 1000)).toISOString().slice(0, -1);
}

function raDecOf(v: V3): { raDeg: number; decDeg: number; distanceKm: number } {
  const r = Math.hypot(...v);
  let ra = Math.atan2(v[1], v[0]) / DEG;
  if (ra < 0) ra += 360;
  return { raDeg: ra, decDeg: Math.asin(v[2] / r) / DEG, distanceKm: r };
}

/** Along-track distances (km) where the line at cross-track offset o meets the ellipse, or null. */
function lineMeetsEllipse(
  e: Ellipse,
  point: SkyPointKm,
  velocity: VelocityKmPerS,
): { entry: number; exit: number } | null {
  const p = e.positionAngleDeg * DEG;
  const toFrame = (df: number, dg: number) => ({
    u: df * Math.cos(p) - dg * Math.sin(p),
    w: df * Math.sin(p) + dg * Math.cos(p),
  });
  const q = toFrame(point.fKm - e.centerFKm, point.gKm - e.centerGKm);
  const v = toFrame(velocity.f, velocity.g);
  const a2 = e.semiMajorKm ** 2;
  const b2 = e.semiMinorKm ** 2;
  const A = v.u ** 2 / a2 + v.w ** 2 / b2;
  const B = 2 * ((q.u * v.u) / a2 + (q.w * v.w) / b2);
  const C = q.u ** 2 / a2 + q.w ** 2 / b2 - 1;
  const disc = B * B - 4 * A * C;
  if (disc <= 0) return null;
  return { entry: (-B - Math.sqrt(disc)) / (2 * A), exit: (-B + Math.sqrt(disc)) / (2 * A) };
}

/** Seconds from this point along the velocity to the nearest crossing of the ellipse. */
function secondsToEllipse(
  e: Ellipse,
  point: SkyPointKm,
  velocity: VelocityKmPerS,
  which: 'entry' | 'exit',
): number {
  const hit = lineMeetsEllipse(e, point, velocity);
  if (hit === null) throw new Error(`a refined point no longer meets the ellipse`);
  return hit[which];
}

/**
 * Longitude (degrees) where the star is on the meridian at a UTC instant, from Greenwich mean sidereal
 * time GMST = 18.697374558 h + 24.06570982441908 h·D (D days from J2000.0; USNO Circular 163 form, from
 * memory). Only used to place invented stations where the star is high; precision does not matter.
 */
function meridianLongitudeDeg(raDeg: number, utcSeconds: number): number {
  const days = utcSeconds / 86400 - Date.UTC(2000, 0, 1, 12) / 1000 / 86400;
  const gmstDeg = ((((18.697374558 + 24.06570982441908 * days) % 24) + 24) % 24) * 15;
  const lon = ((((raDeg - gmstDeg) % 360) + 540) % 360) - 180;
  return lon;
}

function baseEvent(
  spec: EventSpec,
  rows: EventInput['ephemeris']['rows'],
  stations: StationInput[],
): EventInput {
  return {
    format: 'limbus-event/1',
    title: spec.title,
    star: { ...spec.star, catalogEpochJyear: 2016.0 },
    ephemeris: { timeScale: 'TDB', rows },
    earthRotation: { dut1Seconds: -0.21 },
    stations,
    chords: [],
    ringEvents: [],
    fit: { limb: { fixed: {}, modelErrorKm: 0, fitTimeOffsets: [] }, ring: { centerFrom: 'limb' }, seed: 1 },
  };
}

/** The sky point and velocity of a station at one UTC instant, from the projection itself. */
function probe(event: EventInput, stationId: string, utcSeconds: number) {
  const probeEvent: EventInput = {
    ...event,
    chords: [
      {
        station: stationId,
        type: 'negative',
        start: isoUtc(utcSeconds),
        end: isoUtc(utcSeconds + 1),
        timeOffsetSeconds: 0,
      },
    ],
    ringEvents: [],
  };
  const projected = projectEvent(probeEvent);
  const chord = projected.chords[0];
  if (!chord || !chord.path[0]) throw new Error('probe produced no path');
  return { point: chord.path[0], velocity: chord.velocityKmPerS, basis: projected.basis };
}

function ringEllipse(
  spec: EventSpec,
  basis: { eF: readonly number[]; eG: readonly number[]; s: readonly number[] },
): Ellipse | null {
  if (spec.ring === null) return null;
  const a = spec.ring.poleRaDeg * DEG;
  const d = spec.ring.poleDecDeg * DEG;
  const pole = [Math.cos(d) * Math.cos(a), Math.cos(d) * Math.sin(a), Math.sin(d)];
  // The pinned convention: sin B = −p·s, P = atan2(p·e_f, p·e_g).
  const sinB = -dot(pole, basis.s);
  const p = Math.atan2(dot(pole, basis.eF), dot(pole, basis.eG));
  return {
    centerFKm: spec.limb.centerFKm,
    centerGKm: spec.limb.centerGKm,
    semiMajorKm: spec.ring.radiusKm,
    semiMinorKm: spec.ring.radiusKm * Math.abs(sinB),
    positionAngleDeg: p / DEG,
  };
}

export function buildEvent(spec: EventSpec): EventInput {
  const t0 = Date.parse(spec.centralUtc) / 1000;
  const speed = Math.hypot(spec.relativeVelocity.f, spec.relativeVelocity.g);
  const along = { f: spec.relativeVelocity.f / speed, g: spec.relativeVelocity.g / speed };
  const across = { f: -along.g, g: along.f };

  // Pass 1: the star's direction at the event, with a placeholder ephemeris on the star itself.
  const placeholderRows = [-3600, -1200, 1200, 3600].map((dt) => ({
    time: isoZoneless(t0 + dt),
    raDeg: spec.star.raDeg,
    decDeg: spec.star.decDeg,
    distanceKm: spec.distanceKm,
  }));
  const lonStartDeg =
    meridianLongitudeDeg(spec.star.raDeg, t0) - (spec.lonStepDeg * (spec.stationNames.length - 1)) / 2;
  const subStar: StationInput = { id: 'probe', latDeg: spec.star.decDeg, lonDeg: lonStartDeg, heightM: 0 };
  const { basis } = probe(baseEvent(spec, placeholderRows, [subStar]), 'probe', t0);

  // The body moves against the stations' relative motion; TDB labels run ~69.2 s ahead of UTC.
  const tdbAhead = 69.184;
  const bodyAt = (tdbSeconds: number): V3 => {
    const dt = tdbSeconds - (t0 + tdbAhead);
    const f = -spec.relativeVelocity.f * dt;
    const g = -spec.relativeVelocity.g * dt;
    return [0, 1, 2].map(
      (i) =>
        spec.distanceKm * (basis.s[i] as number) + f * (basis.eF[i] as number) + g * (basis.eG[i] as number),
    ) as V3;
  };
  // Rows on whole minutes of TDB, as an ephemeris service would list them.
  const firstRowTdb = Math.floor((t0 + tdbAhead) / 60) * 60 - 2400;
  const rows = [0, 1200, 2400, 3600, 4800].map((dt) => {
    const tdb = firstRowTdb + dt;
    const { raDeg, decDeg, distanceKm } = raDecOf(bodyAt(tdb));
    return {
      time: isoZoneless(tdb),
      raDeg: Number(raDeg.toFixed(9)),
      decDeg: Number(decDeg.toFixed(9)),
      distanceKm: Math.round(distanceKm),
    };
  });

  // Stations: at a chosen longitude, the latitude whose track has the wanted cross-track offset.
  const offsets = [...spec.positiveOffsetsKm, ...spec.negativeOffsetsKm];
  const stations: StationInput[] = [];
  offsets.forEach((offsetKm, k) => {
    const lonDeg = lonStartDeg + spec.lonStepDeg * k;
    const id = spec.stationNames[k] as string;
    const crossOf = (latDeg: number) => {
      const e = baseEvent(spec, rows, [{ id, latDeg, lonDeg, heightM: 300 }]);
      const { point } = probe(e, id, t0);
      return (point.fKm - spec.limb.centerFKm) * across.f + (point.gKm - spec.limb.centerGKm) * across.g;
    };
    let lo = spec.star.decDeg - 15;
    let hi = spec.star.decDeg + 15;
    const increasing = crossOf(hi) > crossOf(lo);
    for (let i = 0; i < 60; i++) {
      const mid = (lo + hi) / 2;
      if (crossOf(mid) > offsetKm === increasing) hi = mid;
      else lo = mid;
    }
    stations.push({
      id,
      latDeg: Number(((lo + hi) / 2).toFixed(5)),
      lonDeg: Number(lonDeg.toFixed(5)),
      heightM: 300 + 40 * k,
    });
  });

  // First guesses of every timing from straight tracks, then refinement with the full projection.
  const event = baseEvent(spec, rows, stations);
  const ring = ringEllipse(spec, basis);
  const positives: Array<{ station: string; d: number; r: number }> = [];
  const dips: Array<{ station: string; mid: number; which: 'entry' | 'exit' }> = [];
  stations.forEach((station, k) => {
    const { point, velocity } = probe(event, station.id, t0);
    const limbHit = lineMeetsEllipse(spec.limb, point, velocity);
    if (k < spec.positiveOffsetsKm.length) {
      if (limbHit === null) throw new Error(`station ${station.id} misses the limb`);
      positives.push({ station: station.id, d: t0 + limbHit.entry, r: t0 + limbHit.exit });
    }
    const ringHit = ring ? lineMeetsEllipse(ring, point, velocity) : null;
    if (ringHit) {
      dips.push({ station: station.id, mid: t0 + ringHit.entry, which: 'entry' });
      dips.push({ station: station.id, mid: t0 + ringHit.exit, which: 'exit' });
    }
  });
  const dipHalfSeconds = 0.15;
  const assemble = (): EventInput => ({
    ...event,
    chords: stations.map((station, k): ChordInput => {
      const pos = positives[k];
      if (k < spec.positiveOffsetsKm.length && pos)
        return {
          station: station.id,
          type: 'positive',
          disappearance: { time: isoUtc(pos.d), sigmaSeconds: spec.sigmaSeconds },
          reappearance: { time: isoUtc(pos.r), sigmaSeconds: spec.sigmaSeconds },
          timeOffsetSeconds: 0,
        };
      return {
        station: station.id,
        type: 'negative',
        start: isoUtc(t0 - 240),
        end: isoUtc(t0 + 240),
        timeOffsetSeconds: 0,
      };
    }),
    ringEvents: dips.map((dip): RingEventInput => ({
      station: dip.station,
      ring: spec.ring?.label ?? '',
      start: { time: isoUtc(dip.mid - dipHalfSeconds), sigmaSeconds: spec.sigmaSeconds },
      end: { time: isoUtc(dip.mid + dipHalfSeconds), sigmaSeconds: spec.sigmaSeconds },
    })),
  });
  for (let iteration = 0; iteration < 6; iteration++) {
    // Unrounded times for the refinement: isoUtc rounds to 1 ms only when the file is written.
    const projected = projectEvent(exactTimes(assemble(), positives, dips, dipHalfSeconds));
    let worst = 0;
    positives.forEach((pos) => {
      const chord = projected.chords.find((c) => c.station === pos.station);
      const [dPoint, rPoint] = chord?.points ?? [];
      if (!chord || !dPoint || !rPoint) throw new Error('lost a chord');
      const dd = secondsToEllipse(spec.limb, dPoint, chord.velocityKmPerS, 'entry');
      const dr = secondsToEllipse(spec.limb, rPoint, chord.velocityKmPerS, 'exit');
      pos.d += dd;
      pos.r += dr;
      worst = Math.max(worst, Math.abs(dd), Math.abs(dr));
    });
    const ringProjected = ring ? (projected.ringPoints.get(spec.ring?.label ?? '') ?? []) : [];
    const ringNow = ringEllipse(spec, projected.basis);
    dips.forEach((dip, i) => {
      const point = ringProjected[i];
      if (!point || !ringNow) throw new Error('lost a ring dip');
      const dt = secondsToEllipse(ringNow, point, point.velocity, dip.which);
      dip.mid += dt;
      worst = Math.max(worst, Math.abs(dt));
    });
    if (worst < 1e-6) break;
  }
  return assemble();
}

/** The event with times to the microsecond (for refinement only; the file keeps milliseconds). */
function exactTimes(
  event: EventInput,
  positives: Array<{ station: string; d: number; r: number }>,
  dips: Array<{ station: string; mid: number }>,
  dipHalfSeconds: number,
): EventInput {
  const micro = (s: number) => {
    const whole = Math.floor(s);
    const iso = new Date(whole * 1000).toISOString().slice(0, 19);
    return `${iso}.${String(Math.round((s - whole) * 1e6)).padStart(6, '0')}Z`;
  };
  return {
    ...event,
    chords: event.chords.map((c) => {
      const pos = positives.find((p) => p.station === c.station);
      if (c.type !== 'positive' || !pos) return c;
      return {
        ...c,
        disappearance: { ...c.disappearance, time: micro(pos.d) },
        reappearance: { ...c.reappearance, time: micro(pos.r) },
      };
    }),
    ringEvents: event.ringEvents.map((r, i) => {
      const dip = dips[i];
      if (!dip) return r;
      return {
        ...r,
        start: { ...r.start, time: micro(dip.mid - dipHalfSeconds) },
        end: { ...r.end, time: micro(dip.mid + dipHalfSeconds) },
      };
    }),
  };
}

/** The event file as a person would write it: defaults left out. */
function asFile(event: EventInput): unknown {
  return {
    format: event.format,
    title: event.title,
    star: event.star,
    ephemeris: event.ephemeris,
    earthRotation: event.earthRotation,
    stations: event.stations,
    chords: event.chords.map((c) => {
      const { timeOffsetSeconds: _offset, ...rest } = c;
      return rest;
    }),
    ...(event.ringEvents.length > 0 ? { ringEvents: event.ringEvents } : {}),
    fit: { seed: event.fit.seed },
  };
}

const TESSIVANE_LIMB: Ellipse = {
  centerFKm: 14.0,
  centerGKm: -9.0,
  semiMajorKm: 415.0,
  semiMinorKm: 415.0 * (1 - 0.12),
  positionAngleDeg: 35.0,
};

const STAR = {
  raDeg: 285.21437,
  decDeg: -21.38812,
  pmRaCosDecMasPerYear: 2.41,
  pmDecMasPerYear: -5.87,
  parallaxMas: 0.31,
};

const NAMES = [
  'amberfield',
  'brackwater',
  'cinder-hill',
  'dunmere',
  'elmstead',
  'fallowmoor',
  'greyhaven',
  'hollins-gap',
  'ironbridge',
  'juniper-flat',
  'kestrel-rise',
];

export const SPECS: EventSpec[] = [
  {
    file: 'docs/examples/event-example.json',
    title: 'Tessivane occults star LX-7721, 2028-03-14 (invented example)',
    star: STAR,
    centralUtc: '2028-03-14T02:14:00Z',
    distanceKm: 5.982e9,
    relativeVelocity: { f: 23.6, g: -2.1 },
    limb: TESSIVANE_LIMB,
    ring: { label: 'R1', radiusKm: 1080, poleRaDeg: 41.0, poleDecDeg: 27.0 },
    positiveOffsetsKm: [-330, -250, -170, -90, -10, 70, 150, 230, 310],
    negativeOffsetsKm: [-520, 480],
    stationNames: NAMES,
    lonStepDeg: 0.35,
    sigmaSeconds: 0.04,
  },
  {
    file: 'tools/cli/test/fixtures/joint-2031.json',
    title: 'Tessivane occults star LX-9034, 2031-06-02 (invented)',
    star: {
      raDeg: 292.8051,
      decDeg: -20.9113,
      pmRaCosDecMasPerYear: -1.2,
      pmDecMasPerYear: 0.8,
      parallaxMas: 0.12,
    },
    centralUtc: '2031-06-02T05:40:00Z',
    distanceKm: 5.941e9,
    relativeVelocity: { f: -8.4, g: 1.3 },
    limb: { ...TESSIVANE_LIMB, centerFKm: -6, centerGKm: 11, positionAngleDeg: 52 },
    ring: { label: 'R1', radiusKm: 1080, poleRaDeg: 41.0, poleDecDeg: 27.0 },
    positiveOffsetsKm: [-200, 0, 190],
    negativeOffsetsKm: [-700, 650],
    stationNames: NAMES.slice(0, 5),
    lonStepDeg: 0.4,
    sigmaSeconds: 0.05,
  },
  {
    file: 'tools/cli/test/fixtures/joint-2036.json',
    title: 'Tessivane occults star LX-11802, 2036-08-21 (invented)',
    star: {
      raDeg: 301.1102,
      decDeg: -19.7702,
      pmRaCosDecMasPerYear: 0.5,
      pmDecMasPerYear: -0.4,
      parallaxMas: 0.2,
    },
    centralUtc: '2036-08-21T23:05:00Z',
    distanceKm: 5.903e9,
    relativeVelocity: { f: -21.5, g: 3.0 },
    limb: { ...TESSIVANE_LIMB, centerFKm: 3, centerGKm: -20, positionAngleDeg: 61 },
    ring: { label: 'R1', radiusKm: 1080, poleRaDeg: 41.0, poleDecDeg: 27.0 },
    positiveOffsetsKm: [],
    negativeOffsetsKm: [-900, -600, 600, 900],
    stationNames: NAMES.slice(0, 4),
    lonStepDeg: 0.5,
    sigmaSeconds: 0.05,
  },
];

if (import.meta.url === `file://${process.argv[1]}`) {
  for (const spec of SPECS) {
    const event = buildEvent(spec);
    writeFileSync(join(ROOT, spec.file), JSON.stringify(asFile(event), null, 2) + '\n');
    process.stdout.write(
      `${spec.file}: ${event.chords.length} chords, ${event.ringEvents.length} ring dips\n`,
    );
  }
}
