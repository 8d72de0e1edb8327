// One row per fit for the comparison table and plots: every limb and ring parameter with its 1-sigma,
// against the event's date. Chords are left out; the overlay draws ellipses from their parameters.
import { chordFirstTimeUtc, type EventInput, type Solution } from '@limbus/geometry';
import type { ReviewState } from '../fits/entities/fit-run.entity';
import type { ComparisonSelection } from './comparison-schemas';

export interface ValueSigma {
  value: number;
  sigma: number;
}

export interface ComparisonLimb {
  centerFKm: ValueSigma;
  centerGKm: ValueSigma;
  equatorialRadiusKm: ValueSigma;
  oblateness: ValueSigma;
  positionAngleDeg: ValueSigma;
  equivalentRadiusKm: ValueSigma;
  chi2: number;
  dof: number;
}

export interface ComparisonRing {
  ring: string;
  radiusKm: ValueSigma;
  openingAngleDeg: ValueSigma;
  positionAngleDeg: ValueSigma;
  /**
   * Both pole solutions; `uncertainty` (1-sigma, RA in degrees of RA, and the RA–Dec correlation) is null
   * for a fit stored before pole sigmas were computed.
   */
  poles: Array<{
    raDeg: number;
    decDeg: number;
    uncertainty: { raDeg: number; decDeg: number; correlation: number } | null;
  }>;
}

export interface ComparisonFit {
  fitId: string;
  eventId: string;
  eventTitle: string;
  /** False when the event's data changed since the fit ran (it is based on older data). */
  inputMatchesEvent: boolean;
  /** Who ran the fit. */
  createdBy: { id: string; name: string };
  /** The astrometry reference time, else the earliest timing in the event (ISO UTC). */
  eventDateUtc: string | null;
  reviewState: ReviewState;
  finishedAt: string | null;
  limb: ComparisonLimb | null;
  rings: ComparisonRing[];
}

export interface ComparisonView {
  teamId: string;
  /** The body all the fits observe; null when there are no fits. */
  body: { id: string; name: string } | null;
  selection: ComparisonSelection;
  ringLabels: string[];
  fits: ComparisonFit[];
}

function earliestTimingUtc(event: EventInput): string | null {
  const times: string[] = [];
  for (const c of event.chords) times.push(chordFirstTimeUtc(c));
  for (const r of event.ringEvents) times.push(r.start.time);
  // ISO 8601 UTC strings with Z sort as text in time order.
  return times.sort()[0] ?? null;
}

export function comparisonFit(
  fit: {
    id: string;
    reviewState: ReviewState;
    finishedAt: Date | null;
    createdBy: { id: string; name: string };
  },
  eventRow: { id: string; title: string },
  event: EventInput,
  solution: Solution,
  inputMatchesEvent: boolean,
): ComparisonFit {
  const limb = solution.limb;
  const u = limb?.uncertainty;
  return {
    fitId: fit.id,
    eventId: eventRow.id,
    eventTitle: eventRow.title,
    inputMatchesEvent,
    createdBy: { id: fit.createdBy.id, name: fit.createdBy.name },
    eventDateUtc: solution.astrometry?.referenceTimeUtc ?? earliestTimingUtc(event),
    reviewState: fit.reviewState,
    finishedAt: fit.finishedAt?.toISOString() ?? null,
    limb:
      limb === null || u === undefined
        ? null
        : {
            centerFKm: { value: limb.centerFKm, sigma: u.centerFKm },
            centerGKm: { value: limb.centerGKm, sigma: u.centerGKm },
            equatorialRadiusKm: { value: limb.equatorialRadiusKm, sigma: u.equatorialRadiusKm },
            oblateness: { value: limb.oblateness, sigma: u.oblateness },
            positionAngleDeg: { value: limb.positionAngleDeg, sigma: u.positionAngleDeg },
            equivalentRadiusKm: { value: limb.equivalentRadiusKm, sigma: u.equivalentRadiusKm },
            chi2: limb.chi2,
            dof: limb.dof,
          },
    rings: solution.rings.map((r) => ({
      ring: r.ring,
      radiusKm: { value: r.radiusKm, sigma: r.uncertainty.radiusKm },
      openingAngleDeg: { value: r.openingAngleDeg, sigma: r.uncertainty.openingAngleDeg },
      positionAngleDeg: { value: r.positionAngleDeg, sigma: r.uncertainty.positionAngleDeg },
      poles: r.poles.map((p) => ({ raDeg: p.raDeg, decDeg: p.decDeg, uncertainty: p.uncertainty ?? null })),
    })),
  };
}
