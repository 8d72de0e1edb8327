import {
  GeometryInputError,
  isoToTtSeconds,
  limbCrossing,
  predictedLimb,
  shadowMotionAt,
  ttSecondsToUtcIso,
  type EventInput,
  type LimbEllipse,
  type PredictionSettings,
  type ShadowMotion,
  type TimedMark,
} from '@limbus/geometry';
import { ValidationError } from '../common/domain-errors';

/**
 * Where the two edges' speeds come from: the limb of the event's latest solved fit, the prediction's
 * circle, or the full sky-plane speed when neither crosses the station's track.
 */
export type EdgeSpeedsFrom = 'fit' | 'prediction' | 'full';

export interface EdgeSpeedDefaults {
  disappearanceKmPerS: number;
  reappearanceKmPerS: number;
  from: EdgeSpeedsFrom;
  /** The fit whose limb gave them (from "fit"). */
  fitId: string | null;
  /** Why these, in words, for the form to show beside them. */
  note: string;
}

/** A ring of the latest solved fit: its opening angle turns a dip's optical depth normal. */
export interface RingOpeningDefault {
  ring: string;
  openingAngleDeg: number;
  openingAngleSigmaDeg: number;
  fitId: string;
}

/** Starting values of a timing's speed, distance and exposure, and where each came from. */
export interface TimingDefaults {
  speedKmPerS: number;
  distanceKm: number;
  /** The station's recorded exposure; null when the station has none (the modeller must give it). */
  exposureSeconds: number | null;
  /** The instant the speed and distance are taken at. */
  atUtc: string;
  /** Why that instant: the report's own times, the event's positive chords, or the ephemeris span. */
  atFrom: 'report' | 'chords' | 'ephemeris';
  /** Each edge's limb-normal speed (docs/method.md, "Light-curve timing", edge speed). */
  edgeSpeeds: EdgeSpeedDefaults;
  /** The rings of the latest solved fit, for the dips' normal optical depth. */
  rings: RingOpeningDefault[];
}

/** What the event knows about its limb besides its chords. */
export interface LimbSources {
  /** The event's latest solved fit. */
  fit: {
    id: string;
    limb: LimbEllipse | null;
    rings: Array<{ ring: string; openingAngleDeg: number; uncertainty: { openingAngleDeg: number } }>;
  } | null;
  /** The event's prediction settings (GET /api/events/:eventId/prediction computes from them). */
  prediction: Pick<PredictionSettings, 'bodyRadiusKm' | 'offsetMas'> | null;
}

const meanUtc = (times: string[]): string =>
  new Date(times.reduce((sum, t) => sum + Date.parse(t), 0) / times.length).toISOString();

function referenceInstant(
  file: EventInput,
  report: { disappearance: TimedMark | null; reappearance: TimedMark | null },
): { atUtc: string; atFrom: TimingDefaults['atFrom'] } {
  const own = [report.disappearance, report.reappearance].filter((m): m is TimedMark => m !== null);
  if (own.length > 0) return { atUtc: meanUtc(own.map((m) => m.time)), atFrom: 'report' };
  // A single-edge chord's own time stands in for its mid-time, as in the fits.
  const mids = file.chords.flatMap((c) =>
    c.type === 'positive'
      ? [meanUtc([c.disappearance, c.reappearance].flatMap((m) => (m === undefined ? [] : [m.time])))]
      : [],
  );
  if (mids.length > 0) return { atUtc: meanUtc(mids), atFrom: 'chords' };
  const rows = file.ephemeris.rows;
  const first = rows[0];
  const last = rows[rows.length - 1];
  if (first === undefined || last === undefined)
    throw new ValidationError([{ path: 'event.ephemeris.rows', message: 'the event has no ephemeris rows' }]);
  const scale = file.ephemeris.timeScale;
  const middleTt = (isoToTtSeconds(first.time, scale) + isoToTtSeconds(last.time, scale)) / 2;
  return { atUtc: ttSecondsToUtcIso(middleTt), atFrom: 'ephemeris' };
}

const round = (x: number): string => x.toFixed(2);

/**
 * The limb-normal speeds of the station's two edges: where its track (straight, at the instant's
 * velocity) crosses the latest solved fit's limb, else the prediction's circle, else the full speed.
 */
function edgeSpeedsOf(motion: ShadowMotion, sources: LimbSources): EdgeSpeedDefaults {
  const fitLimb = sources.fit?.limb ?? null;
  const misses: string[] = [];
  if (sources.fit !== null && fitLimb !== null) {
    const crossing = limbCrossing(fitLimb, motion.pointKm, motion.velocityKmPerS);
    if (crossing !== null)
      return {
        disappearanceKmPerS: crossing.disappearanceKmPerS,
        reappearanceKmPerS: crossing.reappearanceKmPerS,
        from: 'fit',
        fitId: sources.fit.id,
        note:
          `limb-normal components of the ${round(motion.speedKmPerS)} km/s shadow velocity where this ` +
          `station's track crosses the limb of the latest solved fit`,
      };
    misses.push("this station's track misses the latest solved fit's limb");
  }
  if (sources.prediction !== null) {
    const circle = predictedLimb(sources.prediction, motion.distanceKm);
    const crossing = limbCrossing(circle, motion.pointKm, motion.velocityKmPerS);
    if (crossing !== null)
      return {
        disappearanceKmPerS: crossing.disappearanceKmPerS,
        reappearanceKmPerS: crossing.reappearanceKmPerS,
        from: 'prediction',
        fitId: null,
        note:
          `${misses.length > 0 ? `${misses.join('; ')}; ` : ''}limb-normal components of the ` +
          `${round(motion.speedKmPerS)} km/s shadow velocity where this station's track crosses the ` +
          `prediction's ${round(circle.equatorialRadiusKm)} km circle (no solved fit to take them from)`,
      };
    misses.push("it misses the prediction's circle");
  }
  return {
    disappearanceKmPerS: motion.speedKmPerS,
    reappearanceKmPerS: motion.speedKmPerS,
    from: 'full',
    fitId: null,
    note:
      `the full ${round(motion.speedKmPerS)} km/s for both edges: ` +
      (misses.length > 0 ? misses.join('; ') : 'the event has no solved fit and no prediction settings') +
      '. An edge crossed obliquely is longer than this assumes.',
  };
}

/**
 * What a light-curve timing of this station should start from: the station's sky-plane speed and the
 * body's distance from the event's own geometry (the projection the fits use), at the report's times
 * when it has them, and each edge's limb-normal speed from the latest solved fit or the prediction.
 * Problems name the part of the event to fix.
 */
export function timingDefaultsOf(
  file: EventInput,
  stationCode: string,
  report: { disappearance: TimedMark | null; reappearance: TimedMark | null },
  exposureSeconds: number | null,
  sources: LimbSources = { fit: null, prediction: null },
): TimingDefaults {
  const { atUtc, atFrom } = referenceInstant(file, report);
  let motion: ShadowMotion;
  try {
    motion = shadowMotionAt(file, stationCode, atUtc);
  } catch (error) {
    if (error instanceof GeometryInputError)
      throw new ValidationError([
        { path: error.path === 'time' ? 'event.ephemeris' : `event.${error.path}`, message: error.detail },
      ]);
    throw error;
  }
  const fit = sources.fit;
  return {
    speedKmPerS: motion.speedKmPerS,
    distanceKm: motion.distanceKm,
    exposureSeconds,
    atUtc,
    atFrom,
    edgeSpeeds: edgeSpeedsOf(motion, sources),
    rings:
      fit === null
        ? []
        : fit.rings.map((r) => ({
            ring: r.ring,
            openingAngleDeg: r.openingAngleDeg,
            openingAngleSigmaDeg: r.uncertainty.openingAngleDeg,
            fitId: fit.id,
          })),
  };
}
