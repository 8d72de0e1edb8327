// The ring fit: a circle of radius R in its own plane appears as an ellipse with semi-major axis R and
// semi-minor axis R·|sin B| (B the ring opening angle), the semi-minor axis along the projected pole at
// position angle P. The same apparent-ellipse fit as the limb, with a = R and ε = 1 − |sin B|, applied to
// the mid-times of the ring's dips; no model error, no negative paths, no clock offsets.

import { DEG, RAD, asin, wrap } from '../math.js';
import { GeometryInputError } from '../types.js';
import type { ParameterCovariance, SamplerDiagnostics, SkyPointKm, VelocityKmPerS } from '../types.js';
import { sampledCovariance } from './covariance.js';
import {
  type EllipseFitProblem,
  SHAPE_PARAMETER_COUNT,
  centralSigma,
  fitEllipse,
  sampleMap,
} from './ellipse-fit.js';
import { checkPoint } from './limb-fit.js';
import { samplerDiagnostics } from './sampler-diagnostics.js';

export interface RingPoint {
  station: string;
  fKm: number;
  gKm: number;
  sigmaSeconds: number;
  velocity: VelocityKmPerS;
}

export interface RingFitInput {
  ring: string;
  points: RingPoint[];
  /** The body's centre when the ring is concentric with it; null to fit the centre too. */
  center: SkyPointKm | null;
  seed: number;
}

export interface RingFitResult {
  centerFKm: number;
  centerGKm: number;
  radiusKm: number;
  openingAngleDeg: number;
  positionAngleDeg: number;
  uncertainty: {
    radiusKm: number;
    openingAngleDeg: number;
    positionAngleDeg: number;
    centerFKm: number;
    centerGKm: number;
  };
  chi2: number;
  dof: number;
  /** Sample correlations scaled by the reported 1-sigma; order RING_COVARIANCE_PARAMETERS. */
  covariance: ParameterCovariance;
  /** Acceptance, τ and effective samples of the free parameters; absent when the 1-sigma were not sampled. */
  sampler?: SamplerDiagnostics;
}

/** Rows of a ring's covariance, in the solution's units (km, km, km, degrees, degrees). */
export const RING_COVARIANCE_PARAMETERS = [
  'centerFKm',
  'centerGKm',
  'radiusKm',
  'openingAngleDeg',
  'positionAngleDeg',
] as const;

/** The ring's dips as an apparent-ellipse problem: a = R, ε = 1 − |sin B|, the centre held when given. */
export function ringProblem(input: RingFitInput): EllipseFitProblem {
  if (input.center && !(Number.isFinite(input.center.fKm) && Number.isFinite(input.center.gKm))) {
    throw new GeometryInputError(
      'fit.ring.centerFrom',
      `ring "${input.ring}": the given centre is not finite`,
    );
  }
  const points = input.points.map((p) => {
    checkPoint(p, 0, 'ringEvents');
    return {
      fKm: p.fKm,
      gKm: p.gKm,
      sigmaSeconds: p.sigmaSeconds,
      velocityFKmPerS: p.velocity.f,
      velocityGKmPerS: p.velocity.g,
      offsetIndex: -1,
    };
  });
  const fixed: Array<number | undefined> = new Array<number | undefined>(SHAPE_PARAMETER_COUNT).fill(
    undefined,
  );
  if (input.center) {
    fixed[0] = input.center.fKm;
    fixed[1] = input.center.gKm;
  }
  return {
    points,
    negatives: [],
    fixed,
    modelErrorKm: 0,
    offsetCount: 0,
    seed: input.seed,
    errorPath: 'ringEvents',
  };
}

export function fitRing(input: RingFitInput): RingFitResult {
  const problem = ringProblem(input);
  let outcome: ReturnType<typeof fitEllipse>;
  try {
    outcome = fitEllipse(problem);
  } catch (err) {
    // Several rings share the ringEvents list, so the message names the ring.
    if (err instanceof GeometryInputError)
      throw new GeometryInputError(err.path, `ring "${input.ring}": ${err.detail}`);
    throw err;
  }
  const best = outcome.best;
  const bestP = best[4] as number;
  const set = outcome.samples;
  const centreFree = input.center === null;
  const columns = [
    sampleMap(set, (v, o) => v[o] as number),
    sampleMap(set, (v, o) => v[o + 1] as number),
    sampleMap(set, (v, o) => v[o + 2] as number),
    sampleMap(set, (v, o) => asin(1 - (v[o + 3] as number)) * RAD),
    sampleMap(set, (v, o) => ((v[o + 4] as number) - bestP) * RAD),
  ];
  const uncertainty = {
    radiusKm: centralSigma(columns[2] as Float64Array),
    openingAngleDeg: centralSigma(columns[3] as Float64Array),
    positionAngleDeg: centralSigma(columns[4] as Float64Array),
    centerFKm: centreFree ? centralSigma(columns[0] as Float64Array) : 0,
    centerGKm: centreFree ? centralSigma(columns[1] as Float64Array) : 0,
  };
  return {
    centerFKm: best[0] as number,
    centerGKm: best[1] as number,
    radiusKm: best[2] as number,
    openingAngleDeg: asin(1 - (best[3] as number)) * RAD,
    positionAngleDeg: wrap(bestP * RAD, 180),
    uncertainty,
    chi2: outcome.chi2,
    dof: outcome.dof,
    covariance: {
      parameters: [...RING_COVARIANCE_PARAMETERS],
      matrix: sampledCovariance(columns, [
        uncertainty.centerFKm,
        uncertainty.centerGKm,
        uncertainty.radiusKm,
        uncertainty.openingAngleDeg,
        uncertainty.positionAngleDeg,
      ]),
    },
    // The sampler draws ε = 1 − sin|B|; B is a monotonic function of it, named as the solution names it.
    sampler: samplerDiagnostics(
      outcome.sampler,
      outcome.free.map((j) => RING_COVARIANCE_PARAMETERS[j] as string),
    ),
  };
}

/**
 * Distance from the centre in the ring plane (km) of a sky-plane point, by undoing the foreshortening
 * across the projected pole: r = √(u² + (w / sin B)²), u along the ring's apparent major axis and w along
 * its minor axis (position angle P).
 */
export function ringPlaneRadiusKm(
  point: SkyPointKm,
  center: SkyPointKm,
  openingAngleDeg: number,
  positionAngleDeg: number,
): number {
  const sinB = Math.abs(Math.sin(openingAngleDeg * DEG));
  if (sinB === 0) {
    throw new GeometryInputError(
      'ringEvents',
      'a ring seen edge-on (opening angle 0°) cannot be deprojected',
    );
  }
  const p = positionAngleDeg * DEG;
  const df = point.fKm - center.fKm;
  const dg = point.gKm - center.gKm;
  const u = df * Math.cos(p) - dg * Math.sin(p);
  const w = (df * Math.sin(p) + dg * Math.cos(p)) / sinB;
  return Math.sqrt(u * u + w * w);
}
