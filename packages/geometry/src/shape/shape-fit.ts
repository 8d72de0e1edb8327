// A body's 3D shape from the limb ellipses of several events: a triaxial ellipsoid (a, b, c along the
// body's x, y and spin axes) or, where the rotation phase is unknown, a spheroid (a = b), whose projected
// silhouettes match the events' apparent ellipses. Step in the data flow: several stored limb solutions
// -> this fit -> the comparison view's shape panel. Pure: plain objects in, plain objects out.
//
// Each event gives three measurements: the apparent semi-major axis a′ and the pair
// (ε cos 2P, ε sin 2P) of oblateness and semi-minor-axis position angle, which stays continuous as the
// ellipse turns round (P is undefined at ε = 0). Their residuals are whitened with the limb fit's 1-sigma
// of a′, ε and P taken as independent (the limb fit's correlations are not carried through the files).
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
  sigmaAKm: number;
  sigmaEps: number;
  /** 2·ε·σ_P: the 1-sigma across the (ε cos 2P, ε sin 2P) plane. */
  sigmaTurn: number;
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
      sigmaAKm: event.sigma.equatorialRadiusKm,
      sigmaEps: event.sigma.oblateness,
      sigmaTurn: 2 * eps * event.sigma.positionAngleDeg * DEG,
      observed: { ...event.limb },
    };
  });
}

/** Parameter layout for one model. */
interface Layout {
  count: number;
  phase: number | null;
  period: number | null;
  triaxial: boolean;
}

function axesOf(x: Float64Array, layout: Layout): SemiAxesKm {
  const a = Math.exp(x[0] as number);
  return layout.triaxial
    ? { aKm: a, bKm: Math.exp(x[1] as number), cKm: Math.exp(x[2] as number) }
    : { aKm: a, bKm: a, cKm: Math.exp(x[1] as number) };
}

export function fitShape(input: ShapeFitInput): ShapeFitResult {
  const events = prepare(input);
  const { pole, rotation, model } = input;
  if (!(rotation.periodHours > 0))
    throw new GeometryInputError('rotation.periodHours', 'must be greater than 0');
  const periodSigmaH = rotation.periodHoursSigma ?? 0;
  if (!(periodSigmaH >= 0)) throw new GeometryInputError('rotation.periodHoursSigma', 'must be 0 or more');
  const triaxial = model === 'triaxial';
  const phaseFitted = triaxial && rotation.phaseDeg === undefined;
  const fixedPhaseRad = (rotation.phaseDeg ?? 0) * DEG;

  let count = triaxial ? 3 : 2;
  const layout: Layout = {
    triaxial,
    phase: phaseFitted ? count++ : null,
    period: triaxial && periodSigmaH > 0 ? count++ : null,
    count: 0,
  };
  layout.count = count;

  const poleRa = pole.raDeg * DEG;
  const poleDec = pole.decDeg * DEG;
  const spinAxis = unitVector(poleRa, poleDec);
  const phaseOf = (x: Float64Array): number =>
    layout.phase === null ? fixedPhaseRad : (x[layout.phase] as number);
  const periodOf = (x: Float64Array): number =>
    layout.period === null ? rotation.periodHours : rotation.periodHours + (x[layout.period] as number);
  const rotationAngle = (x: Float64Array, e: PreparedEvent): number =>
    phaseOf(x) + (TAU * e.dtSeconds) / (periodOf(x) * SECONDS_PER_HOUR);

  const measurementCount = events.reduce(
    (n, e) => n + (e.sigmaAKm > 0 ? 1 : 0) + (e.sigmaEps > 0 ? 1 : 0) + (e.sigmaTurn > 0 ? 1 : 0),
    0,
  );
  const freeCount = layout.count - (layout.period === null ? 0 : 1);
  if (measurementCount < freeCount) {
    throw new GeometryInputError(
      'events',
      `fewer measured limb parameters (${measurementCount}) than free shape parameters (${freeCount})`,
    );
  }

  const apparent = (x: Float64Array, e: PreparedEvent) =>
    projectEllipsoid(axesOf(x, layout), bodyToEquatorial(poleRa, poleDec, rotationAngle(x, e)), e.basis);

  const eventResiduals = (
    x: Float64Array,
    e: PreparedEvent,
  ): [number | null, number | null, number | null] => {
    const m = apparent(x, e);
    const eps = 1 - m.semiMinorKm / m.semiMajorKm;
    const dx = eps * Math.cos(2 * m.positionAngleRad) - e.xObs;
    const dy = eps * Math.sin(2 * m.positionAngleRad) - e.yObs;
    return [
      e.sigmaAKm > 0 ? (m.semiMajorKm - e.aKm) / e.sigmaAKm : null,
      e.sigmaEps > 0 ? (e.cos2P * dx + e.sin2P * dy) / e.sigmaEps : null,
      e.sigmaTurn > 0 ? (-e.sin2P * dx + e.cos2P * dy) / e.sigmaTurn : null,
    ];
  };

  const problem: LeastSquaresProblem = {
    residuals(x) {
      const out: number[] = [];
      for (const e of events) for (const r of eventResiduals(x, e)) if (r !== null) out.push(r);
      if (layout.period !== null) out.push((x[layout.period] as number) / periodSigmaH);
      return Float64Array.from(out);
    },
    stepSizes: Float64Array.from({ length: layout.count }, (_, j) =>
      j === layout.phase ? 1e-5 : j === layout.period ? 1e-4 * periodSigmaH : 1e-6,
    ),
    admissible: (x) => (x.every(Number.isFinite) ? x : null),
  };

  // Starting axes from the observed ellipses: the largest apparent semi-major axis and the smallest
  // apparent semi-minor axis bracket the body's longest and shortest axes.
  const largest = Math.max(...events.map((e) => e.aKm));
  const smallestMinor = Math.min(...events.map((e) => e.aKm * (1 - e.observed.oblateness)));
  const mean = events.reduce((s, e) => s + e.aKm, 0) / events.length;
  const starts: Float64Array[] = [];
  const phases = phaseFitted ? Array.from({ length: 12 }, (_, k) => (k * Math.PI) / 12) : [0];
  for (const w of phases) {
    const x = new Float64Array(layout.count);
    x[0] = Math.log(largest);
    if (triaxial) {
      x[1] = Math.log(Math.min(mean, largest));
      x[2] = Math.log(Math.min(smallestMinor, mean));
    } else {
      x[1] = Math.log(Math.min(smallestMinor, largest));
    }
    if (layout.phase !== null) x[layout.phase] = w;
    starts.push(x);
  }
  let best = levenbergMarquardt(problem, starts[0] as Float64Array);
  for (const start of starts.slice(1)) {
    const trial = levenbergMarquardt(problem, start);
    if (trial.chi2 < best.chi2) best = trial;
  }

  const x = Float64Array.from(best.x);
  const warnings: string[] = [];
  if (layout.phase !== null) {
    // A quarter turn of the body swaps its x and y axes: keep a ≥ b by choosing that labelling.
    if ((x[1] as number) > (x[0] as number)) {
      [x[0], x[1]] = [x[1] as number, x[0] as number];
      x[layout.phase] = (x[layout.phase] as number) + Math.PI / 2;
    }
    // The silhouette is unchanged by a half turn, so the phase is known modulo 180°.
    x[layout.phase] = wrap(x[layout.phase] as number, Math.PI);
  }
  const axes = axesOf(x, layout);
  if (axes.bKm > axes.aKm)
    warnings.push('fitted b exceeds a: at the given phase the long axis lies along body y');
  if (axes.cKm > axes.bKm) warnings.push('fitted c exceeds b: the spin axis is not the shortest axis');

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
  const uncertainty = {
    aKm: axes.aKm * Math.sqrt(variance(0)),
    bKm: axes.bKm * Math.sqrt(variance(triaxial ? 1 : 0)),
    cKm: axes.cKm * Math.sqrt(variance(triaxial ? 2 : 1)),
    phaseDeg: Math.sqrt(variance(layout.phase)) * RAD,
    periodHours: layout.period === null ? periodSigmaH : Math.sqrt(variance(layout.period)),
  };

  const eventResults = events.map((e): ShapeEventResult => {
    const m = apparent(x, e);
    const modelEllipse = {
      equatorialRadiusKm: m.semiMajorKm,
      oblateness: 1 - m.semiMinorKm / m.semiMajorKm,
      positionAngleDeg: m.positionAngleRad * RAD,
    };
    const [ra, re, rp] = eventResiduals(x, e);
    const full = (el: ShapeEventResult['model']): LimbEllipse => ({ ...el, centerFKm: 0, centerGKm: 0 });
    let sum = 0;
    const n = 360;
    for (let k = 0; k < n; k++) {
      const angle = (TAU * k) / n;
      sum += (ellipseRadiusKm(full(modelEllipse), angle) - ellipseRadiusKm(full(e.observed), angle)) ** 2;
    }
    return {
      id: e.id,
      rotationAngleDeg: wrap(rotationAngle(x, e), TAU) * RAD,
      aspectAngleDeg: acos(dot(spinAxis, e.basis.s)) * RAD,
      model: modelEllipse,
      normalizedResiduals: { equatorialRadius: ra, oblateness: re, positionAngle: rp },
      chi2: (ra ?? 0) ** 2 + (re ?? 0) ** 2 + (rp ?? 0) ** 2,
      rmsRadialKm: Math.sqrt(sum / n),
    };
  });

  return {
    model,
    semiAxesKm: axes,
    uncertainty,
    phaseDeg: triaxial ? phaseOf(x) * RAD : null,
    phaseFitted,
    periodHours: periodOf(x),
    chi2: best.chi2,
    dof: measurementCount - freeCount,
    events: eventResults,
    equilibrium: equilibriumFor(axes, layout, covariance, periodOf(x), uncertainty.periodHours, warnings),
    warnings,
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
  const gradient = layout.triaxial
    ? [dLnQ[0] as number, dLnQ[1] as number, dLnQ[2] as number]
    : [(dLnQ[0] as number) + (dLnQ[1] as number), dLnQ[2] as number];
  let relVar = 0;
  for (let i = 0; i < gradient.length; i++) {
    for (let j = 0; j < gradient.length; j++)
      relVar += (gradient[i] as number) * (gradient[j] as number) * covariance.get(i, j);
  }
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
