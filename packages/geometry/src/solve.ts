// The solve pipeline: validated event → sky-plane projection → limb fit → ring fits and poles →
// astrometric offset → solution. Deterministic for a given input and seed (the fits' only randomness is
// seeded). docs/method.md describes every step.
import { subMatrix } from './fit/covariance.js';
import { fitLimbAndRings } from './fit/joint-limb-ring.js';
import { fitLimb, type LimbFitInput, type LimbFitResult } from './fit/limb-fit.js';
import { ringPolesWithUncertainty } from './fit/pole-uncertainty.js';
import { ringCrossing } from './fit/ring-crossing.js';
import { RING_COVARIANCE_PARAMETERS, fitRing, type RingFitResult } from './fit/ring-fit.js';
import { MAS_PER_RAD } from './math.js';
import { projectEvent, type ProjectedEvent } from './project.js';
import {
  GeometryInputError,
  type AstrometrySolution,
  type EventInput,
  type LimbSolution,
  type RingCenterFrom,
  type RingSolution,
  type SigmaMethod,
  type SkyPointKm,
  type Solution,
} from './types.js';
import { ENGINE_VERSION } from './version.js';

export const DEFAULT_SEED = 1;

function limbSolution(fit: LimbFitResult, sigmaMethod: SigmaMethod): LimbSolution {
  return {
    ...fit.ellipse,
    equivalentRadiusKm: fit.equivalentRadiusKm,
    uncertainty: fit.uncertainty,
    chi2: fit.chi2,
    dof: fit.dof,
    radialResidualsKm: fit.residuals,
    negativeChordsClear: fit.negativeChordsClear,
    timeOffsets: fit.timeOffsets,
    band: fit.band,
    covariance: fit.covariance,
    sigmaMethod,
    ...(sigmaMethod === 'sampled' && fit.sampler ? { sampler: fit.sampler } : {}),
  };
}

/** Sky-plane km at the body's distance → milliarcseconds (small-angle: 1 km / D rad). */
function kmToMas(km: number, distanceKm: number): number {
  return (km / distanceKm) * MAS_PER_RAD;
}

function astrometry(
  referenceTimeUtc: string,
  distanceKm: number,
  center: SkyPointKm,
  sigma: SkyPointKm,
): AstrometrySolution {
  return {
    referenceTimeUtc,
    raOffsetCosDecMas: kmToMas(center.fKm, distanceKm),
    decOffsetMas: kmToMas(center.gKm, distanceKm),
    uncertainty: {
      raOffsetCosDecMas: kmToMas(sigma.fKm, distanceKm),
      decOffsetMas: kmToMas(sigma.gKm, distanceKm),
    },
  };
}

/** What a ring fit contributes to the solution, whichever way its centre was found. */
interface RingFitOutcome {
  ring: string;
  centerFrom: RingCenterFrom;
  fit: Omit<RingFitResult, 'covariance'>;
  /** Order RING_COVARIANCE_PARAMETERS, solution units. */
  covariance: number[][];
}

function ringSolution(projected: ProjectedEvent, outcome: RingFitOutcome): RingSolution {
  const { ring, fit, covariance } = outcome;
  const points = projected.ringPoints.get(ring) ?? [];
  const dips = projected.ringDips.get(ring) ?? [];
  const bp = subMatrix(covariance, [3, 4]);
  return {
    ring,
    centerFrom: outcome.centerFrom,
    centerFKm: fit.centerFKm,
    centerGKm: fit.centerGKm,
    radiusKm: fit.radiusKm,
    openingAngleDeg: fit.openingAngleDeg,
    positionAngleDeg: fit.positionAngleDeg,
    uncertainty: {
      radiusKm: fit.uncertainty.radiusKm,
      openingAngleDeg: fit.uncertainty.openingAngleDeg,
      positionAngleDeg: fit.uncertainty.positionAngleDeg,
      centerFKm: fit.uncertainty.centerFKm,
      centerGKm: fit.uncertainty.centerGKm,
    },
    covariance: { parameters: [...RING_COVARIANCE_PARAMETERS], matrix: covariance },
    ...(fit.sampler ? { sampler: fit.sampler } : {}),
    poles: ringPolesWithUncertainty(projected.basis, fit.openingAngleDeg, fit.positionAngleDeg, [
      [bp[0]?.[0] ?? 0, bp[0]?.[1] ?? 0],
      [bp[1]?.[0] ?? 0, bp[1]?.[1] ?? 0],
    ]),
    crossings: points.map((p, k) => {
      const dip = dips[k];
      const midPoint = { fKm: p.fKm, gKm: p.gKm, station: p.station };
      return dip ? ringCrossing(dip, midPoint, fit, covariance) : { ...midPoint, radialWidthKm: 0 };
    }),
    chi2: fit.chi2,
    dof: fit.dof,
  };
}

/**
 * Each ring fitted on its own: about the limb's centre (whose 1-sigma and covariance it then reports as
 * the centre's, with no covariance between the centre and R, B, P, which were fitted with the centre held)
 * or about a centre of its own.
 */
function solveRingsSequentially(
  projected: ProjectedEvent,
  limb: LimbFitResult | null,
  seed: number,
): RingFitOutcome[] {
  return [...projected.ringPoints].map(([ring, points]) => {
    const center = limb ? { fKm: limb.ellipse.centerFKm, gKm: limb.ellipse.centerGKm } : null;
    const fit = fitRing({ ring, points, center, seed });
    if (!limb) return { ring, centerFrom: 'free', fit, covariance: fit.covariance.matrix };
    const limbCentre = subMatrix(limb.covariance.matrix, [0, 1]);
    const covariance = fit.covariance.matrix.map((row, i) =>
      row.map((v, j) =>
        i < 2 && j < 2 ? ((limbCentre[i] as number[])[j] as number) : i < 2 || j < 2 ? 0 : v,
      ),
    );
    return {
      ring,
      centerFrom: 'limb',
      fit: {
        ...fit,
        uncertainty: {
          ...fit.uncertainty,
          centerFKm: limb.uncertainty.centerFKm,
          centerGKm: limb.uncertainty.centerGKm,
        },
      },
      covariance,
    };
  });
}

export function solveEvent(event: EventInput, opts: { inputSha256: string }): Solution {
  const seed = event.fit.seed ?? DEFAULT_SEED;
  const first = projectEvent(event);
  let projected = first;
  let limbFit: LimbFitResult | null = null;
  let rings: RingFitOutcome[];
  const centerFrom = event.fit.ring.centerFrom;
  if (first.limbPoints.length > 0) {
    const limbInput: LimbFitInput = {
      points: first.limbPoints,
      negatives: first.negatives,
      fixed: event.fit.limb.fixed,
      modelErrorKm: event.fit.limb.modelErrorKm,
      fitTimeOffsets: event.fit.limb.fitTimeOffsets,
      seed,
    };
    limbFit = fitLimb(limbInput);
    // Fitted clock offsets: re-project with the corrected times (rather than shifting along the velocity)
    // so that points, negative paths, ring dips, velocities and the reference time all use them. The
    // ellipse and residuals are the fit's own, computed with the same offsets applied inside the fit.
    const reproject = (fit: LimbFitResult): ProjectedEvent =>
      fit.timeOffsets.length > 0
        ? projectEvent(event, {
            timeOffsetsSeconds: Object.fromEntries(fit.timeOffsets.map((o) => [o.station, o.seconds])),
          })
        : first;
    projected = reproject(limbFit);
    rings = solveRingsSequentially(projected, centerFrom === 'free' ? null : limbFit, seed);
    if (centerFrom === 'joint' && rings.length > 0) {
      // One problem from the sequential start; its points are those of the first projection, the clock
      // offsets being parameters that move every time of their station.
      const joint = fitLimbAndRings({
        limb: limbInput,
        rings: [...first.ringPoints].map(([ring, points]) => ({ ring, points })),
        start: { limb: limbFit, rings: rings.map((r) => r.fit) },
      });
      limbFit = joint.limb;
      projected = reproject(joint.limb);
      rings = joint.rings.map((r) => ({
        ring: r.ring,
        centerFrom: 'joint',
        fit: r,
        covariance: r.covariance.matrix,
      }));
    }
  } else {
    if (event.fit.limb.fitTimeOffsets.length > 0)
      throw new GeometryInputError(
        'fit.limb.fitTimeOffsets',
        'clock offsets can only be fitted with positive chords',
      );
    // Without a positive chord there is no limb to share a centre with: "joint" acts as "free".
    rings = solveRingsSequentially(projected, null, seed);
  }
  const limb = limbFit
    ? limbSolution(limbFit, centerFrom === 'joint' && rings.length > 0 ? 'linearised' : 'sampled')
    : null;
  const ringSolutions = rings.map((r) => ringSolution(projected, r));

  let astro: AstrometrySolution | null = null;
  if (limb) {
    astro = astrometry(
      projected.referenceTimeUtc,
      projected.distanceKm,
      { fKm: limb.centerFKm, gKm: limb.centerGKm },
      { fKm: limb.uncertainty.centerFKm, gKm: limb.uncertainty.centerGKm },
    );
  } else if (ringSolutions[0]) {
    const ring = ringSolutions[0];
    const reference = projected.ringReferences.get(ring.ring);
    if (reference)
      astro = astrometry(
        reference.referenceTimeUtc,
        reference.distanceKm,
        { fKm: ring.centerFKm, gKm: ring.centerGKm },
        { fKm: ring.uncertainty.centerFKm ?? 0, gKm: ring.uncertainty.centerGKm ?? 0 },
      );
  }

  return {
    format: 'limbus-solution/1',
    chords: projected.chords,
    limb,
    rings: ringSolutions,
    astrometry: astro,
    engine: { version: ENGINE_VERSION, inputSha256: opts.inputSha256, seed },
  };
}
