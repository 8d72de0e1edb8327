// Speed of the solve pipeline: whole solve (uncertainties included) for a 9-chord and a 400-chord event,
// the projection alone, the uncertainty (ensemble) step alone, χ² evaluations per second, and the whole
// `./tools/limbus solve` process on the 9-chord example. Events are invented (test/solve/fixtures.ts).
import { execFileSync } from 'node:child_process';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { fitLimb, limbChi2Function, type LimbFitInput } from '../src/fit/limb-fit.js';
import { runEnsemble } from '../src/fit/ensemble-sampler.js';
import { mulberry32 } from '../src/fit/prng.js';
import { projectEvent } from '../src/project.js';
import { solveEvent } from '../src/solve.js';
import type { ChordInput, EventInput, StationInput } from '../src/types.js';
import { crossings, expectedFG, isoUtc, scenario } from '../test/solve/fixtures.js';

const here = dirname(fileURLToPath(import.meta.url));
const CENTER = { fKm: 42, gKm: -17 };
const RADIUS_KM = 320;

/**
 * n stations whose tracks cross the sky plane evenly from 1.2 R south to 1.2 R north of the centre, so
 * ~83 % are positive chords and the outer ones negative: sites picked from a north–south line of candidates
 * by their independently computed g at the central instant.
 */
function event(n: number): EventInput {
  const candidates: StationInput[] = Array.from({ length: 1400 }, (_, i) => ({
    id: `candidate-${i}`,
    latDeg: -32 + i * 0.01,
    lonDeg: -70.4,
    heightM: 500,
  }));
  const probe = scenario(candidates, '2028-03-14T02:10:00.000Z');
  const g = candidates.map((c) => expectedFG(probe, c, probe.centralMs).gKm);
  const stations: StationInput[] = Array.from({ length: n }, (_, k) => {
    const target = CENTER.gKm + RADIUS_KM * (-1.2 + (2.4 * (k + 0.5)) / n);
    let best = 0;
    g.forEach((v, i) => {
      if (Math.abs(v - target) < Math.abs((g[best] as number) - target)) best = i;
    });
    return {
      ...(candidates[best] as StationInput),
      id: `site-${String(k).padStart(3, '0')}`,
      heightM: 500 + k,
    };
  });
  const sc = scenario([candidates[0] as StationInput, ...stations], '2028-03-14T02:10:00.000Z');
  const chords: ChordInput[] = stations.map((station) => {
    const t = crossings(
      sc,
      station,
      sc.centralMs - 60_000,
      sc.centralMs + 60_000,
      (p) => Math.hypot(p.fKm - CENTER.fKm, p.gKm - CENTER.gKm) - RADIUS_KM,
    );
    if (t.length === 2)
      return {
        station: station.id,
        type: 'positive',
        disappearance: { time: isoUtc(t[0] as number), sigmaSeconds: 0.05 },
        reappearance: { time: isoUtc(t[1] as number), sigmaSeconds: 0.05 },
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
  return { ...sc.event, stations, chords };
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)] as number;
}

function timeMs(runs: number, f: () => unknown): number {
  // Three warm-up runs: one leaves much of the fit unoptimised by the JIT.
  for (let i = 0; i < 3; i++) f();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    f();
    times.push(performance.now() - t0);
  }
  return median(times);
}

function limbInput(e: EventInput): LimbFitInput {
  const p = projectEvent(e);
  return {
    points: p.limbPoints,
    negatives: p.negatives,
    fixed: {},
    modelErrorKm: 0,
    fitTimeOffsets: [],
    seed: 1,
  };
}

/**
 * The uncertainty step as the fit runs it (2·max(12, 2k) = 24 walkers for k = 5 free parameters, 150
 * burn-in + 250 steps, as in src/fit/ellipse-fit.ts), on the χ² alone: the negative-path check is left out.
 */
function ensembleMs(input: LimbFitInput): number {
  const fit = fitLimb(input);
  const chi2 = limbChi2Function(input);
  const best = fit.ellipse;
  const s = fit.linearisedSigma;
  const uniform = mulberry32(3);
  const initial = Array.from({ length: 24 }, () =>
    Float64Array.from([
      best.centerFKm + s.centerFKm * (uniform() - 0.5),
      best.centerGKm + s.centerGKm * (uniform() - 0.5),
      best.equatorialRadiusKm + s.equatorialRadiusKm * (uniform() - 0.5),
      Math.min(0.99, Math.abs(best.oblateness + s.oblateness * (uniform() - 0.5))),
      best.positionAngleDeg + s.positionAngleDeg * (uniform() - 0.5),
    ]),
  );
  const logProbability = (x: Float64Array): number =>
    (x[2] as number) > 0 && (x[3] as number) >= 0 && (x[3] as number) < 1
      ? -0.5 *
        chi2({
          centerFKm: x[0] as number,
          centerGKm: x[1] as number,
          equatorialRadiusKm: x[2] as number,
          oblateness: x[3] as number,
          positionAngleDeg: x[4] as number,
        })
      : -Infinity;
  return timeMs(3, () => runEnsemble({ logProbability, initial, steps: 250, burnIn: 150, uniform }));
}

function chi2PerSecond(input: LimbFitInput): number {
  const chi2 = limbChi2Function(input);
  const e = fitLimb(input).ellipse;
  let n = 0;
  const t0 = performance.now();
  while (performance.now() - t0 < 500) {
    for (let i = 0; i < 100; i++) chi2({ ...e, centerFKm: e.centerFKm + i * 1e-3 });
    n += 100;
  }
  return n / ((performance.now() - t0) / 1000);
}

export default async function bench(): Promise<void> {
  const small = event(9);
  const large = event(400);
  const count = (e: EventInput): string =>
    `${e.chords.filter((c) => c.type === 'positive').length} positive + ${e.chords.filter((c) => c.type === 'negative').length} negative`;
  const rows: Array<[string, string]> = [];
  for (const [name, e, runs] of [
    ['9 chords', small, 9],
    ['400 chords', large, 3],
  ] as const) {
    const input = limbInput(e);
    rows.push([
      `${name} (${count(e)}): whole solveEvent`,
      `${timeMs(runs, () => solveEvent(e, { inputSha256: '0' })).toFixed(1)} ms`,
    ]);
    rows.push([`${name}: projectEvent alone`, `${timeMs(runs, () => projectEvent(e)).toFixed(2)} ms`]);
    rows.push([
      `${name}: fitLimb (fit + uncertainties)`,
      `${timeMs(runs, () => fitLimb(input)).toFixed(1)} ms`,
    ]);
    rows.push([`${name}: uncertainty step alone (ensemble, χ² only)`, `${ensembleMs(input).toFixed(1)} ms`]);
    rows.push([`${name}: χ² evaluations per second`, `${(chi2PerSecond(input) / 1000).toFixed(1)} k/s`]);
  }
  const cli = resolve(here, '../../../tools/limbus');
  const example = resolve(here, '../../../docs/examples/event-example.json');
  const processTimes: number[] = [];
  for (let i = 0; i < 5; i++) {
    const t0 = performance.now();
    execFileSync(cli, ['solve', example], { stdio: ['ignore', 'ignore', 'inherit'] });
    processTimes.push(performance.now() - t0);
  }
  rows.push([
    './tools/limbus solve docs/examples/event-example.json (9 positive chords, 22 ring dips), process',
    `${median(processTimes).toFixed(0)} ms (median of 5)`,
  ]);
  for (const [label, value] of rows) console.log(`${label.padEnd(72)} ${value}`);
}
