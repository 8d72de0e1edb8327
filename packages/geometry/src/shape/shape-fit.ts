// A body's 3D shape from the limb ellipses of several events: a triaxial ellipsoid (a, b, c along the
// body's x, y and spin axes) or, where the rotation phase is unknown, a spheroid (a = b), whose projected
// silhouettes match the events' apparent ellipses. Step in the data flow: several stored limb solutions
// -> this fit -> the comparison view's shape panel. Pure: plain objects in, plain objects out.
//
// Each event gives three measurements: the apparent semi-major axis a′ and the pair
// (ε cos 2P, ε sin 2P) of oblateness and semi-minor-axis position angle, which stays continuous as the
// ellipse turns round (P is undefined at ε = 0). Their residuals are whitened with the limb fit's
// covariance of a′, ε and P (L⁻¹r with LLᵀ the covariance; its 1-sigma alone for solutions without one).
// Parameters: ln a, ln b, ln c (positivity without bounds), the rotation phase W₀ when it is fitted, and
// the period when its 1-sigma is given (with a prior residual). Levenberg–Marquardt; 1-sigma from the
// linearised covariance (JᵀJ)⁻¹ at the minimum (Press et al., Numerical Recipes, 3rd ed., 2007, §15.5).
import { inverse, type Matrix } from 'ml-matrix';

import { ellipseRadiusKm } from '../fit/ellipse.js';
import { jacobian, levenbergMarquardt, type LeastSquaresProblem } from '../fit/levenberg-marquardt.js';
import { acos, DEG, RAD, TAU, wrap } from '../math.js';
import { GeometryInputError, type LimbEllipse } from '../types.js';
import { SECONDS_PER_HOUR } from '../dynamics/constants.js';
import { equilibriumDensityKgM3, jacobiEllipsoid, maclaurinOmega2 } from './equilibrium.js';
import { bodyToEquatorial, dot, skyBasis, unitVector, type Vec3 } from './frames.js';
import { projectEllipsoid, type SemiAxesKm } from './projection.js';

export interface ShapeEventInput {
  id: string;
  /** Mid-event time, ISO 8601 UTC ending in Z (the body's light time is the caller's to remove). */
  timeUtc: string;
  starRaDeg: number;
  starDecDeg: number;
  /** The event's fitted limb; its centre is not used. */
  limb: Pick<LimbEllipse, 'equatorialRadiusKm' | 'oblateness' | 'positionAngleDeg'>;
  /** 1-sigma of the limb fit; 0 marks a parameter held fixed there, which then measures nothing here. */
  sigma: { equatorialRadiusKm: number; oblateness: number; positionAngleDeg: number };
  /**
   * The limb fit's covariance of (equatorialRadiusKm, oblateness, positionAngleDeg), km and degrees, in
   * that order (the solution's limb.covariance rows 2–4). Without it the 1-sigma are taken as independent.
   */
  covariance?: number[][];
}

export interface ShapeFitInput {
  events: ShapeEventInput[];
  pole: { raDeg: number; decDeg: number };
  rotation: {
    periodHours: number;
    periodHoursSigma?: number;
    /** ISO 8601 UTC; the rotation angle W is phaseDeg at this instant. */
    referenceEpochUtc: string;
    /** W at the reference epoch (IAU sense: prime meridian from the node on the celestial equator); fitted
     * when absent in the triaxial model. */
    phaseDeg?: number;
  };
  model: 'triaxial' | 'spheroid';
}

export interface ShapeEventResult {
  id: string;
  /** Rotation angle W at the event (degrees, [0, 360)). */
  rotationAngleDeg: number;
  /** Angle between the spin axis and the direction toward the star (degrees). */
  aspectAngleDeg: number;
  model: Pick<LimbEllipse, 'equatorialRadiusKm' | 'oblateness' | 'positionAngleDeg'>;
  /** Whitened residuals (model − observed)/σ; null where the limb fit held the parameter fixed. */
  normalizedResiduals: {
    equatorialRadius: number | null;
    oblateness: number | null;
    positionAngle: number | null;
  };
  chi2: number;
  /** RMS over position angle of the radial gap between the model and observed ellipses (km). */
  rmsRadialKm: number;
}

export interface EquilibriumDensity {
  sequence: 'Maclaurin' | 'Jacobi';
  /** Ω²/(πGρ) of the member used. */
  omega2OverPiGRho: number;
  densityKgM3: number;
  densityKgM3Sigma: number;
  /** For Jacobi: the c/a the sequence requires at the fitted b/a, beside the fitted c/a. */
  cOverAOnSequence: number;
  cOverAFitted: number;
  caution: string;
}

export interface ShapeFitResult {
  model: 'triaxial' | 'spheroid';
  semiAxesKm: SemiAxesKm;
  uncertainty: SemiAxesKm & { phaseDeg: number; periodHours: number };
  phaseDeg: number | null;
  phaseFitted: boolean;
  periodHours: number;
  chi2: number;
  dof: number;
  events: ShapeEventResult[];
  equilibrium: EquilibriumDensity | null;
  warnings: string[];
  /**
   * The order a ≥ b ≥ c is enforced: `constraints` lists the equalities held to keep it ("b = a",
   * "c = b"; "c = a" for a spheroid), empty when the fit was in order; `unconstrainedSemiAxesKm` is the
   * fit before any was held.
   */
  axisOrder: { constraints: string[]; unconstrainedSemiAxesKm: SemiAxesKm };
  /** What a reader must know before using the axes: χ²/dof above 3, an order constraint that was held. */
  cautions: string[];
}

const CAUTION =
  'Assumes hydrostatic equilibrium (a homogeneous strengthless fluid in uniform rotation); a body with ' +
  'material strength or internal structure need not follow the sequence, so this density is a model value.';

interface PreparedEvent {
  id: string;
  path: string;
  dtSeconds: number;
  basis: { f: Vec3; g: Vec3; s: Vec3 };
  aKm: number;
  xObs: number;
  yObs: number;
  cos2P: number;
  sin2P: number;
  /** Which of (a′, ε along, 2εΔP across) this event measures (a parameter held fixed measures nothing). */
  measured: number[];
  /** Cholesky factor L of the measured components' covariance: residuals are whitened as L⁻¹r. */
  whiten: number[][];
  observed: ShapeEventResult['model'];
}

function parseUtcMs(path: string, iso: string): number {
  const ms = /Z$/.test(iso) ? Date.parse(iso) : Number.NaN;
  if (!Number.isFinite(ms))
    throw new GeometryInputError(path, `expected an ISO 8601 UTC time ending in Z, got "${iso}"`);
  return ms;
}

function prepare(input: ShapeFitInput): PreparedEvent[] {
  const epochMs = parseUtcMs('rotation.referenceEpochUtc', input.rotation.referenceEpochUtc);
  return input.events.map((event, i) => {
    const path = `events[${i}]`;
    const { equatorialRadiusKm: a, oblateness: eps, positionAngleDeg: pDeg } = event.limb;
    if (!(a > 0)) throw new GeometryInputError(`${path}.limb.equatorialRadiusKm`, 'must be greater than 0');
    if (!(eps >= 0 && eps < 1)) throw new GeometryInputError(`${path}.limb.oblateness`, 'must be in [0, 1)');
    for (const key of ['equatorialRadiusKm', 'oblateness', 'positionAngleDeg'] as const) {
      const s = event.sigma[key];
      if (!(s >= 0 && Number.isFinite(s)))
        throw new GeometryInputError(`${path}.sigma.${key}`, 'must be 0 or more');
    }
    const p2 = 2 * pDeg * DEG;
    // (a′, ε, P) → (a′, ε along, 2ε·P across): the across component of (ε cos 2P, ε sin 2P) moves by 2ε·δP.
    const scale = [1, 1, 2 * eps * DEG];
    const sig = [event.sigma.equatorialRadiusKm, event.sigma.oblateness, event.sigma.positionAngleDeg];
    const cov = event.covariance;
    if (
      cov !== undefined &&
      !(cov.length === 3 && cov.every((row) => row.length === 3 && row.every(Number.isFinite)))
    )
      throw new GeometryInputError(`${path}.covariance`, 'must be a 3 × 3 matrix of finite numbers');
    const measured = [0, 1, 2].filter((k) => (sig[k] as number) > 0 && (scale[k] as number) > 0);
    const entry = (i: number, j: number): number =>
      (scale[i] as number) *
      (scale[j] as number) *
      (cov ? ((cov[i] as number[])[j] as number) : i === j ? (sig[i] as number) ** 2 : 0);
    const whiten =
      cholesky(measured.map((i) => measured.map((j) => entry(i, j)))) ??
      // A covariance that rounding left not quite positive definite: fall back to the 1-sigma alone.
      measured.map((i, r) =>
        measured.map((_, c) => (r === c ? (scale[i] as number) * (sig[i] as number) : 0)),
      );
    return {
      id: event.id,
      path,
      dtSeconds: (parseUtcMs(`${path}.timeUtc`, event.timeUtc) - epochMs) / 1000,
      basis: skyBasis(event.starRaDeg * DEG, event.starDecDeg * DEG),
      aKm: a,
      xObs: eps * Math.cos(p2),
      yObs: eps * Math.sin(p2),
      cos2P: Math.cos(p2),
      sin2P: Math.sin(p2),
      measured,
      whiten,
      observed: { ...event.limb },
    };
  });
}

/** Axes held equal to keep the order a ≥ b ≥ c (docs/method.md, "Shape from several events"). */
interface Ties {
  /** b held equal to a (triaxial only; the spheroid has it by construction). */
  bToA: boolean;
  /** c held equal to b (to a for the spheroid). */
  cToB: boolean;
}

/** Parameter layout for one model: ln a, then ln b and ln c unless tied, the phase, the period. */
interface Layout {
  count: number;
  lnB: number | null;
  lnC: number | null;
  phase: number | null;
  period: number | null;
  triaxial: boolean;
}

function layoutFor(triaxial: boolean, ties: Ties, phaseFitted: boolean, periodFitted: boolean): Layout {
  let count = 1;
  const lnB = triaxial && !ties.bToA ? count++ : null;
  const lnC = ties.cToB ? null : count++;
  // With b = a the equator is a circle and the rotation phase has no effect on any silhouette.
  const phase = phaseFitted && !ties.bToA ? count++ : null;
  const period = periodFitted ? count++ : null;
  return { count, lnB, lnC, phase, period, triaxial };
}

function axesOf(x: Float64Array, layout: Layout): SemiAxesKm {
  const a = Math.exp(x[0] as number);
  const b = layout.lnB === null ? a : Math.exp(x[layout.lnB] as number);
  const c = layout.lnC === null ? b : Math.exp(x[layout.lnC] as number);
  return { aKm: a, bKm: b, cKm: c };
}

/** Lower-triangular L with LLᵀ = C (Cholesky–Banachiewicz), or null when C is not positive definite. */
function cholesky(c: number[][]): number[][] | null {
  const n = c.length;
  const l = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let sum = (c[i] as number[])[j] as number;
      for (let k = 0; k < j; k++)
        sum -= ((l[i] as number[])[k] as number) * ((l[j] as number[])[k] as number);
      if (i === j) {
        if (!(sum > 0)) return null;
        (l[i] as number[])[i] = Math.sqrt(sum);
      } else (l[i] as number[])[j] = sum / ((l[j] as number[])[j] as number);
    }
  }
  return l;
}

export const REDUCED_CHI2_CAUTION_LIMIT = 3;

export function fitShape(input: ShapeFitInput): ShapeFitResult {
  const events = prepare(input);
  const { pole, rotation, model } = input;
  if (!(rotation.periodHours > 0))
    throw new GeometryInputError('rotation.periodHours', 'must be greater than 0');
  const periodSigmaH = rotation.periodHoursSigma ?? 0;
  if (!(periodSigmaH >= 0)) throw new GeometryInputError('rotation.periodHoursSigma', 'must be 0 or more');
  const triaxial = model === 'triaxial';
  const phaseRequested = triaxial && rotation.phaseDeg === undefined;
  const periodFitted = triaxial && periodSigmaH > 0;
  const fixedPhaseRad = (rotation.phaseDeg ?? 0) * DEG;

  const poleRa = pole.raDeg * DEG;
  const poleDec = pole.decDeg * DEG;
  const spinAxis = unitVector(poleRa, poleDec);
  const phaseOf = (x: Float64Array, layout: Layout): number =>
    layout.phase === null ? fixedPhaseRad : (x[layout.phase] as number);
  const periodOf = (x: Float64Array, layout: Layout): number =>
    layout.period === null ? rotation.periodHours : rotation.periodHours + (x[layout.period] as number);
  const rotationAngle = (x: Float64Array, layout: Layout, e: PreparedEvent): number =>
    phaseOf(x, layout) + (TAU * e.dtSeconds) / (periodOf(x, layout) * SECONDS_PER_HOUR);

  const measurementCount = events.reduce((n, e) => n + e.measured.length, 0);
  const firstLayout = layoutFor(triaxial, { bToA: false, cToB: false }, phaseRequested, periodFitted);
  const firstFreeCount = firstLayout.count - (firstLayout.period === null ? 0 : 1);
  if (measurementCount < firstFreeCount) {
    throw new GeometryInputError(
      'events',
      `fewer measured limb parameters (${measurementCount}) than free shape parameters (${firstFreeCount})`,
    );
  }

  const apparent = (x: Float64Array, layout: Layout, e: PreparedEvent) =>
    projectEllipsoid(
      axesOf(x, layout),
      bodyToEquatorial(poleRa, poleDec, rotationAngle(x, layout, e)),
      e.basis,
    );

  /** Whitened residuals L⁻¹r of the measured components (a′, ε along, 2εΔP across), in that order. */
  const eventResiduals = (x: Float64Array, layout: Layout, e: PreparedEvent): number[] => {
    const m = apparent(x, layout, e);
    const eps = 1 - m.semiMinorKm / m.semiMajorKm;
    const dx = eps * Math.cos(2 * m.positionAngleRad) - e.xObs;
    const dy = eps * Math.sin(2 * m.positionAngleRad) - e.yObs;
    const full = [m.semiMajorKm - e.aKm, e.cos2P * dx + e.sin2P * dy, -e.sin2P * dx + e.cos2P * dy];
    const r = e.measured.map((k) => full[k] as number);
    // Forward substitution: w = L⁻¹ r.
    const w: number[] = [];
    for (let i = 0; i < r.length; i++) {
      let sum = r[i] as number;
      for (let k = 0; k < i; k++) sum -= ((e.whiten[i] as number[])[k] as number) * (w[k] as number);
      w.push(sum / ((e.whiten[i] as number[])[i] as number));
    }
    return w;
  };

  const problemFor = (layout: Layout): LeastSquaresProblem => ({
    residuals(x) {
      const out: number[] = [];
      for (const e of events) out.push(...eventResiduals(x, layout, e));
      if (layout.period !== null) out.push((x[layout.period] as number) / periodSigmaH);
      return Float64Array.from(out);
    },
    stepSizes: Float64Array.from({ length: layout.count }, (_, j) =>
      j === layout.phase ? 1e-5 : j === layout.period ? 1e-4 * periodSigmaH : 1e-6,
    ),
    admissible: (x) => (x.every(Number.isFinite) ? x : null),
  });

  // Starting axes from the observed ellipses: the largest apparent semi-major axis and the smallest
  // apparent semi-minor axis bracket the body's longest and shortest axes.
  const largest = Math.max(...events.map((e) => e.aKm));
  const smallestMinor = Math.min(...events.map((e) => e.aKm * (1 - e.observed.oblateness)));
  const mean = events.reduce((s, e) => s + e.aKm, 0) / events.length;
  const firstStarts = (layout: Layout): Float64Array[] => {
    const phases = layout.phase !== null ? Array.from({ length: 12 }, (_, k) => (k * Math.PI) / 12) : [0];
    return phases.map((w) => {
      const x = new Float64Array(layout.count);
      x[0] = Math.log(largest);
      if (layout.lnB !== null) x[layout.lnB] = Math.log(Math.min(mean, largest));
      if (layout.lnC !== null) x[layout.lnC] = Math.log(Math.min(smallestMinor, triaxial ? mean : largest));
      if (layout.phase !== null) x[layout.phase] = w;
      return x;
    });
  };
  const bestOf = (layout: Layout, starts: Float64Array[]) => {
    const problem = problemFor(layout);
    let best = levenbergMarquardt(problem, starts[0] as Float64Array);
    for (const start of starts.slice(1)) {
      const trial = levenbergMarquardt(problem, start);
      if (trial.chi2 < best.chi2) best = trial;
    }
    const x = Float64Array.from(best.x);
    if (layout.phase !== null && layout.lnB !== null) {
      // A quarter turn of the body swaps its x and y axes: keep a ≥ b by choosing that labelling.
      if ((x[layout.lnB] as number) > (x[0] as number)) {
        [x[0], x[layout.lnB]] = [x[layout.lnB] as number, x[0] as number];
        x[layout.phase] = (x[layout.phase] as number) + Math.PI / 2;
      }
      // The silhouette is unchanged by a half turn, so the phase is known modulo 180°.
      x[layout.phase] = wrap(x[layout.phase] as number, Math.PI);
    }
    return { x, chi2: best.chi2 };
  };

  // The order a ≥ b ≥ c is enforced, not relabelled: c lies along the given spin axis and a along the
  // body's x axis at the given or fitted phase, so an axis out of order is held equal to its neighbour
  // (the boundary of the allowed region) and the fit repeated, at most twice (active-set least squares;
  // Lawson & Hanson, Solving Least Squares Problems, 1974, ch. 23, from memory).
  const ties: Ties = { bToA: false, cToB: false };
  let layout = firstLayout;
  let fit = bestOf(layout, firstStarts(layout));
  const unconstrained = axesOf(fit.x, layout);
  for (let round = 0; round < 2; round++) {
    const axes = axesOf(fit.x, layout);
    const bOver = triaxial && !ties.bToA && axes.bKm > axes.aKm;
    const cOver = !ties.cToB && axes.cKm > axes.bKm;
    if (!bOver && !cOver) break;
    if (bOver) ties.bToA = true;
    if (cOver) ties.cToB = true;
    const next = layoutFor(triaxial, ties, phaseRequested, periodFitted);
    const start = new Float64Array(next.count);
    const mid = ties.cToB ? Math.log((axes.bKm + axes.cKm) / 2) : Math.log(axes.bKm);
    start[0] = ties.bToA ? Math.log((axes.aKm + axes.bKm) / 2) : Math.log(axes.aKm);
    if (next.lnB !== null) start[next.lnB] = ties.cToB ? mid : Math.log(axes.bKm);
    if (next.lnC !== null) start[next.lnC] = Math.log(axes.cKm);
    if (next.phase !== null) start[next.phase] = phaseOf(fit.x, layout);
    if (next.period !== null && layout.period !== null) start[next.period] = fit.x[layout.period] as number;
    const phaseStarts =
      next.phase !== null
        ? [
            start,
            ...firstStarts(next).map((s) =>
              Float64Array.from(s, (v, j) => (j === next.phase ? v : (start[j] as number))),
            ),
          ]
        : [start];
    layout = next;
    fit = bestOf(layout, phaseStarts);
  }
  const x = fit.x;
  const problem = problemFor(layout);
  const axes = axesOf(x, layout);
  const warnings: string[] = [];
  const cautions: string[] = [];
  const constraints = [...(ties.bToA ? ['b = a'] : []), ...(ties.cToB ? [triaxial ? 'c = b' : 'c = a'] : [])];
  if (constraints.length > 0) {
    const u = unconstrained;
    cautions.push(
      `The unconstrained fit gave a = ${u.aKm.toFixed(1)}, b = ${u.bKm.toFixed(1)}, c = ${u.cKm.toFixed(1)} km, ` +
        `out of the order a ≥ b ≥ c; the reported axes hold ${constraints.join(' and ')} (the nearest ` +
        'ordered shape), and their 1-sigma assume that constraint. A spin axis that is not the shortest ' +
        'axis, a wrong pole or period, or limb errors that are too small can cause this.',
    );
  }

  const jac = jacobian(problem, x);
  let covariance: Matrix;
  try {
    covariance = inverse(jac.transpose().mmul(jac));
  } catch {
    throw new GeometryInputError(
      'events',
      'the events do not constrain every shape parameter (singular normal matrix)',
    );
  }
  const variance = (j: number | null): number => (j === null ? 0 : covariance.get(j, j));
  if (![...Array(layout.count).keys()].every((j) => Number.isFinite(variance(j)) && variance(j) >= 0)) {
    throw new GeometryInputError(
      'events',
      'the events do not constrain every shape parameter (singular normal matrix)',
    );
  }
  // A tied axis moves with its partner: it reports the partner's relative 1-sigma.
  const lnBIndex = layout.lnB ?? 0;
  const lnCIndex = layout.lnC ?? lnBIndex;
  const uncertainty = {
    aKm: axes.aKm * Math.sqrt(variance(0)),
    bKm: axes.bKm * Math.sqrt(variance(lnBIndex)),
    cKm: axes.cKm * Math.sqrt(variance(lnCIndex)),
    phaseDeg: Math.sqrt(variance(layout.phase)) * RAD,
    periodHours: layout.period === null ? periodSigmaH : Math.sqrt(variance(layout.period)),
  };

  const freeCount = layout.count - (layout.period === null ? 0 : 1);
  const dof = measurementCount - freeCount;
  if (dof > 0 && fit.chi2 / dof > REDUCED_CHI2_CAUTION_LIMIT)
    cautions.push(
      `χ²/dof is ${(fit.chi2 / dof).toFixed(1)} (χ² = ${fit.chi2.toFixed(1)} for ${dof} degrees of freedom), ` +
        `above ${REDUCED_CHI2_CAUTION_LIMIT}: the limb ellipses differ from this ellipsoid by more than their ` +
        '1-sigma allow (a shape that is not an ellipsoid, a wrong pole, period or phase, or limb errors that ' +
        'are too small). The axes and their 1-sigma are not to be trusted as they stand.',
    );
  if (dof <= 0)
    cautions.push('No degrees of freedom are left: the 1-sigma rest on the limb fits\u2019 errors alone.');

  const eventResults = events.map((e): ShapeEventResult => {
    const m = apparent(x, layout, e);
    const modelEllipse = {
      equatorialRadiusKm: m.semiMajorKm,
      oblateness: 1 - m.semiMinorKm / m.semiMajorKm,
      positionAngleDeg: m.positionAngleRad * RAD,
    };
    const whitened = eventResiduals(x, layout, e);
    const byComponent: Array<number | null> = [null, null, null];
    e.measured.forEach((k, i) => (byComponent[k] = whitened[i] as number));
    const full = (el: ShapeEventResult['model']): LimbEllipse => ({ ...el, centerFKm: 0, centerGKm: 0 });
    let sum = 0;
    const n = 360;
    for (let k = 0; k < n; k++) {
      const angle = (TAU * k) / n;
      sum += (ellipseRadiusKm(full(modelEllipse), angle) - ellipseRadiusKm(full(e.observed), angle)) ** 2;
    }
    return {
      id: e.id,
      rotationAngleDeg: wrap(rotationAngle(x, layout, e), TAU) * RAD,
      aspectAngleDeg: acos(dot(spinAxis, e.basis.s)) * RAD,
      model: modelEllipse,
      normalizedResiduals: {
        equatorialRadius: byComponent[0] ?? null,
        oblateness: byComponent[1] ?? null,
        positionAngle: byComponent[2] ?? null,
      },
      chi2: whitened.reduce((s2, v) => s2 + v * v, 0),
      rmsRadialKm: Math.sqrt(sum / n),
    };
  });

  const phaseReported = triaxial && layout.phase !== null ? phaseOf(x, layout) * RAD : null;
  return {
    model,
    semiAxesKm: axes,
    uncertainty,
    phaseDeg: triaxial && !phaseRequested ? fixedPhaseRad * RAD : phaseReported,
    phaseFitted: layout.phase !== null,
    periodHours: periodOf(x, layout),
    chi2: fit.chi2,
    dof,
    events: eventResults,
    equilibrium: equilibriumFor(
      axes,
      layout,
      covariance,
      periodOf(x, layout),
      uncertainty.periodHours,
      warnings,
    ),
    warnings,
    axisOrder: { constraints, unconstrainedSemiAxesKm: unconstrained },
    cautions,
  };
}

/**
 * Density of the Maclaurin spheroid (a = b) or the Jacobi ellipsoid (at the fitted b/a) spinning with the
 * fitted period; 1-sigma by first order, with the derivatives in the axis logarithms by central differences.
 */
function equilibriumFor(
  axes: SemiAxesKm,
  layout: Layout,
  covariance: Matrix,
  periodHours: number,
  periodSigmaHours: number,
  warnings: string[],
): EquilibriumDensity | null {
  const periodS = periodHours * SECONDS_PER_HOUR;
  const jacobi = layout.triaxial && axes.bKm / axes.aKm < 0.999;
  const omega2 = (lnA: number, lnB: number, lnC: number): number => {
    if (jacobi) return jacobiEllipsoid(Math.exp(lnB - lnA)).omega2;
    const cOverA = Math.exp(lnC - lnA);
    return maclaurinOmega2(Math.sqrt(1 - cOverA * cOverA));
  };
  if (axes.cKm >= Math.min(axes.aKm, axes.bKm)) {
    warnings.push('no equilibrium density: a figure of equilibrium has its spin axis shortest');
    return null;
  }
  if (layout.triaxial && axes.bKm > axes.aKm) return null;
  const ln = [Math.log(axes.aKm), Math.log(axes.bKm), Math.log(axes.cKm)] as [number, number, number];
  const q = omega2(...ln);
  const density = equilibriumDensityKgM3(q, periodS);
  // ∂ ln ρ / ∂ ln(axis) = −∂ ln q / ∂ ln(axis); parameters 0..2 (triaxial) or 0 and 1 (a = b, c).
  const h = 1e-6;
  const dLnQ = ln.map((_, i) => {
    const up = [...ln] as typeof ln;
    const down = [...ln] as typeof ln;
    up[i] = (up[i] as number) + h;
    down[i] = (down[i] as number) - h;
    return (Math.log(omega2(...up)) - Math.log(omega2(...down))) / (2 * h);
  });
  // Each axis's logarithm is a parameter or tied to one (b to a, c to b): sum the derivatives per parameter.
  const indexOfB = layout.lnB ?? 0;
  const axisParameter = [0, indexOfB, layout.lnC ?? indexOfB];
  const gradient = new Map<number, number>();
  axisParameter.forEach((j, axis) => gradient.set(j, (gradient.get(j) ?? 0) + (dLnQ[axis] as number)));
  let relVar = 0;
  for (const [i, gi] of gradient) for (const [j, gj] of gradient) relVar += gi * gj * covariance.get(i, j);
  // ρ ∝ P⁻²; the period is independent of the axes except when fitted, where its covariance is small.
  relVar += ((2 * periodSigmaHours) / periodHours) ** 2;
  const cOverAOnSequence = jacobi ? jacobiEllipsoid(axes.bKm / axes.aKm).cOverA : axes.cKm / axes.aKm;
  if (jacobi && Math.abs(cOverAOnSequence - axes.cKm / axes.aKm) > 0.05) {
    warnings.push(
      `fitted c/a ${(axes.cKm / axes.aKm).toFixed(3)} is off the Jacobi sequence (${cOverAOnSequence.toFixed(3)} at this b/a)`,
    );
  }
  if (!jacobi && q > 0.3742)
    warnings.push('the Maclaurin spheroid is past the Jacobi bifurcation (secularly unstable)');
  return {
    sequence: jacobi ? 'Jacobi' : 'Maclaurin',
    omega2OverPiGRho: q,
    densityKgM3: density,
    densityKgM3Sigma: density * Math.sqrt(relVar),
    cOverAOnSequence,
    cOverAFitted: axes.cKm / axes.aKm,
    caution: CAUTION,
  };
}
