// Step in the data flow: stored solved fits -> the geometry's shape-fit input. Each fit gives its limb
// ellipse with 1-sigma, the star's direction and the instant the body was seen, light time removed.
import {
  chordFirstTimeUtc,
  subMatrix,
  type EventInput,
  type ShapeEventInput,
  type Solution,
} from '@limbus/geometry';
import type { FieldIssue } from '../common/domain-errors';

// Exact by definition (SI, 17th CGPM 1983).
const LIGHT_SPEED_KM_PER_S = 299_792.458;

export interface ShapeSourceFit {
  fitId: string;
  eventTitle: string;
  event: EventInput;
  solution: Solution;
}

function earliestTimingUtc(event: EventInput): string | null {
  const times: string[] = [];
  for (const c of event.chords) times.push(chordFirstTimeUtc(c));
  for (const r of event.ringEvents) times.push(r.start.time);
  // ISO 8601 UTC strings with Z sort as text in time order.
  return times.sort()[0] ?? null;
}

/** The ephemeris row nearest in time; a minute's difference of scale (TT vs UTC) moves no distance that matters. */
function distanceKmAt(event: EventInput, timeMs: number): number | null {
  let best: { gapMs: number; km: number } | null = null;
  for (const row of event.ephemeris.rows) {
    const ms = Date.parse(/Z$/.test(row.time) ? row.time : `${row.time}Z`);
    if (!Number.isFinite(ms)) continue;
    const gapMs = Math.abs(ms - timeMs);
    if (best === null || gapMs < best.gapMs) best = { gapMs, km: row.distanceKm };
  }
  return best?.km ?? null;
}

/**
 * The rotation phase that matters is the body's when the light left it: at 40 AU that is 5.5 h before the
 * event, a large part of a rotation, and it differs between events by minutes as the distance changes.
 */
export function shapeEventOf(
  fit: ShapeSourceFit,
  path: string,
): { ok: true; input: ShapeEventInput } | { ok: false; issue: FieldIssue } {
  const limb = fit.solution.limb;
  if (limb === null)
    return { ok: false, issue: { path, message: 'fit has no limb (no positive chord), so no silhouette' } };
  const seenUtc = fit.solution.astrometry?.referenceTimeUtc ?? earliestTimingUtc(fit.event);
  if (seenUtc === null) return { ok: false, issue: { path, message: 'event has no timing' } };
  const seenMs = Date.parse(seenUtc);
  const distanceKm = distanceKmAt(fit.event, seenMs);
  if (distanceKm === null) return { ok: false, issue: { path, message: 'event has no ephemeris distance' } };
  const emittedMs = seenMs - (distanceKm / LIGHT_SPEED_KM_PER_S) * 1000;
  return {
    ok: true,
    input: {
      id: fit.fitId,
      timeUtc: new Date(emittedMs).toISOString(),
      starRaDeg: fit.event.star.raDeg,
      starDecDeg: fit.event.star.decDeg,
      limb: {
        equatorialRadiusKm: limb.equatorialRadiusKm,
        oblateness: limb.oblateness,
        positionAngleDeg: limb.positionAngleDeg,
      },
      sigma: {
        equatorialRadiusKm: limb.uncertainty.equatorialRadiusKm,
        oblateness: limb.uncertainty.oblateness,
        positionAngleDeg: limb.uncertainty.positionAngleDeg,
      },
      // Rows and columns 2–4 of the limb covariance: (a, ε, P). Fits stored before it have none.
      ...(limb.covariance === undefined ? {} : { covariance: subMatrix(limb.covariance.matrix, [2, 3, 4]) }),
    },
  };
}
