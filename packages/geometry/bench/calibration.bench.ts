// Calibration of the reported 1-sigma beyond the nine-chord case of test/fit/calibration.test.ts: for each
// set-up, N noise realisations (N = 200 unless CALIBRATION_REALISATIONS says otherwise) are fitted and the
// fraction whose truth lies within the reported 1-sigma is counted per parameter, with the mean χ²/dof.
// A correct 1-sigma covers 68.3 % (binomial spread √(0.683·0.317/N) ≈ 3.3 % for N = 200; Bevington &
// Robinson, Data Reduction and Error Analysis, 3rd ed., Table C.2 for the 68.3 %). Too slow for the test
// suite (about a minute); the figures are quoted in docs/method.md, "Calibration".
// Run: pnpm --filter @limbus/geometry bench calibration
import { performance } from 'node:perf_hooks';
import { fitLimbAndRings } from '../src/fit/joint-limb-ring.js';
import { type LimbFitInput, type LimbFitResult, type NegativePath, fitLimb } from '../src/fit/limb-fit.js';
import { gaussian, mulberry32 } from '../src/fit/prng.js';
import { type RingFitResult, type RingPoint, fitRing } from '../src/fit/ring-fit.js';
import type { LimbEllipse, LimbParameter } from '../src/types.js';
import { crossingTimes, limbPoints, negativePath } from '../test/fit/synthetic-chords.js';

const REALISATIONS = Number(process.env.CALIBRATION_REALISATIONS ?? 200);
const TRUTH: LimbEllipse = {
  centerFKm: -8,
  centerGKm: 15,
  equatorialRadiusKm: 380,
  oblateness: 0.15,
  positionAngleDeg: 62,
};
const VELOCITY = { f: 14, g: 9 };
const SIGMA_S = 0.4;
const NINE = [-320, -240, -150, -70, 10, 90, 170, 250, 320];
const FIVE = [-240, -120, 0, 120, 240];
const RING = { radiusKm: 1200, openingAngleDeg: 40, positionAngleDeg: 110 };
const RING_ELLIPSE: LimbEllipse = {
  ...TRUTH,
  equatorialRadiusKm: RING.radiusKm,
  oblateness: 1 - Math.sin((RING.openingAngleDeg * Math.PI) / 180),
  positionAngleDeg: RING.positionAngleDeg,
};
const LIMB_KEYS: LimbParameter[] = [
  'centerFKm',
  'centerGKm',
  'equatorialRadiusKm',
  'oblateness',
  'positionAngleDeg',
];

/** Differences of position angles taken modulo 180°. */
function difference(key: string, value: number, truth: number): number {
  if (!key.endsWith('positionAngleDeg')) return value - truth;
  return ((((value - truth) % 180) + 270) % 180) - 90;
}

class Tally {
  private inside = new Map<string, number>();
  private reduced = new Map<string, number[]>();
  count(key: string, value: number, truth: number, sigma: number): void {
    const hit = Math.abs(difference(key, value, truth)) <= sigma ? 1 : 0;
    this.inside.set(key, (this.inside.get(key) ?? 0) + hit);
  }
  chi2(key: string, chi2: number, dof: number): void {
    if (dof > 0) this.reduced.set(key, [...(this.reduced.get(key) ?? []), chi2 / dof]);
  }
  print(title: string, seconds: number): void {
    const cover = [...this.inside].map(([k, n]) => `${k} ${((100 * n) / REALISATIONS).toFixed(1)} %`);
    const chi = [...this.reduced].map(
      ([k, v]) => `${k} ${(v.reduce((s, x) => s + x, 0) / v.length).toFixed(2)}`,
    );
    console.log(`${title} (${REALISATIONS} realisations, ${seconds.toFixed(1)} s)`);
    console.log(`  coverage: ${cover.join(', ')}`);
    console.log(`  mean χ²/dof: ${chi.join(', ')}`);
  }
}

function countLimb(t: Tally, fit: LimbFitResult, fixed: Partial<Record<LimbParameter, number>> = {}): void {
  for (const key of LIMB_KEYS)
    if (fixed[key] === undefined) t.count(key, fit.ellipse[key], TRUTH[key], fit.uncertainty[key]);
  t.count(
    'equivalentRadiusKm',
    fit.equivalentRadiusKm,
    TRUTH.equatorialRadiusKm * Math.sqrt(1 - TRUTH.oblateness),
    fit.uncertainty.equivalentRadiusKm,
  );
}

/** The largest impact (km, to the left of the velocity) at which a chord still crosses the limb. */
function edgeImpactKm(sign: 1 | -1): number {
  let inside = 0;
  let outside = sign * 2 * TRUTH.equatorialRadiusKm;
  for (let i = 0; i < 60; i++) {
    const mid = (inside + outside) / 2;
    if (crossingTimes(TRUTH, VELOCITY, mid)) inside = mid;
    else outside = mid;
  }
  return inside;
}

function limbCase(
  title: string,
  impactKm: number[],
  options: {
    negatives?: NegativePath[];
    fixed?: Partial<Record<LimbParameter, number>>;
    clockShiftSeconds?: Record<string, number>;
  } = {},
): void {
  const t = new Tally();
  const noise = gaussian(mulberry32(20261203));
  const started = performance.now();
  const stations = Object.keys(options.clockShiftSeconds ?? {});
  for (let i = 0; i < REALISATIONS; i++) {
    const points = limbPoints({
      truth: TRUTH,
      velocity: VELOCITY,
      impactKm,
      sigmaSeconds: SIGMA_S,
      noise,
      clockShiftSeconds: options.clockShiftSeconds,
    });
    const fit = fitLimb({
      points,
      negatives: options.negatives ?? [],
      fixed: options.fixed ?? {},
      modelErrorKm: 0,
      fitTimeOffsets: stations,
      seed: i + 1,
    });
    countLimb(t, fit, options.fixed);
    for (const o of fit.timeOffsets)
      t.count(`offset ${o.station}`, o.seconds, -(options.clockShiftSeconds?.[o.station] ?? 0), o.sigma);
    t.chi2('limb', fit.chi2, fit.dof);
  }
  t.print(title, (performance.now() - started) / 1000);
}

function ringCounts(t: Tally, prefix: string, ring: RingFitResult): void {
  t.count(`${prefix} radiusKm`, ring.radiusKm, RING.radiusKm, ring.uncertainty.radiusKm);
  t.count(
    `${prefix} openingAngleDeg`,
    ring.openingAngleDeg,
    RING.openingAngleDeg,
    ring.uncertainty.openingAngleDeg,
  );
  t.count(
    `${prefix} positionAngleDeg`,
    ring.positionAngleDeg,
    RING.positionAngleDeg,
    ring.uncertainty.positionAngleDeg,
  );
}

/**
 * The limb (five chords) and a ring about the same centre crossed on the same tracks, fitted three ways:
 * joint, "limb" (ring about the sequential limb's centre, whose error the ring's sigmas leave out) and
 * "free". With `oneSide` only the first dip of each track is kept (the ring seen on one side of the body),
 * where the ring's angles depend most on where its centre is.
 */
function ringCase(title: string, ringSigmaSeconds: number, oneSide: boolean): void {
  const joint = new Tally();
  const limbMode = new Tally();
  const freeMode = new Tally();
  const noise = gaussian(mulberry32(20261204));
  const started = performance.now();
  const ratio = {
    radiusKm: [] as number[],
    openingAngleDeg: [] as number[],
    positionAngleDeg: [] as number[],
  };
  for (let i = 0; i < REALISATIONS; i++) {
    const points = limbPoints({
      truth: TRUTH,
      velocity: VELOCITY,
      impactKm: FIVE,
      sigmaSeconds: SIGMA_S,
      noise,
    });
    const allDips: RingPoint[] = limbPoints({
      truth: RING_ELLIPSE,
      velocity: VELOCITY,
      impactKm: FIVE,
      sigmaSeconds: ringSigmaSeconds,
      noise,
    });
    const ringPoints = oneSide ? allDips.filter((_, k) => k % 2 === 0) : allDips;
    const input: LimbFitInput = {
      points,
      negatives: [],
      fixed: {},
      modelErrorKm: 0,
      fitTimeOffsets: [],
      seed: i + 1,
    };
    const limb = fitLimb(input);
    const centre = { fKm: limb.ellipse.centerFKm, gKm: limb.ellipse.centerGKm };
    const held = fitRing({ ring: 'R1', points: ringPoints, center: centre, seed: i + 1 });
    const j = fitLimbAndRings({
      limb: input,
      rings: [{ ring: 'R1', points: ringPoints }],
      start: { limb, rings: [held] },
    });
    countLimb(joint, j.limb);
    const ring = j.rings[0] as RingFitResult;
    ringCounts(joint, 'ring', ring);
    joint.chi2('limb', j.limb.chi2, j.limb.dof);
    joint.chi2('ring', ring.chi2, ring.dof);
    ringCounts(limbMode, 'ring', held);
    limbMode.count('ring centerFKm (limb σ)', held.centerFKm, TRUTH.centerFKm, limb.uncertainty.centerFKm);
    limbMode.chi2('ring', held.chi2, held.dof);
    if (!oneSide) {
      // Five dips on one side leave a free centre undetermined (five parameters, no degree of freedom).
      const free = fitRing({ ring: 'R1', points: ringPoints, center: null, seed: i + 1 });
      ringCounts(freeMode, 'ring', free);
      freeMode.count('ring centerFKm', free.centerFKm, TRUTH.centerFKm, free.uncertainty.centerFKm);
      freeMode.chi2('ring', free.chi2, free.dof);
    }
    for (const key of ['radiusKm', 'openingAngleDeg', 'positionAngleDeg'] as const)
      ratio[key].push(held.uncertainty[key] / ring.uncertainty[key]);
  }
  const seconds = (performance.now() - started) / 1000;
  joint.print(`${title}: joint`, seconds);
  limbMode.print('  the same data, "limb" mode (ring about the limb centre)', seconds);
  if (!oneSide) freeMode.print('  the same data, "free" mode (ring centre of its own)', seconds);
  const median = (v: number[]) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)] as number;
  console.log(
    `  median σ("limb") / σ(joint): R ${median(ratio.radiusKm).toFixed(2)}, B ${median(ratio.openingAngleDeg).toFixed(2)}, P ${median(ratio.positionAngleDeg).toFixed(2)}`,
  );
}

export default async function calibration(): Promise<void> {
  limbCase('9 chords (the test suite case)', NINE);
  limbCase('4 chords', [-250, -80, 90, 260]);
  limbCase('3 chords', [-200, 30, 250]);
  const north = edgeImpactKm(1);
  const south = edgeImpactKm(-1);
  limbCase(
    `5 chords, negatives 5 km outside the limb (impacts ${north.toFixed(0)} + 5, ${south.toFixed(0)} − 5 km)`,
    FIVE,
    {
      negatives: [
        negativePath({ truth: TRUTH, velocity: VELOCITY }, north + 5, 'N1'),
        negativePath({ truth: TRUTH, velocity: VELOCITY }, south - 5, 'N2'),
      ],
    },
  );
  limbCase('5 chords, position angle fixed at the truth', FIVE, {
    fixed: { positionAngleDeg: TRUTH.positionAngleDeg },
  });
  limbCase('9 chords, clock offsets of S2 (+0.8 s) and S7 (−0.5 s) fitted', NINE, {
    clockShiftSeconds: { S2: 0.8, S7: -0.5 },
  });
  ringCase('limb 5 chords + ring, both dips of each track, σt(ring) = 0.1 s', 0.1, false);
  ringCase('limb 5 chords + ring, one dip per track (one side), σt(ring) = 0.1 s', 0.1, true);
  await Promise.resolve();
}
