import {
  GeometryInputError,
  isoToTtSeconds,
  shadowMotionAt,
  ttSecondsToUtcIso,
  type EventInput,
  type TimedMark,
} from '@limbus/geometry';
import { ValidationError } from '../common/domain-errors';

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
}

const meanUtc = (times: string[]): string =>
  new Date(times.reduce((sum, t) => sum + Date.parse(t), 0) / times.length).toISOString();

function referenceInstant(
  file: EventInput,
  report: { disappearance: TimedMark | null; reappearance: TimedMark | null },
): { atUtc: string; atFrom: TimingDefaults['atFrom'] } {
  const own = [report.disappearance, report.reappearance].filter((m): m is TimedMark => m !== null);
  if (own.length > 0) return { atUtc: meanUtc(own.map((m) => m.time)), atFrom: 'report' };
  const mids = file.chords.flatMap((c) =>
    c.type === 'positive' ? [meanUtc([c.disappearance.time, c.reappearance.time])] : [],
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

/**
 * What a light-curve timing of this station should start from: the station's sky-plane speed and the
 * body's distance from the event's own geometry (the projection the fits use), at the report's times
 * when it has them. Problems name the part of the event to fix.
 */
export function timingDefaultsOf(
  file: EventInput,
  stationCode: string,
  report: { disappearance: TimedMark | null; reappearance: TimedMark | null },
  exposureSeconds: number | null,
): TimingDefaults {
  const { atUtc, atFrom } = referenceInstant(file, report);
  try {
    const motion = shadowMotionAt(file, stationCode, atUtc);
    return { speedKmPerS: motion.speedKmPerS, distanceKm: motion.distanceKm, exposureSeconds, atUtc, atFrom };
  } catch (error) {
    if (error instanceof GeometryInputError)
      throw new ValidationError([
        { path: error.path === 'time' ? 'event.ephemeris' : `event.${error.path}`, message: error.detail },
      ]);
    throw error;
  }
}
