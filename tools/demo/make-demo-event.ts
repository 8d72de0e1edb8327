// Writes the demo scenario's event file, packages/api/src/demo/quillon-event.json, once; the seed reads
// it instead of generating anything. Built like the invented examples (tools/examples/make-event-examples.ts
// places stations and refines every timing with the geometry package's own projection), from a known limb
// (a = 380 km, ε = 0.08) and one ring (R1, 1100 km); then each timing gets seeded Gaussian noise of its
// own σ, as a real set of reports would have. Run:
//   pnpm --filter @limbus/geometry exec tsx ../../tools/demo/make-demo-event.ts
//
// Everything is invented: the body "Quillon", the star "LDS 1187-0443" (LDS is no real catalogue), the
// sites and the observers.

import { writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

import type { EventInput, TimedMark } from '../../packages/geometry/src/types.js';
import { buildEvent, type EventSpec } from '../examples/make-event-examples.js';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '../..');
const OUT = 'packages/api/src/demo/quillon-event.json';

const SITES = [
  'tarrow-knoll',
  'vesper-flats',
  'ombry-ridge',
  'castellan-mesa',
  'lindquist-farm',
  'saltmarsh-point',
  'pennick-down',
  'wrenfold-hill',
];

const SPEC: EventSpec = {
  file: OUT,
  title: 'Quillon occults LDS 1187-0443, 2029-09-07 (demo scenario)',
  star: {
    raDeg: 23.71842,
    decDeg: 8.90417,
    pmRaCosDecMasPerYear: -3.12,
    pmDecMasPerYear: 1.47,
    parallaxMas: 0.42,
  },
  centralUtc: '2029-09-07T21:42:00Z',
  distanceKm: 6.214e9,
  relativeVelocity: { f: -19.8, g: 4.4 },
  limb: {
    centerFKm: -8,
    centerGKm: 5,
    semiMajorKm: 380,
    semiMinorKm: 380 * (1 - 0.08),
    positionAngleDeg: 118,
  },
  ring: { label: 'R1', radiusKm: 1100, poleRaDeg: 312.0, poleDecDeg: 44.0 },
  positiveOffsetsKm: [-300, -190, -80, 30, 140, 260],
  negativeOffsetsKm: [-470, 455],
  stationNames: SITES,
  lonStepDeg: 0.3,
  sigmaSeconds: 0.05,
};

/** mulberry32 (Tommy Ettinger's public-domain generator, from memory): a fixed seed gives a fixed file. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function gaussian(next: () => number): number {
  // Box–Muller transform.
  const u = 1 - next();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * next());
}

function jitter(mark: TimedMark, next: () => number): TimedMark {
  const ms = Date.parse(mark.time) + gaussian(next) * mark.sigmaSeconds * 1000;
  return { time: new Date(Math.round(ms)).toISOString(), sigmaSeconds: mark.sigmaSeconds };
}

function main(): void {
  const exact = buildEvent(SPEC);
  const next = rng(20290907);
  const event: EventInput = {
    ...exact,
    chords: exact.chords.map((c) =>
      c.type === 'positive'
        ? { ...c, disappearance: jitter(c.disappearance, next), reappearance: jitter(c.reappearance, next) }
        : c,
    ),
    ringEvents: exact.ringEvents.map((r) => ({
      ...r,
      start: jitter(r.start, next),
      end: jitter(r.end, next),
    })),
  };
  // Two more sites near the track that saw nothing: one clouded out, one whose camera failed.
  const near = (k: number, dLatDeg: number) => {
    const s = exact.stations[k];
    if (!s) throw new Error(`no station ${k}`);
    return {
      latDeg: Number((s.latDeg + dLatDeg).toFixed(5)),
      lonDeg: Number((s.lonDeg + 0.05).toFixed(5)),
      heightM: 450,
    };
  };
  event.stations = [
    ...event.stations,
    { id: 'hobb-observatory', ...near(2, 0.02) },
    { id: 'marrin-station', ...near(4, -0.02) },
  ];
  const file = {
    format: event.format,
    title: event.title,
    star: event.star,
    ephemeris: event.ephemeris,
    earthRotation: event.earthRotation,
    stations: event.stations,
    chords: event.chords.map(({ timeOffsetSeconds: _offset, ...rest }) => rest),
    ringEvents: event.ringEvents,
    fit: { limb: { modelErrorKm: 1 }, seed: 7 },
  };
  writeFileSync(join(ROOT, OUT), JSON.stringify(file, null, 2) + '\n');
  process.stdout.write(
    `${OUT}: ${event.stations.length} stations, ${event.chords.length} chords, ${event.ringEvents.length} ring dips\n`,
  );
}

main();
