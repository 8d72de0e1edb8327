// The limb fit: a 5-parameter apparent ellipse (plus optional per-station clock offsets) fitted to the
// disappearance and reappearance points of the positive chords, kept clear of the negative chords.

import { DEG, RAD } from '../math.js';
import { GeometryInputError, LIMB_PARAMETERS } from '../types.js';
import type {
  LimbEllipse,
  LimbParameter,
  ParameterCovariance,
  SamplerDiagnostics,
  SkyPointKm,
  VelocityKmPerS,
} from '../types.js';
import { sampledCovariance } from './covariance.js';
import {
  type EllipseFitProblem,
  type FitPoint,
  SHAPE_PARAMETER_COUNT,
  bandSamples,
  centralSigma,
  chi2Of,
  ellipseOf,
  fitEllipse,
  sampleMap,
} from './ellipse-fit.js';
import { equivalentRadiusKm } from './ellipse.js';
import { samplerDiagnostics } from './sampler-diagnostics.js';

export interface LimbPoint {
  station: string;
  event: 'disappearance' | 'reappearance';
  fKm: number;
  gKm: number;
  sigmaSeconds: number;
  velocity: VelocityKmPerS;
}

export interface NegativePath {
  station: string;
  pathKm: SkyPointKm[];
}

export interface LimbFitInput {
  points: LimbPoint[];
  negatives: NegativePath[];
  fixed: Partial<Record<LimbParameter, number>>;
  modelErrorKm: number;
  fitTimeOffsets: string[];
  seed: number;
}

export interface LimbFitResult {
  ellipse: LimbEllipse;
  equivalentRadiusKm: number;
  uncertainty: LimbEllipse & { equivalentRadiusKm: number };
  chi2: number;
  dof: number;
  residuals: Array<{ station: string; event: 'disappearance' | 'reappearance'; residualKm: number }>;
  negativeChordsClear: boolean;
  timeOffsets: Array<{ station: string; seconds: number; sigma: number }>;
  band: LimbEllipse[];
  linearisedSigma: LimbEllipse;
  /** Sample correlations scaled by the reported 1-sigma; order as limbCovarianceParameters. */
  covariance: ParameterCovariance;
  /** Acceptance, τ and effective samples of the free parameters; absent when the 1-sigma were not sampled. */
  sampler?: SamplerDiagnostics;
}

/** Names of the limb covariance's rows: the five shape parameters, then each fitted clock offset. */
export function limbCovarianceParameters(fitTimeOffsets: readonly string[]): string[] {
  return [...LIMB_PARAMETERS, ...fitTimeOffsets.map((station) => `timeOffsetSeconds ${station}`)];
}

export function fitLimb(input: LimbFitInput): LimbFitResult {
  const problem = limbProblem(input);
  const outcome = fitEllipse(problem);
  const best = outcome.best;
  const ellipse = ellipseOf(best);
  const bestP = best[4] as number;
  const sigmaOf = (j: number): number =>
    outcome.free.includes(j) ? centralSigma(sampleMap(outcome.samples, (v, o) => v[o + j] as number)) : 0;
  const free = outcome.free;
  const uncertainty = {
    centerFKm: sigmaOf(0),
    centerGKm: sigmaOf(1),
    equatorialRadiusKm: sigmaOf(2),
    oblateness: sigmaOf(3),
    positionAngleDeg: free.includes(4)
      ? centralSigma(sampleMap(outcome.samples, (v, o) => ((v[o + 4] as number) - bestP) * RAD))
      : 0,
    equivalentRadiusKm:
      free.includes(2) || free.includes(3)
        ? centralSigma(
            sampleMap(outcome.samples, (v, o) => (v[o + 2] as number) * Math.sqrt(1 - (v[o + 3] as number))),
          )
        : 0,
  };
  const lin = outcome.linearisedSigma;
  const offsetSigmas = input.fitTimeOffsets.map((_, i) => sigmaOf(SHAPE_PARAMETER_COUNT + i));
  const columns = [0, 1, 2, 3, 4, ...input.fitTimeOffsets.map((_, i) => SHAPE_PARAMETER_COUNT + i)].map((j) =>
    sampleMap(outcome.samples, (v, o) =>
      j === 4 ? ((v[o + 4] as number) - bestP) * RAD : (v[o + j] as number),
    ),
  );
  const covariance: ParameterCovariance = {
    parameters: limbCovarianceParameters(input.fitTimeOffsets),
    matrix: sampledCovariance(columns, [
      uncertainty.centerFKm,
      uncertainty.centerGKm,
      uncertainty.equatorialRadiusKm,
      uncertainty.oblateness,
      uncertainty.positionAngleDeg,
      ...offsetSigmas,
    ]),
  };
  return {
    ellipse,
    equivalentRadiusKm: equivalentRadiusKm(ellipse),
    uncertainty,
    chi2: outcome.chi2,
    dof: outcome.dof,
    residuals: input.points.map((p, i) => ({
      station: p.station,
      event: p.event,
      residualKm: outcome.residualsKm[i] as number,
    })),
    negativeChordsClear: outcome.negativesClear,
    timeOffsets: input.fitTimeOffsets.map((station, i) => ({
      station,
      seconds: best[SHAPE_PARAMETER_COUNT + i] as number,
      sigma: offsetSigmas[i] as number,
    })),
    band: bandSamples(outcome.samples).map(ellipseOf),
    linearisedSigma: {
      centerFKm: lin[0] as number,
      centerGKm: lin[1] as number,
      equatorialRadiusKm: lin[2] as number,
      oblateness: lin[3] as number,
      positionAngleDeg: (lin[4] as number) * RAD,
    },
    covariance,
    sampler: samplerDiagnostics(
      outcome.sampler,
      free.map((j) => covariance.parameters[j] as string),
    ),
  };
}

/**
 * χ² of the limb points for a given ellipse (and clock offsets, in the order of input.fitTimeOffsets),
 * without the negative paths. The returned function does the per-call work only, so that a benchmark can
 * count evaluations per second.
 */
export function limbChi2Function(
  input: LimbFitInput,
): (e: LimbEllipse, timeOffsetsSeconds?: number[]) => number {
  const problem = limbProblem(input);
  return (e, timeOffsetsSeconds = []) => {
    const full = new Float64Array(SHAPE_PARAMETER_COUNT + problem.offsetCount);
    full.set([e.centerFKm, e.centerGKm, e.equatorialRadiusKm, e.oblateness, e.positionAngleDeg * DEG]);
    timeOffsetsSeconds.forEach((d, i) => (full[SHAPE_PARAMETER_COUNT + i] = d));
    return chi2Of(problem, full);
  };
}

export function limbChi2(e: LimbEllipse, input: LimbFitInput): number {
  return limbChi2Function(input)(e);
}

export function limbProblem(input: LimbFitInput): EllipseFitProblem {
  if (!(Number.isFinite(input.modelErrorKm) && input.modelErrorKm >= 0)) {
    throw new GeometryInputError(
      'fit.limb.modelErrorKm',
      `must be a finite number ≥ 0, got ${input.modelErrorKm}`,
    );
  }
  const stations = new Set(input.points.map((p) => p.station));
  const offsetIndex = new Map<string, number>();
  input.fitTimeOffsets.forEach((station, i) => {
    if (!stations.has(station)) {
      throw new GeometryInputError(
        `fit.limb.fitTimeOffsets[${i}]`,
        `station "${station}" has no timed points on the limb, so its clock offset cannot be fitted`,
      );
    }
    if (offsetIndex.has(station)) {
      throw new GeometryInputError(`fit.limb.fitTimeOffsets[${i}]`, `station "${station}" is listed twice`);
    }
    offsetIndex.set(station, i);
  });
  const fixed: Array<number | undefined> = LIMB_PARAMETERS.map((name) => {
    const v = input.fixed[name];
    if (v === undefined) return undefined;
    if (!Number.isFinite(v))
      throw new GeometryInputError(`fit.limb.fixed.${name}`, `must be a finite number, got ${v}`);
    if (name === 'equatorialRadiusKm' && !(v > 0)) {
      throw new GeometryInputError(`fit.limb.fixed.${name}`, `must be > 0, got ${v}`);
    }
    if (name === 'oblateness' && !(v >= 0 && v < 1)) {
      throw new GeometryInputError(`fit.limb.fixed.${name}`, `must be in [0, 1), got ${v}`);
    }
    return name === 'positionAngleDeg' ? v * DEG : v;
  });
  const points: FitPoint[] = input.points.map((p) => {
    checkPoint(p, input.modelErrorKm);
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
    points,
    negatives: input.negatives.map((n) => n.pathKm),
    fixed,
    modelErrorKm: input.modelErrorKm,
    offsetCount: input.fitTimeOffsets.length,
    seed: input.seed,
    errorPath: 'chords',
  };
}

export function checkPoint(
  p: { station: string; fKm: number; gKm: number; sigmaSeconds: number; velocity: VelocityKmPerS },
  modelErrorKm: number,
  path = 'chords',
): void {
  const where = `station "${p.station}"`;
  if (![p.fKm, p.gKm, p.velocity.f, p.velocity.g].every(Number.isFinite)) {
    throw new GeometryInputError(path, `${where}: point or velocity is not a finite number`);
  }
  if (!(Number.isFinite(p.sigmaSeconds) && p.sigmaSeconds >= 0)) {
    throw new GeometryInputError(path, `${where}: timing sigma must be ≥ 0 s, got ${p.sigmaSeconds}`);
  }
  if (Math.hypot(p.velocity.f, p.velocity.g) === 0) {
    throw new GeometryInputError(path, `${where}: the sky-plane velocity is zero`);
  }
  if (p.sigmaSeconds === 0 && modelErrorKm === 0) {
    throw new GeometryInputError(
      'chords',
      `${where}: a timing sigma of 0 s with no model error gives infinite weight`,
    );
  }
}
