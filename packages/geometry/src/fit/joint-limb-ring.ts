// The joint limb and ring fit (`fit.ring.centerFrom: "joint"`): the limb and every ring in one weighted
// least-squares problem with one shared centre, so that the rings' dips help fix the centre and the
// centre's error reaches the rings' radii, opening angles and poles. docs/method.md, "Joint limb and ring
// fit".
//
// Parameters (internal units): the five limb parameters [f₀, g₀, a, ε, P (rad)] (those held fixed stay
// out), one clock offset (s) per station of fitTimeOffsets, then (R, |B| (rad), P (rad)) per ring.
// Residuals: the limb points' effective-variance radial residuals ρ/σρ with σρ² = (σt·max(|v·∇ρ|,
// 0.1|v|))² + σmodel², then each ring's dips' ρ/σρ without the model error (Orear, Am. J. Phys. 50
// (1982) 912); a ring is the apparent ellipse of semi-axes R and R·sin|B| about (f₀, g₀). A fitted clock
// offset moves all of its station's times, ring dips included (docs/method.md, "Sky plane"). The fit
// starts from the sequential solution (limb first, rings about the limb's centre); 1-sigma from the
// linearised covariance (JᵀJ)⁻¹ of the whole weighted residual vector (Press et al., Numerical Recipes,
// 3rd ed., 2007, §15.5.1). Negative chords are held outside the limb as in the limb fit.

import { CholeskyDecomposition, Matrix } from 'ml-matrix';

import { DEG, PI, RAD, asin, wrap } from '../math.js';
import { GeometryInputError, type LimbEllipse, type ParameterCovariance } from '../types.js';
import { sigmasOf, subMatrix, normalMatrixCovariance } from './covariance.js';
import { pathClearance } from './ellipse.js';
import {
  type EllipseFitProblem,
  type FitPoint,
  NEGATIVE_MARGIN,
  PENALTY_WEIGHTS,
  ROUND_OBLATENESS,
  SHAPE_PARAMETER_COUNT,
  UNIFORM_HALF_TURN_SIGMA_RAD,
  chi2Of,
  ellipseOf,
  frameOf,
  maxSpeed,
  minClearance,
  residualsKmOf,
} from './ellipse-fit.js';
import { jacobian, levenbergMarquardt, type LeastSquaresProblem } from './levenberg-marquardt.js';
import {
  type LimbFitInput,
  type LimbFitResult,
  checkPoint,
  limbCovarianceParameters,
  limbProblem,
} from './limb-fit.js';
import { gaussian, mulberry32 } from './prng.js';
import { RING_COVARIANCE_PARAMETERS, type RingFitResult, type RingPoint } from './ring-fit.js';

const LIMB_NAMES = ['limb centre f', 'limb centre g', 'equatorial radius', 'oblateness', 'position angle'];
const BAND_SIZE = 64;
const BAND_DRAWS = 4096;
/**
 * Δχ² that holds 68.3 % of a normal distribution in ν = 1…5 dimensions (Press et al., Numerical Recipes,
 * 3rd ed., 2007, §15.6.5, table of Δχ² by confidence level and degrees of freedom): the band's ellipses are
 * the draws inside the joint 1-sigma region of the free limb parameters.
 */
const ONE_SIGMA_DELTA_CHI2 = [0, 1.0, 2.3, 3.53, 4.72, 5.89];

export interface JointRingInput {
  ring: string;
  points: RingPoint[];
}

export interface JointLimbRingInput {
  /** The limb fit's input, with the points of the projection before any fitted clock offset. */
  limb: LimbFitInput;
  /** Each ring's dips, projected like the limb points (clock offsets not yet applied). */
  rings: JointRingInput[];
  /** The sequential solution the joint fit starts from: the limb fit, then each ring about its centre. */
  start: {
    limb: Pick<LimbFitResult, 'ellipse' | 'timeOffsets'>;
    rings: Array<Pick<RingFitResult, 'radiusKm' | 'openingAngleDeg' | 'positionAngleDeg'>>;
  };
}

export interface JointRingResult extends RingFitResult {
  ring: string;
}

export interface JointLimbRingResult {
  limb: LimbFitResult;
  rings: JointRingResult[];
  /** The whole covariance, solution units, free and fixed parameters in `parameters` order. */
  covariance: ParameterCovariance;
}

export interface Layout {
  /** Length of the full vector: 5 limb + offsets + 3 per ring. */
  size: number;
  offsetCount: number;
  /** Index of ring r's R in the full vector (|B| and P follow). */
  ringStart: (r: number) => number;
  free: number[];
}

function ringPointsProblem(
  points: RingPoint[],
  offsetIndex: ReadonlyMap<string, number>,
  offsetCount: number,
  ring: string,
): EllipseFitProblem {
  const fitPoints: FitPoint[] = points.map((p) => {
    checkPoint(p, 0, 'ringEvents');
    return {
      fKm: p.fKm,
      gKm: p.gKm,
      sigmaSeconds: p.sigmaSeconds,
      velocityFKmPerS: p.velocity.f,
      velocityGKmPerS: p.velocity.g,
      offsetIndex: offsetIndex.get(p.station) ?? -1,
    };
  });
  return {
    points: fitPoints,
    negatives: [],
    fixed: [],
    modelErrorKm: 0,
    offsetCount,
    seed: 0,
    errorPath: `ringEvents (ring "${ring}")`,
  };
}

/** The full vector of the ellipse (centre, a, ε, P, offsets…) that chi2Of reads for ring r. */
function ringEllipseVector(full: Float64Array, layout: Layout, r: number, out: Float64Array): void {
  const i = layout.ringStart(r);
  out[0] = full[0] as number;
  out[1] = full[1] as number;
  out[2] = full[i] as number;
  out[3] = 1 - Math.sin(full[i + 1] as number);
  out[4] = full[i + 2] as number;
  for (let j = 0; j < layout.offsetCount; j++)
    out[SHAPE_PARAMETER_COUNT + j] = full[SHAPE_PARAMETER_COUNT + j] as number;
}

/**
 * The joint problem's least-squares form: its layout, the free entries (the limb's fixed parameters and the
 * entries of `held` stay out, at their given values; a χ² map holds two), the residual vector, and
 * Levenberg–Marquardt refinement from a start with the negative chords held outside the limb.
 */
export interface JointLeastSquares {
  layout: Layout;
  limbWidth: number;
  limbProb: EllipseFitProblem;
  nLimb: number;
  nAll: number;
  /** The sequential solution as a full vector (fixed and held entries in place). */
  startFull: Float64Array;
  toFull(x: Float64Array): Float64Array;
  toFree(full: Float64Array): Float64Array;
  unconstrained: LeastSquaresProblem;
  residualsInto(full: Float64Array, out: Float64Array): void;
  /** Refines from a vector of free entries; chi2 is that of the unpenalised residuals. */
  refine(startFree: Float64Array): { x: Float64Array; chi2: number; clear: boolean };
}

export function jointLeastSquares(
  input: JointLimbRingInput,
  held: ReadonlyMap<number, number> = new Map(),
): JointLeastSquares {
  const limbProb = limbProblem(input.limb);
  const offsetCount = limbProb.offsetCount;
  const offsetIndex = new Map(input.limb.fitTimeOffsets.map((s, i) => [s, i]));
  const ringProbs = input.rings.map((r) => ringPointsProblem(r.points, offsetIndex, offsetCount, r.ring));
  for (const r of input.rings) {
    const n = r.points.length;
    if (n < 3)
      throw new GeometryInputError(
        'ringEvents',
        `ring "${r.ring}": fewer points (${n}) than free parameters (3)`,
      );
  }
  const limbWidth = SHAPE_PARAMETER_COUNT + offsetCount;
  const layout: Layout = {
    size: limbWidth + 3 * input.rings.length,
    offsetCount,
    ringStart: (r) => limbWidth + 3 * r,
    free: [],
  };
  for (let j = 0; j < layout.size; j++)
    if ((j >= SHAPE_PARAMETER_COUNT || limbProb.fixed[j] === undefined) && !held.has(j)) layout.free.push(j);
  const free = layout.free;
  const nLimb = limbProb.points.length;
  const nRings = ringProbs.map((p) => p.points.length);
  const nAll = nLimb + nRings.reduce((s, n) => s + n, 0);
  if (nAll < free.length)
    throw new GeometryInputError('chords', `fewer points (${nAll}) than free parameters (${free.length})`);

  // The sequential solution: limb (and clock offsets) first, then each ring about the limb's centre.
  const startFull = new Float64Array(layout.size);
  const s = input.start.limb;
  startFull.set([
    s.ellipse.centerFKm,
    s.ellipse.centerGKm,
    s.ellipse.equatorialRadiusKm,
    s.ellipse.oblateness,
    s.ellipse.positionAngleDeg * DEG,
  ]);
  s.timeOffsets.forEach((o, i) => (startFull[SHAPE_PARAMETER_COUNT + i] = o.seconds));
  input.start.rings.forEach((r, k) => {
    const i = layout.ringStart(k);
    startFull[i] = r.radiusKm;
    startFull[i + 1] = r.openingAngleDeg * DEG;
    startFull[i + 2] = r.positionAngleDeg * DEG;
  });
  const fixedFull = new Float64Array(startFull);
  for (let j = 0; j < SHAPE_PARAMETER_COUNT; j++) {
    const v = limbProb.fixed[j];
    if (v !== undefined) fixedFull[j] = v;
  }
  for (const [j, v] of held) fixedFull[j] = v;

  const toFull = (x: Float64Array): Float64Array => {
    const full = new Float64Array(fixedFull);
    free.forEach((j, i) => (full[j] = x[i] as number));
    return full;
  };
  const toFree = (full: Float64Array): Float64Array => Float64Array.from(free, (j) => full[j] as number);
  const canSwapAxes = [2, 3, 4].every((j) => free.includes(j));

  const admissible = (x: Float64Array): Float64Array | null => {
    const full = toFull(x);
    let a = full[2] as number;
    let eps = full[3] as number;
    let p = full[4] as number;
    if (!(a > 0) || !(eps < 1)) return null;
    if (eps < 0) {
      // The same ellipse with its axes swapped, as in the limb fit.
      if (canSwapAxes) {
        const b = a * (1 - eps);
        eps = 1 - a / b;
        a = b;
        p += PI / 2;
      } else {
        eps = 0;
      }
    }
    full[2] = a;
    full[3] = eps;
    full[4] = free.includes(4) ? wrap(p, PI) : p;
    for (let r = 0; r < input.rings.length; r++) {
      const i = layout.ringStart(r);
      const sinB = Math.abs(Math.sin(full[i + 1] as number));
      if (!((full[i] as number) > 0) || !(sinB > 1e-9)) return null;
      // |B| and P enter only through sin|B| and the axis direction: fold them into [0, π/2] and [0, π).
      full[i + 1] = asin(sinB);
      full[i + 2] = wrap(full[i + 2] as number, PI);
    }
    return toFree(full);
  };

  const scaleKm = Math.max(startFull[2] as number, 1);
  const speed = Math.max(maxSpeed(limbProb), ...ringProbs.map((p) => maxSpeed(p)));
  const stepSizes = Float64Array.from(free, (j) => {
    if (j <= 2) return 1e-6 * scaleKm;
    if (j < SHAPE_PARAMETER_COUNT) return 1e-7;
    if (j < limbWidth) return (1e-6 * scaleKm) / speed;
    const within = (j - limbWidth) % 3;
    return within === 0 ? 1e-6 * Math.max(startFull[j] as number, 1) : 1e-7;
  });

  const limbBuffer = new Float64Array(limbWidth);
  const ringBuffer = new Float64Array(limbWidth);
  const residualsInto = (full: Float64Array, out: Float64Array): void => {
    limbBuffer.set(full.subarray(0, limbWidth));
    chi2Of(limbProb, limbBuffer, out.subarray(0, nLimb));
    let at = nLimb;
    ringProbs.forEach((prob, r) => {
      ringEllipseVector(full, layout, r, ringBuffer);
      chi2Of(prob, ringBuffer, out.subarray(at, at + prob.points.length));
      at += prob.points.length;
    });
  };
  const makeProblem = (penaltyWeight: number): LeastSquaresProblem => ({
    stepSizes,
    admissible,
    residuals: (x) => {
      const full = toFull(x);
      const out = new Float64Array(nAll + (penaltyWeight > 0 ? limbProb.negatives.length : 0));
      residualsInto(full, out);
      if (penaltyWeight > 0) {
        const fr = frameOf(full.subarray(0, limbWidth));
        limbProb.negatives.forEach((path, i) => {
          out[nAll + i] = penaltyWeight * Math.max(0, 1 + NEGATIVE_MARGIN - pathClearance(path, fr));
        });
      }
      return out;
    },
  });
  const clearOf = (x: Float64Array): boolean =>
    minClearance(limbProb, frameOf(toFull(x).subarray(0, limbWidth))) >= 1;

  const unconstrained = makeProblem(0);
  const refine = (startFree: Float64Array): { x: Float64Array; chi2: number; clear: boolean } => {
    let x = levenbergMarquardt(unconstrained, startFree).x;
    let clear = clearOf(x);
    for (const weight of PENALTY_WEIGHTS) {
      if (clear) break;
      x = levenbergMarquardt(makeProblem(weight), x).x;
      clear = clearOf(x);
    }
    const out = new Float64Array(nAll);
    residualsInto(toFull(x), out);
    let chi2 = 0;
    for (const r of out) chi2 += r * r;
    return { x, chi2, clear };
  };
  return {
    layout,
    limbWidth,
    limbProb,
    nLimb,
    nAll,
    startFull: fixedFull,
    toFull,
    toFree,
    unconstrained,
    residualsInto,
    refine,
  };
}

export function fitLimbAndRings(input: JointLimbRingInput): JointLimbRingResult {
  const {
    layout,
    limbWidth,
    limbProb,
    nLimb,
    nAll,
    startFull,
    toFull,
    unconstrained,
    residualsInto,
    refine,
  } = jointLeastSquares(input);
  const free = layout.free;
  const limbFreeCount = free.filter((j) => j < limbWidth).length;
  const { x, clear } = refine(Float64Array.from(free, (j) => startFull[j] as number));
  const best = toFull(x);

  // Round ellipses cannot show their position angle: that column is left out and P gets the spread of an
  // angle uniform over 180°, as in the limb fit.
  const dropped = new Map<number, number>();
  const limbP = free.indexOf(4);
  if (limbP >= 0 && (best[3] as number) < ROUND_OBLATENESS)
    dropped.set(limbP, UNIFORM_HALF_TURN_SIGMA_RAD ** 2);
  input.rings.forEach((_, r) => {
    const i = layout.ringStart(r);
    if (1 - Math.sin(best[i + 1] as number) < ROUND_OBLATENESS)
      dropped.set(free.indexOf(i + 2), UNIFORM_HALF_TURN_SIGMA_RAD ** 2);
  });
  const nameOf = (j: number): { path: string; name: string } => {
    if (j < SHAPE_PARAMETER_COUNT) return { path: 'chords', name: LIMB_NAMES[j] as string };
    if (j < limbWidth)
      return {
        path: 'chords',
        name: `clock offset of station "${input.limb.fitTimeOffsets[j - SHAPE_PARAMETER_COUNT]}"`,
      };
    const r = Math.floor((j - limbWidth) / 3);
    const what = ['radius', 'opening angle', 'position angle'][(j - limbWidth) % 3] as string;
    return { path: 'ringEvents', name: `${what} of ring "${input.rings[r]?.ring}"` };
  };
  const freeCov = normalMatrixCovariance(jacobian(unconstrained, x), dropped, (column) => {
    const { path, name } = nameOf(free[column] as number);
    return new GeometryInputError(path, `the limb and ring points together do not constrain the ${name}`);
  });

  // The whole covariance in solution units: angles in degrees, fixed parameters as zero rows.
  const unit = Float64Array.from({ length: layout.size }, (_, j) =>
    j === 4 || (j >= limbWidth && (j - limbWidth) % 3 !== 0) ? RAD : 1,
  );
  const fullCov = Array.from({ length: layout.size }, () => new Array<number>(layout.size).fill(0));
  // Averaged with its transpose: the inverse leaves the two triangles a rounding error apart.
  free.forEach((ji, a) =>
    free.forEach((jj, b) => {
      const c = (freeCov.get(a, b) + freeCov.get(b, a)) / 2;
      (fullCov[ji] as number[])[jj] = c * (unit[ji] as number) * (unit[jj] as number);
    }),
  );
  const sigma = sigmasOf(fullCov);
  sigma[4] = Math.min(sigma[4] as number, UNIFORM_HALF_TURN_SIGMA_RAD * RAD);

  const residuals = new Float64Array(nAll);
  residualsInto(best, residuals);
  const sumSquares = (from: number, to: number): number => {
    let c = 0;
    for (let i = from; i < to; i++) c += (residuals[i] as number) ** 2;
    return c;
  };

  const limbFull = best.subarray(0, limbWidth);
  const ellipse = ellipseOf(limbFull);
  const a = ellipse.equatorialRadiusKm;
  const eps = ellipse.oblateness;
  // r_eq = a·√(1 − ε): first-order propagation with ∂/∂a = √(1 − ε), ∂/∂ε = −a/(2√(1 − ε)).
  const dA = Math.sqrt(1 - eps);
  const dE = -a / (2 * Math.sqrt(1 - eps));
  const cAA = (fullCov[2] as number[])[2] as number;
  const cEE = (fullCov[3] as number[])[3] as number;
  const cAE = (fullCov[2] as number[])[3] as number;
  const equivalentSigma = Math.sqrt(Math.max(0, dA * dA * cAA + 2 * dA * dE * cAE + dE * dE * cEE));
  const limbIndices = Array.from({ length: limbWidth }, (_, j) => j);
  const limbUncertainty = {
    centerFKm: sigma[0] as number,
    centerGKm: sigma[1] as number,
    equatorialRadiusKm: sigma[2] as number,
    oblateness: sigma[3] as number,
    positionAngleDeg: sigma[4] as number,
  };
  const limbResiduals = residualsKmOf(limbProb, limbFull);
  const limb: LimbFitResult = {
    ellipse,
    equivalentRadiusKm: a * Math.sqrt(1 - eps),
    uncertainty: { ...limbUncertainty, equivalentRadiusKm: equivalentSigma },
    chi2: sumSquares(0, nLimb),
    dof: nLimb - limbFreeCount,
    residuals: input.limb.points.map((p, i) => ({
      station: p.station,
      event: p.event,
      residualKm: limbResiduals[i] as number,
    })),
    negativeChordsClear: clear,
    timeOffsets: input.limb.fitTimeOffsets.map((station, i) => ({
      station,
      seconds: best[SHAPE_PARAMETER_COUNT + i] as number,
      sigma: sigma[SHAPE_PARAMETER_COUNT + i] as number,
    })),
    band: bandOf(limbProb, best, fullCov, free, clear, input.limb.seed),
    linearisedSigma: limbUncertainty,
    covariance: {
      parameters: limbCovarianceParameters(input.limb.fitTimeOffsets),
      matrix: subMatrix(fullCov, limbIndices),
    },
  };

  let at = nLimb;
  const rings = input.rings.map((r, k): JointRingResult => {
    const i = layout.ringStart(k);
    const n = r.points.length;
    const chi2 = sumSquares(at, at + n);
    at += n;
    const indices = [0, 1, i, i + 1, i + 2];
    return {
      ring: r.ring,
      centerFKm: best[0] as number,
      centerGKm: best[1] as number,
      radiusKm: best[i] as number,
      openingAngleDeg: (best[i + 1] as number) * RAD,
      positionAngleDeg: wrap((best[i + 2] as number) * RAD, 180),
      uncertainty: {
        radiusKm: sigma[i] as number,
        openingAngleDeg: sigma[i + 1] as number,
        positionAngleDeg: Math.min(sigma[i + 2] as number, UNIFORM_HALF_TURN_SIGMA_RAD * RAD),
        centerFKm: sigma[0] as number,
        centerGKm: sigma[1] as number,
      },
      chi2,
      dof: n - 3,
      covariance: { parameters: [...RING_COVARIANCE_PARAMETERS], matrix: subMatrix(fullCov, indices) },
    };
  });

  return {
    limb,
    rings,
    covariance: {
      parameters: [
        ...limbCovarianceParameters(input.limb.fitTimeOffsets),
        ...input.rings.flatMap((r) =>
          ['radiusKm', 'openingAngleDeg', 'positionAngleDeg'].map((p) => `ring ${r.ring} ${p}`),
        ),
      ],
      matrix: fullCov,
    },
  };
}

/**
 * Up to 64 ellipses drawn from the normal distribution of the free limb parameters (the joint fit's
 * covariance, clock offsets and rings marginalised), kept when inside the joint 1-sigma region
 * (Mahalanobis distance² ≤ the 68.3 % Δχ²), admissible, and clear of the negative paths when the best fit is.
 */
function bandOf(
  problem: EllipseFitProblem,
  best: Float64Array,
  fullCov: number[][],
  free: number[],
  enforceNegatives: boolean,
  seed: number,
): LimbEllipse[] {
  const shape = free.filter((j) => j < SHAPE_PARAMETER_COUNT);
  const k = shape.length;
  if (k === 0) return [];
  const toInternal = (j: number): number => (j === 4 ? DEG : 1);
  const block = new Matrix(
    shape.map((i) =>
      shape.map((j) => ((fullCov[i] as number[])[j] as number) * toInternal(i) * toInternal(j)),
    ),
  );
  const chol = new CholeskyDecomposition(block.add(block.transpose()).div(2));
  if (!chol.isPositiveDefinite()) return [];
  const lower = chol.lowerTriangularMatrix;
  const normal = gaussian(mulberry32(seed));
  const limit = ONE_SIGMA_DELTA_CHI2[k] as number;
  const out: LimbEllipse[] = [];
  const trial = new Float64Array(best.subarray(0, SHAPE_PARAMETER_COUNT));
  for (let draw = 0; draw < BAND_DRAWS && out.length < BAND_SIZE; draw++) {
    const z = Array.from({ length: k }, () => normal());
    if (z.reduce((s, v) => s + v * v, 0) > limit) continue;
    trial.set(best.subarray(0, SHAPE_PARAMETER_COUNT));
    shape.forEach((j, r) => {
      let d = 0;
      for (let c = 0; c <= r; c++) d += lower.get(r, c) * (z[c] as number);
      trial[j] = (trial[j] as number) + d;
    });
    const eps = trial[3] as number;
    if (!((trial[2] as number) > 0) || !(eps >= 0 && eps < 1)) continue;
    if (enforceNegatives && problem.negatives.length > 0 && minClearance(problem, frameOf(trial)) < 1)
      continue;
    out.push(ellipseOf(trial));
  }
  return out;
}
