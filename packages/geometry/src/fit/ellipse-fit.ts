// The weighted fit of an apparent ellipse to sky-plane points, shared by the limb fit and the ring fit:
// effective-variance χ², deterministic starts, Levenberg–Marquardt refinement with negative paths held
// outside, the linearised covariance, and an ensemble sample of the region the data allow.
//
// Parameter vector (internal units): [centerFKm, centerGKm, semiMajorKm, oblateness, positionAngleRad,
// clock offsets in seconds...]. Only the free entries are handed to the minimiser and the sampler.

import { CholeskyDecomposition, Matrix } from 'ml-matrix';
import { DEG, PI, RAD, wrap } from '../math.js';
import { GeometryInputError } from '../types.js';
import type { LimbEllipse, SkyPointKm } from '../types.js';
import { algebraicEllipse } from './conic-start.js';
import {
  ALONG_FLOOR,
  type EllipseFrame,
  frameResidualGradient,
  frameResidualKm,
  pathClearance,
} from './ellipse.js';
import { normalMatrixCovariance } from './covariance.js';
import { type EnsembleDiagnostics, runEnsemble } from './ensemble-sampler.js';
import { type LeastSquaresProblem, jacobian, levenbergMarquardt } from './levenberg-marquardt.js';
import { gaussian, mulberry32 } from './prng.js';
import { MIN_EFFECTIVE_SAMPLES } from './sampler-diagnostics.js';

export const SHAPE_PARAMETER_COUNT = 5;
const IX_F = 0;
const IX_G = 1;
const IX_A = 2;
const IX_EPS = 3;
const IX_P = 4;
const SHAPE_NAMES = ['centre f', 'centre g', 'equatorial radius', 'oblateness', 'position angle'] as const;

/** Walkers and steps of the ensemble; see docs/method.md "Uncertainties" for how they were chosen. */
const SAMPLER_BURN_IN_STEPS = 150;
const SAMPLER_STEPS = 250;
/** The chain is doubled up to this many kept steps while a parameter has too few effective samples. */
const SAMPLER_MAX_STEPS = 4 * SAMPLER_STEPS;
const BAND_SIZE = 64;
/** Fraction of a normal distribution within ±1σ. */
export const ONE_SIGMA_MASS = 0.6826894921370859;
/** Standard deviation of an angle spread evenly over 180°: the most P can be uncertain. */
export const UNIFORM_HALF_TURN_SIGMA_RAD = PI / Math.sqrt(12);
/** Below this oblateness the linearised fit cannot see P (∂ρ/∂P vanishes at ε = 0). */
export const ROUND_OBLATENESS = 1e-3;
/** Negative paths are pushed this far (in units of the ellipse's own radius) outside so that the best fit clears. */
export const NEGATIVE_MARGIN = 1e-5;
export const PENALTY_WEIGHTS = [1e2, 1e4, 1e6];

export interface FitPoint {
  fKm: number;
  gKm: number;
  sigmaSeconds: number;
  velocityFKmPerS: number;
  velocityGKmPerS: number;
  /** Index into the clock offsets, or −1 when the point's station has no fitted offset. */
  offsetIndex: number;
}

export interface EllipseFitProblem {
  points: FitPoint[];
  negatives: SkyPointKm[][];
  /** Fixed values in internal units (position angle in radians), by shape parameter index. */
  fixed: Array<number | undefined>;
  modelErrorKm: number;
  offsetCount: number;
  seed: number;
  /** JSON path named in input errors about the points. */
  errorPath: string;
}

export interface EllipseFitOutcome {
  /** Full parameter vector of the best fit, normalised (ε in [0, 1), P in [0, π)). */
  best: Float64Array;
  free: number[];
  chi2: number;
  dof: number;
  residualsKm: number[];
  negativesClear: boolean;
  /** Full parameter vectors sampled from exp(−χ²/2), and their χ². */
  samples: SampleSet;
  /** Linearised 1-sigma of every full parameter (0 for fixed ones), internal units. */
  linearisedSigma: Float64Array;
  /** Acceptance, τ and effective sample size of the sampler, per entry of `free`. */
  sampler: EnsembleDiagnostics;
}

/** count full parameter vectors of width values each, in one buffer, with their χ². */
export interface SampleSet {
  count: number;
  width: number;
  values: Float64Array;
  chi2: Float64Array;
}

/** A derived quantity for every sample; fn reads the sample's parameter j as values[offset + j]. */
export function sampleMap(
  set: SampleSet,
  fn: (values: Float64Array, offset: number) => number,
): Float64Array {
  const out = new Float64Array(set.count);
  for (let i = 0; i < set.count; i++) out[i] = fn(set.values, i * set.width);
  return out;
}

export function sampleAt(set: SampleSet, i: number): Float64Array {
  return set.values.subarray(i * set.width, (i + 1) * set.width);
}

export function frameOf(full: Float64Array): EllipseFrame {
  const p = full[IX_P] as number;
  const a = full[IX_A] as number;
  return {
    centerFKm: full[IX_F] as number,
    centerGKm: full[IX_G] as number,
    semiMajorKm: a,
    semiMinorKm: a * (1 - (full[IX_EPS] as number)),
    cosP: Math.cos(p),
    sinP: Math.sin(p),
  };
}

export function ellipseOf(full: Float64Array): LimbEllipse {
  return {
    centerFKm: full[IX_F] as number,
    centerGKm: full[IX_G] as number,
    equatorialRadiusKm: full[IX_A] as number,
    oblateness: full[IX_EPS] as number,
    positionAngleDeg: wrap((full[IX_P] as number) * RAD, 180),
  };
}

/**
 * χ² = Σ ρ²/σρ² with σρ² = (σt·max(|v·∇ρ|, 0.1|v|))² + σmodel², and, when residuals is given, the
 * normalised residuals ρ/σρ written into it. The weight is re-evaluated at these parameters (effective
 * variance; Orear, Am. J. Phys. 50 (1982) 912).
 */
export function chi2Of(problem: EllipseFitProblem, full: Float64Array, residuals?: Float64Array): number {
  const fr = frameOf(full);
  const grad: [number, number, number] = [0, 0, 0];
  const m2 = problem.modelErrorKm * problem.modelErrorKm;
  let chi2 = 0;
  const pts = problem.points;
  for (let i = 0; i < pts.length; i++) {
    const p = pts[i] as FitPoint;
    const vf = p.velocityFKmPerS;
    const vg = p.velocityGKmPerS;
    let f = p.fKm;
    let g = p.gKm;
    if (p.offsetIndex >= 0) {
      const delta = full[SHAPE_PARAMETER_COUNT + p.offsetIndex] as number;
      f += vf * delta;
      g += vg * delta;
    }
    frameResidualGradient(f, g, fr, grad);
    const rho = grad[0];
    const along = Math.max(Math.abs(vf * grad[1] + vg * grad[2]), ALONG_FLOOR * Math.sqrt(vf * vf + vg * vg));
    const s = p.sigmaSeconds * along;
    const r = rho / Math.sqrt(s * s + m2);
    if (residuals) residuals[i] = r;
    chi2 += r * r;
  }
  return chi2;
}

export function residualsKmOf(problem: EllipseFitProblem, full: Float64Array): number[] {
  const fr = frameOf(full);
  return problem.points.map((p) => {
    const delta = p.offsetIndex >= 0 ? (full[SHAPE_PARAMETER_COUNT + p.offsetIndex] as number) : 0;
    return frameResidualKm(p.fKm + p.velocityFKmPerS * delta, p.gKm + p.velocityGKmPerS * delta, fr);
  });
}

export function minClearance(problem: EllipseFitProblem, fr: EllipseFrame): number {
  let q = Infinity;
  for (const path of problem.negatives) q = Math.min(q, pathClearance(path, fr));
  return q;
}

/**
 * The least-squares form of one ellipse problem: its free entries (those of `problem.fixed` left undefined;
 * a profile may hold clock offsets there too), and Levenberg–Marquardt refinement from a start with the
 * negative paths held outside by the penalty continuation (docs/method.md, "Negative chords").
 */
export interface EllipseRefiner {
  free: number[];
  toFull(x: Float64Array): Float64Array;
  toFree(full: Float64Array): Float64Array;
  /** The problem without the negative paths' penalty: its χ² is the fit's. */
  unconstrained: LeastSquaresProblem;
  /** Refines a full start vector; x holds the free entries of the result. */
  refine(startFull: Float64Array): { x: Float64Array; chi2: number; clear: boolean };
}

/** scaleKm sets the finite-difference steps of the lengths (10⁻⁶ of it). */
export function ellipseRefiner(problem: EllipseFitProblem, scaleKm: number): EllipseRefiner {
  const n = problem.points.length;
  const width = SHAPE_PARAMETER_COUNT + problem.offsetCount;
  const free: number[] = [];
  for (let j = 0; j < width; j++) if (problem.fixed[j] === undefined) free.push(j);
  const canSwapAxes = free.includes(IX_A) && free.includes(IX_EPS) && free.includes(IX_P);

  const toFull = (x: Float64Array): Float64Array => {
    const full = new Float64Array(width);
    for (let j = 0; j < width; j++) full[j] = problem.fixed[j] ?? 0;
    free.forEach((j, i) => (full[j] = x[i] as number));
    return full;
  };
  const toFree = (full: Float64Array): Float64Array => Float64Array.from(free, (j) => full[j] as number);
  const stepSizes = Float64Array.from(free, (j) =>
    j <= IX_A ? 1e-6 * scaleKm : j === IX_EPS || j === IX_P ? 1e-7 : (1e-6 * scaleKm) / maxSpeed(problem),
  );

  const admissible = (x: Float64Array): Float64Array | null => {
    const full = toFull(x);
    let a = full[IX_A] as number;
    let eps = full[IX_EPS] as number;
    let p = full[IX_P] as number;
    if (!(a > 0) || !(eps < 1)) return null;
    if (eps < 0) {
      if (canSwapAxes) {
        const b = a * (1 - eps);
        eps = 1 - a / b;
        a = b;
        p += PI / 2;
      } else {
        eps = 0;
      }
    }
    full[IX_A] = a;
    full[IX_EPS] = eps;
    full[IX_P] = free.includes(IX_P) ? wrap(p, PI) : p;
    return toFree(full);
  };

  const makeProblem = (penaltyWeight: number): LeastSquaresProblem => ({
    stepSizes,
    admissible,
    residuals: (x) => {
      const full = toFull(x);
      const out = new Float64Array(n + (penaltyWeight > 0 ? problem.negatives.length : 0));
      chi2Of(problem, full, out);
      if (penaltyWeight > 0) {
        const fr = frameOf(full);
        problem.negatives.forEach((path, i) => {
          out[n + i] = penaltyWeight * Math.max(0, 1 + NEGATIVE_MARGIN - pathClearance(path, fr));
        });
      }
      return out;
    },
  });

  const unconstrained = makeProblem(0);
  const refine = (startFull: Float64Array): { x: Float64Array; chi2: number; clear: boolean } => {
    let x = levenbergMarquardt(unconstrained, toFree(startFull)).x;
    let clear = minClearance(problem, frameOf(toFull(x))) >= 1;
    for (const weight of PENALTY_WEIGHTS) {
      if (clear) break;
      x = levenbergMarquardt(makeProblem(weight), x).x;
      clear = minClearance(problem, frameOf(toFull(x))) >= 1;
    }
    return { x, chi2: chi2Of(problem, toFull(x)), clear };
  };
  return { free, toFull, toFree, unconstrained, refine };
}

export function fitEllipse(problem: EllipseFitProblem): EllipseFitOutcome {
  const n = problem.points.length;
  let k = 0;
  for (let j = 0; j < SHAPE_PARAMETER_COUNT + problem.offsetCount; j++)
    if (problem.fixed[j] === undefined) k++;
  if (n < k)
    throw new GeometryInputError(problem.errorPath, `fewer points (${n}) than free parameters (${k})`);
  checkNotCollinear(problem);
  const starts = startingPoints(problem).map((e) => {
    const full = new Float64Array(SHAPE_PARAMETER_COUNT + problem.offsetCount);
    full.set([e.centerFKm, e.centerGKm, e.equatorialRadiusKm, e.oblateness, e.positionAngleDeg * DEG]);
    for (let j = 0; j < SHAPE_PARAMETER_COUNT; j++) full[j] = problem.fixed[j] ?? (full[j] as number);
    return full;
  });
  const refiner = ellipseRefiner(problem, Math.max(...starts.map((s) => s[IX_A] as number), 1));
  const { free, toFull, unconstrained } = refiner;

  let bestFree: Float64Array | null = null;
  let bestChi2 = Infinity;
  let bestClear = false;
  for (const start of starts) {
    const { x, chi2, clear } = refiner.refine(start);
    // A fit that honours the negative paths beats any that does not, whatever their χ².
    if ((clear && !bestClear) || (clear === bestClear && chi2 < bestChi2)) {
      bestFree = x;
      bestChi2 = chi2;
      bestClear = clear;
    }
  }
  if (!bestFree) throw new GeometryInputError(problem.errorPath, 'no starting ellipse could be found');
  const best = toFull(bestFree);

  const linearised = linearisedCovariance(problem, unconstrained, bestFree, free, best);
  const linearisedSigma = new Float64Array(best.length);
  free.forEach((j, i) => (linearisedSigma[j] = Math.sqrt(linearised.get(i, i))));
  if (free.includes(IX_P))
    linearisedSigma[IX_P] = Math.min(linearisedSigma[IX_P] as number, UNIFORM_HALF_TURN_SIGMA_RAD);

  const { samples, sampler } = sampleRegion(problem, free, best, bestFree, linearised, bestClear);
  return {
    best,
    free,
    chi2: bestChi2,
    dof: n - k,
    residualsKm: residualsKmOf(problem, best),
    negativesClear: bestClear,
    samples,
    linearisedSigma,
    sampler,
  };
}

export function maxSpeed(problem: EllipseFitProblem): number {
  let v = 0;
  for (const p of problem.points) v = Math.max(v, Math.hypot(p.velocityFKmPerS, p.velocityGKmPerS));
  return v > 0 ? v : 1;
}

/** Points on one straight line leave the ellipse free across that line. */
function checkNotCollinear(problem: EllipseFitProblem): void {
  const pts = problem.points;
  if (pts.length < 2) return;
  let mf = 0;
  let mg = 0;
  for (const p of pts) {
    mf += p.fKm;
    mg += p.gKm;
  }
  mf /= pts.length;
  mg /= pts.length;
  let sff = 0;
  let sgg = 0;
  let sfg = 0;
  for (const p of pts) {
    sff += (p.fKm - mf) ** 2;
    sgg += (p.gKm - mg) ** 2;
    sfg += (p.fKm - mf) * (p.gKm - mg);
  }
  const mean = (sff + sgg) / 2;
  const half = Math.hypot((sff - sgg) / 2, sfg);
  const smallest = mean - half;
  const largest = mean + half;
  if (largest === 0 || smallest <= 1e-12 * largest) {
    throw new GeometryInputError(
      problem.errorPath,
      'all timed points lie on one straight line, so the ellipse is not constrained across it',
    );
  }
}

/** The algebraic ellipse (if the points define one) and round starts at three pole angles. */
function startingPoints(problem: EllipseFitProblem): LimbEllipse[] {
  const pts = problem.points;
  const out: LimbEllipse[] = [];
  const conic = algebraicEllipse(pts);
  if (conic && conic.oblateness < 0.95) out.push(conic);
  const cf = pts.reduce((s, p) => s + p.fKm, 0) / pts.length;
  const cg = pts.reduce((s, p) => s + p.gKm, 0) / pts.length;
  const centerFKm = problem.fixed[IX_F] ?? cf;
  const centerGKm = problem.fixed[IX_G] ?? cg;
  const meanDistance =
    pts.reduce((s, p) => s + Math.hypot(p.fKm - centerFKm, p.gKm - centerGKm), 0) / pts.length;
  for (const pDeg of [0, 60, 120]) {
    out.push({
      centerFKm,
      centerGKm,
      equatorialRadiusKm: meanDistance,
      oblateness: 0.05,
      positionAngleDeg: pDeg,
    });
  }
  return out;
}

/**
 * (JᵀJ)⁻¹ with J the Jacobian of ρ/σρ at the best fit (Press et al., Numerical Recipes 3rd ed., §15.5.1),
 * negative paths ignored. When the ellipse is round P drops out (its column vanishes) and is given the
 * spread of an evenly distributed angle instead.
 */
function linearisedCovariance(
  problem: EllipseFitProblem,
  lsq: LeastSquaresProblem,
  bestFree: Float64Array,
  free: number[],
  best: Float64Array,
): Matrix {
  const jac = jacobian(lsq, bestFree);
  const pIndex = free.indexOf(IX_P);
  const dropP = pIndex >= 0 && (best[IX_EPS] as number) < ROUND_OBLATENESS;
  return normalMatrixCovariance(
    jac,
    new Map(dropP ? [[pIndex, UNIFORM_HALF_TURN_SIGMA_RAD ** 2]] : []),
    (column) => notConstrained(problem, free[column] as number),
  );
}

export function notConstrained(problem: EllipseFitProblem, fullIndex: number): GeometryInputError {
  const name =
    fullIndex < SHAPE_PARAMETER_COUNT
      ? SHAPE_NAMES[fullIndex as 0]
      : `clock offset ${fullIndex - SHAPE_PARAMETER_COUNT + 1}`;
  return new GeometryInputError(problem.errorPath, `the points do not constrain the ${name}`);
}

/**
 * Samples exp(−χ²/2) over ε in [0, 1), P within ±90° of the best fit (one period of the ellipse), a > 0
 * and, when the best fit clears them, every negative path outside the ellipse. Walkers start in a
 * Gaussian ball drawn from the linearised covariance, redrawn closer to the best fit when inadmissible.
 */
function sampleRegion(
  problem: EllipseFitProblem,
  free: number[],
  best: Float64Array,
  bestFree: Float64Array,
  cov: Matrix,
  enforceNegatives: boolean,
): { samples: SampleSet; sampler: EnsembleDiagnostics } {
  const k = free.length;
  const bestP = best[IX_P] as number;
  const scratch = new Float64Array(best);
  const logProbability = (x: Float64Array): number => {
    // One buffer for every evaluation: the sampler calls this ~10⁴ times per fit.
    const full = scratch;
    for (let i = 0; i < k; i++) full[free[i] as number] = x[i] as number;
    const a = full[IX_A] as number;
    const eps = full[IX_EPS] as number;
    const p = full[IX_P] as number;
    if (!(a > 0) || !(eps >= 0) || !(eps < 1) || !(Math.abs(p - bestP) <= PI / 2)) return -Infinity;
    if (enforceNegatives && problem.negatives.length > 0 && minClearance(problem, frameOf(full)) < 1)
      return -Infinity;
    return -0.5 * chi2Of(problem, full);
  };
  const uniform = mulberry32(problem.seed);
  const normal = gaussian(uniform);
  const factor = choleskyFactor(cov);
  const walkers = 2 * Math.max(12, 2 * k);
  const initial: Float64Array[] = [];
  for (let w = 0; w < walkers; w++) {
    let shrink = 1;
    let candidate = new Float64Array(bestFree);
    for (let attempt = 0; attempt < 200; attempt++) {
      if (attempt > 0 && attempt % 10 === 0) shrink /= 2;
      const z = Array.from({ length: k }, () => normal());
      const trial = new Float64Array(k);
      for (let i = 0; i < k; i++) {
        let s = 0;
        for (let j = 0; j <= i; j++) s += factor.get(i, j) * (z[j] as number);
        trial[i] = (bestFree[i] as number) + shrink * s;
      }
      if (logProbability(trial) > -Infinity) {
        candidate = trial;
        break;
      }
    }
    initial.push(candidate);
  }
  const run = runEnsemble({
    logProbability,
    initial,
    steps: SAMPLER_STEPS,
    burnIn: SAMPLER_BURN_IN_STEPS,
    uniform,
    minEffectiveSamples: MIN_EFFECTIVE_SAMPLES,
    maxSteps: SAMPLER_MAX_STEPS,
  });
  const count = run.logProbabilities.length;
  const width = best.length;
  const values = new Float64Array(count * width);
  for (let i = 0; i < count; i++) {
    values.set(best, i * width);
    for (let j = 0; j < k; j++) values[i * width + (free[j] as number)] = run.samples[i * k + j] as number;
  }
  return {
    samples: { count, width, values, chi2: run.logProbabilities.map((lp) => -2 * lp) },
    sampler: run.diagnostics,
  };
}

/** Lower-triangular L with LLᵀ = cov, or the square roots of the diagonal when cov is not positive definite. */
function choleskyFactor(cov: Matrix): Matrix {
  // Rounding in the inverse leaves cov a hair off symmetric, which the decomposition refuses.
  const symmetric = cov.add(cov.transpose()).div(2);
  const chol = new CholeskyDecomposition(symmetric);
  if (chol.isPositiveDefinite()) return chol.lowerTriangularMatrix;
  const diag = new Matrix(cov.rows, cov.rows);
  for (let i = 0; i < cov.rows; i++) diag.set(i, i, Math.sqrt(Math.max(cov.get(i, i), 0)));
  return diag;
}

/**
 * Half the width of the central 68.3 % of the values: the 1-sigma of a normal distribution, and a
 * fair one-number spread when the distribution is not normal.
 */
export function centralSigma(values: Float64Array): number {
  const work = new Float64Array(values);
  return (quantile(work, (1 + ONE_SIGMA_MASS) / 2) - quantile(work, (1 - ONE_SIGMA_MASS) / 2)) / 2;
}

/**
 * The q-quantile with linear interpolation between order statistics. Selection rather than a full sort
 * (Hoare, "Algorithm 65: FIND", Comm. ACM 4 (1961) 321): O(n), and a fit asks for about a dozen of them
 * over ~10⁴ samples. Reorders values.
 */
function quantile(values: Float64Array, q: number): number {
  const n = values.length;
  if (n === 0) return 0;
  const pos = q * (n - 1);
  const i = Math.floor(pos);
  const lo = select(values, i);
  if (i + 1 >= n) return lo;
  // After selection everything right of i is ≥ values[i], so the next order statistic is their minimum.
  let next = Infinity;
  for (let j = i + 1; j < n; j++) next = Math.min(next, values[j] as number);
  return lo + (pos - i) * (next - lo);
}

function select(values: Float64Array, k: number): number {
  let left = 0;
  let right = values.length - 1;
  while (left < right) {
    const pivot = values[(left + right) >> 1] as number;
    let i = left;
    let j = right;
    while (i <= j) {
      while ((values[i] as number) < pivot) i++;
      while ((values[j] as number) > pivot) j--;
      if (i <= j) {
        const t = values[i] as number;
        values[i] = values[j] as number;
        values[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else break;
  }
  return values[k] as number;
}

/** Up to BAND_SIZE samples from the 68.3 % of lowest χ², spread evenly through the chain. */
export function bandSamples(set: SampleSet): Float64Array[] {
  const limit = quantile(new Float64Array(set.chi2), ONE_SIGMA_MASS);
  const inside: number[] = [];
  for (let i = 0; i < set.count; i++) if ((set.chi2[i] as number) <= limit) inside.push(i);
  const count = Math.min(BAND_SIZE, inside.length);
  const out: Float64Array[] = [];
  for (let i = 0; i < count; i++)
    out.push(sampleAt(set, inside[Math.floor((i * inside.length) / count)] as number));
  return out;
}
