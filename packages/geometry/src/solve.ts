// The solve pipeline: validated event → sky-plane projection → limb fit → ring fits and poles →
// astrometric offset → solution. Deterministic for a given input and seed (the fits' only randomness is
// seeded). docs/method.md describes every step.
import { ringPoles } from './astro/ring-pole.js';
import { fitLimb, type LimbFitResult } from './fit/limb-fit.js';
import { fitRing, ringPlaneRadiusKm } from './fit/ring-fit.js';
import { MAS_PER_RAD } from './math.js';
import { projectEvent, type ProjectedEvent } from './project.js';
import {
  GeometryInputError,
  type AstrometrySolution,
  type EventInput,
  type LimbSolution,
  type RingSolution,
  type SkyPointKm,
  type Solution,
} from './types.js';
import { ENGINE_VERSION } from './version.js';

export const DEFAULT_SEED = 1;

function limbSolution(fit: LimbFitResult): LimbSolution {
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

function solveRings(
  projected: ProjectedEvent,
  limbCenter: SkyPointKm | null,
  seed: number,
): Array<{ ring: RingSolution; sigma: SkyPointKm }> {
  const out: Array<{ ring: RingSolution; sigma: SkyPointKm }> = [];
  for (const [ring, points] of projected.ringPoints) {
    const fit = fitRing({ ring, points, center: limbCenter, seed });
    const center = { fKm: fit.centerFKm, gKm: fit.centerGKm };
    const dips = projected.ringDips.get(ring) ?? [];
    out.push({
      ring: {
        ring,
        centerFKm: fit.centerFKm,
        centerGKm: fit.centerGKm,
        radiusKm: fit.radiusKm,
        openingAngleDeg: fit.openingAngleDeg,
        positionAngleDeg: fit.positionAngleDeg,
        uncertainty: {
          radiusKm: fit.uncertainty.radiusKm,
          openingAngleDeg: fit.uncertainty.openingAngleDeg,
          positionAngleDeg: fit.uncertainty.positionAngleDeg,
        },
        poles: ringPoles(projected.basis, fit.openingAngleDeg, fit.positionAngleDeg),
        crossings: points.map((p, k) => {
          const dip = dips[k];
          const width = dip
            ? Math.abs(
                ringPlaneRadiusKm(dip.end, center, fit.openingAngleDeg, fit.positionAngleDeg) -
                  ringPlaneRadiusKm(dip.start, center, fit.openingAngleDeg, fit.positionAngleDeg),
              )
            : 0;
          return { fKm: p.fKm, gKm: p.gKm, station: p.station, radialWidthKm: width };
        }),
        chi2: fit.chi2,
        dof: fit.dof,
      },
      sigma: { fKm: fit.uncertainty.centerFKm, gKm: fit.uncertainty.centerGKm },
    });
  }
  return out;
}

export function solveEvent(event: EventInput, opts: { inputSha256: string }): Solution {
  const seed = event.fit.seed ?? DEFAULT_SEED;
  let projected = projectEvent(event);
  let limb: LimbSolution | null = null;
  if (projected.limbPoints.length > 0) {
    const fit = fitLimb({
      points: projected.limbPoints,
      negatives: projected.negatives,
      fixed: event.fit.limb.fixed,
      modelErrorKm: event.fit.limb.modelErrorKm,
      fitTimeOffsets: event.fit.limb.fitTimeOffsets,
      seed,
    });
    // Fitted clock offsets: re-project with the corrected times (rather than shifting along the velocity)
    // so that points, negative paths, ring dips, velocities and the reference time all use them. The
    // ellipse and residuals are the fit's own, computed with the same offsets applied inside the fit.
    if (fit.timeOffsets.length > 0)
      projected = projectEvent(event, {
        timeOffsetsSeconds: Object.fromEntries(fit.timeOffsets.map((o) => [o.station, o.seconds])),
      });
    limb = limbSolution(fit);
  } else if (event.fit.limb.fitTimeOffsets.length > 0) {
    throw new GeometryInputError(
      'fit.limb.fitTimeOffsets',
      'clock offsets can only be fitted with positive chords',
    );
  }

  const limbCenter =
    limb && event.fit.ring.centerFrom === 'limb' ? { fKm: limb.centerFKm, gKm: limb.centerGKm } : null;
  const rings = solveRings(projected, limbCenter, seed);

  let astro: AstrometrySolution | null = null;
  if (limb) {
    astro = astrometry(
      projected.referenceTimeUtc,
      projected.distanceKm,
      { fKm: limb.centerFKm, gKm: limb.centerGKm },
      { fKm: limb.uncertainty.centerFKm, gKm: limb.uncertainty.centerGKm },
    );
  } else if (rings[0]) {
    const first = rings[0];
    const reference = projected.ringReferences.get(first.ring.ring);
    if (reference)
      astro = astrometry(
        reference.referenceTimeUtc,
        reference.distanceKm,
        { fKm: first.ring.centerFKm, gKm: first.ring.centerGKm },
        first.sigma,
      );
  }

  return {
    format: 'limbus-solution/1',
    chords: projected.chords,
    limb,
    rings: rings.map((r) => r.ring),
    astrometry: astro,
    engine: { version: ENGINE_VERSION, inputSha256: opts.inputSha256, seed },
  };
}
