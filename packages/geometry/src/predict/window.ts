// The prediction's time window and its grid of path times: t_k = from + k·stepSeconds for k = 0, 1, …
// while t_k ≤ to (to itself when it falls on the grid), with from and to the ephemeris rows' first and
// last instants unless stated. The grid steps in elapsed (TT) seconds, so across a leap second the UTC
// labels of later grid times move by that second. Grid times are whole milliseconds of UTC.
import { requireWithinSpan, type Ephemeris } from '../astro/ephemeris.js';
import { ttSecondsToUtcIso, utcIsoToTtSeconds } from '../time/scales.js';
import { GeometryInputError } from '../types.js';
import type { PredictionSettings } from './types.js';

export const MIN_STEP_SECONDS = 1;
export const MAX_STEP_SECONDS = 600;
/** Path times per prediction: 5.8 days at the default 10 s; beyond it the document would run to tens of MB. */
export const MAX_PATH_TIMES = 50_000;
/** A `to` this close to a grid time (as a fraction of the step) counts as on the grid: TT seconds carry ~1e-7 s. */
const ON_GRID_FRACTION = 1e-6;

/**
 * The TT instant of the whole UTC millisecond nearest a TT instant. TT − UTC is a whole number of
 * milliseconds (32.184 s + leap seconds) and TT's count starts on a whole millisecond, so rounding the
 * count rounds UTC.
 */
function onUtcMillisecond(ttSeconds: number): number {
  return Math.round(ttSeconds * 1000) / 1000;
}

export interface PredictionWindow {
  fromTt: number;
  toTt: number;
  gridTt: number[];
}

export function predictionWindow(
  ephemeris: Ephemeris,
  settings: Pick<PredictionSettings, 'from' | 'to' | 'stepSeconds'>,
): PredictionWindow {
  const step = settings.stepSeconds;
  if (!(step >= MIN_STEP_SECONDS && step <= MAX_STEP_SECONDS))
    throw new GeometryInputError(
      'prediction.stepSeconds',
      `must be between ${MIN_STEP_SECONDS} and ${MAX_STEP_SECONDS} seconds`,
    );
  const fromTt =
    settings.from === undefined
      ? ephemeris.startTtSeconds
      : utcIsoToTtSeconds(settings.from, 'prediction.from');
  const toTt =
    settings.to === undefined ? ephemeris.endTtSeconds : utcIsoToTtSeconds(settings.to, 'prediction.to');
  requireWithinSpan(ephemeris, fromTt, 'prediction.from');
  requireWithinSpan(ephemeris, toTt, 'prediction.to');
  if (!(toTt > fromTt))
    throw new GeometryInputError(
      'prediction.to',
      `must come after prediction.from (${ttSecondsToUtcIso(fromTt)})`,
    );
  const count = Math.floor((toTt - fromTt) / step + ON_GRID_FRACTION) + 1;
  if (count > MAX_PATH_TIMES)
    throw new GeometryInputError(
      'prediction.stepSeconds',
      `gives ${count} path times from ${ttSecondsToUtcIso(fromTt)} to ${ttSecondsToUtcIso(toTt)}; at most ${MAX_PATH_TIMES}: raise stepSeconds or narrow from and to`,
    );
  // Each path point is computed at the instant its printed time names: a grid time is rounded to the
  // UTC millisecond first (a TDB ephemeris' first row is not on a whole millisecond of UTC, and 0.5 ms is
  // 10 m of a fast shadow).
  const gridTt = Array.from({ length: count }, (_, k) => onUtcMillisecond(fromTt + k * step));
  return { fromTt, toTt, gridTt };
}
