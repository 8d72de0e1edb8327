// Time scales. An instant is carried as TT seconds since J2000.0 (2000-01-01T12:00:00 TT), which keeps
// ~0.1 µs resolution over centuries; UTC is text at the edges only.
//   TAI = UTC + (TAI − UTC)   leap-second table, IERS Bulletin C
//   TT  = TAI + 32.184 s      IAU 1991 Resolution A4 (TT − TAI fixed at TAI's 1977 origin)
//   UT1 = UTC + DUT1          DUT1 as the event file states it (IERS Bulletin A/D)
//   TDB = TT + 1.657 ms sin g + 14 µs sin 2g, main periodic terms (Explanatory Supplement to the
//         Astronomical Almanac; from memory). The brief allows TDB = TT (difference < 2 ms); keeping
//         the main term costs nothing.
import { GeometryInputError, type TimeScale } from '../types.js';
import { DEG, JD_J2000, SECONDS_PER_DAY } from '../math.js';
import {
  calendarSecondsFromJ2000,
  daysFromJ2000Date,
  formatIsoCalendar,
  parseIsoCalendar,
  type CalendarInstant,
} from './calendar.js';
import { LEAP_SECOND_STEPS } from './leap-seconds.js';

export const TT_MINUS_TAI_SECONDS = 32.184;

interface Step {
  /** Day number (from 2000-01-01) of the UTC date from which the offset applies. */
  startDay: number;
  /** TAI seconds since J2000 at that UTC midnight. */
  startTaiSeconds: number;
  taiMinusUtcSeconds: number;
}

const STEPS: readonly Step[] = LEAP_SECOND_STEPS.map((step) => {
  const startDay = daysFromJ2000Date(step.year, step.month, 1);
  return {
    startDay,
    startTaiSeconds: (startDay - 0.5) * SECONDS_PER_DAY + step.taiMinusUtcSeconds,
    taiMinusUtcSeconds: step.taiMinusUtcSeconds,
  };
});

function stepIndexForUtcDay(day: number): number {
  let lo = -1;
  for (let i = 0; i < STEPS.length; i++) if ((STEPS[i] as Step).startDay <= day) lo = i;
  return lo;
}

/** TAI − UTC in seconds on the given UTC date; throws RangeError before 1972. */
export function taiMinusUtcSeconds(year: number, month: number, day: number): number {
  const i = stepIndexForUtcDay(daysFromJ2000Date(year, month, day));
  if (i < 0) throw new RangeError('UTC before 1972-01-01 is not supported (no integral leap-second offset)');
  return (STEPS[i] as Step).taiMinusUtcSeconds;
}

function utcCalendarToTt(instant: CalendarInstant): number | string {
  const day = daysFromJ2000Date(instant.year, instant.month, instant.day);
  const i = stepIndexForUtcDay(day);
  if (i < 0) return 'UTC before 1972-01-01 is not supported (no integral leap-second offset)';
  if (instant.secondsOfDay >= SECONDS_PER_DAY) {
    const next = STEPS[i + 1];
    if (!next || next.startDay !== day + 1) return 'second 60 on a day without a leap second';
  }
  // During a leap second the calendar count runs into the next day while the old offset still holds,
  // which is what adding the day's own offset gives.
  return calendarSecondsFromJ2000(instant) + (STEPS[i] as Step).taiMinusUtcSeconds + TT_MINUS_TAI_SECONDS;
}

/** TT seconds since J2000 of an ISO 8601 UTC time; `path` names the JSON field in the error. */
export function utcIsoToTtSeconds(text: string, path = 'time'): number {
  return isoToTtSeconds(text, 'UTC', path);
}

/** TT seconds since J2000 of an ISO 8601 time read in the given scale. */
export function isoToTtSeconds(text: string, scale: TimeScale, path = 'time'): number {
  const instant = parseIsoCalendar(text);
  if (typeof instant === 'string') throw new GeometryInputError(path, instant);
  if (scale === 'UTC') {
    const tt = utcCalendarToTt(instant);
    if (typeof tt === 'string') throw new GeometryInputError(path, tt);
    return tt;
  }
  if (instant.secondsOfDay >= SECONDS_PER_DAY)
    throw new GeometryInputError(path, `second 60 does not exist in ${scale}`);
  const seconds = calendarSecondsFromJ2000(instant);
  return scale === 'TT' ? seconds : tdbToTtSeconds(seconds);
}

function utcOffsetAtTt(ttSeconds: number): { index: number; inLeapSecond: boolean } {
  const tai = ttSeconds - TT_MINUS_TAI_SECONDS;
  let index = -1;
  for (let i = 0; i < STEPS.length; i++) if ((STEPS[i] as Step).startTaiSeconds <= tai) index = i;
  const next = STEPS[index + 1];
  const inLeapSecond =
    next !== undefined &&
    next.taiMinusUtcSeconds - (index >= 0 ? (STEPS[index] as Step).taiMinusUtcSeconds : 0) === 1 &&
    tai >= next.startTaiSeconds - 1;
  return { index, inLeapSecond };
}

/** ISO 8601 UTC text ("…Z", millisecond resolution) of a TT instant; leap seconds print as second 60. */
export function ttSecondsToUtcIso(ttSeconds: number): string {
  const { index, inLeapSecond } = utcOffsetAtTt(ttSeconds);
  if (index < 0) throw new RangeError('UTC before 1972-01-01 is not supported');
  const step = STEPS[index] as Step;
  const fromMidnight2000 = ttSeconds - TT_MINUS_TAI_SECONDS - step.taiMinusUtcSeconds + SECONDS_PER_DAY / 2;
  let day = Math.floor(fromMidnight2000 / SECONDS_PER_DAY);
  let secondsOfDay = fromMidnight2000 - day * SECONDS_PER_DAY;
  if (inLeapSecond) {
    day -= 1;
    secondsOfDay += SECONDS_PER_DAY;
  }
  const following = STEPS.find((s) => s.startDay === day + 1);
  const dayLength =
    following && following.taiMinusUtcSeconds - step.taiMinusUtcSeconds === 1
      ? SECONDS_PER_DAY + 1
      : SECONDS_PER_DAY;
  return `${formatIsoCalendar(day, secondsOfDay, dayLength)}Z`;
}

/** TT − UTC in seconds at a TT instant. */
export function ttMinusUtcSeconds(ttSeconds: number): number {
  const { index } = utcOffsetAtTt(ttSeconds);
  if (index < 0) throw new RangeError('UTC before 1972-01-01 is not supported');
  return (STEPS[index] as Step).taiMinusUtcSeconds + TT_MINUS_TAI_SECONDS;
}

/**
 * UT1 as seconds since 2000-01-01T12:00:00 UT1. Inside a leap second UTC is ambiguous by 1 s as a count;
 * the Earth-rotation angle there is off by that second, which the brief's events never meet.
 */
export function ttSecondsToUt1Seconds(ttSeconds: number, dut1Seconds: number): number {
  return ttSeconds - ttMinusUtcSeconds(ttSeconds) + dut1Seconds;
}

function tdbMinusTtSeconds(seconds: number): number {
  const g = (357.53 + 0.98560028 * (seconds / SECONDS_PER_DAY)) * DEG;
  return 0.001657 * Math.sin(g) + 0.000014 * Math.sin(2 * g);
}

export function ttToTdbSeconds(ttSeconds: number): number {
  return ttSeconds + tdbMinusTtSeconds(ttSeconds);
}

/** Inverse of ttToTdbSeconds; one step suffices since the correction changes by < 1e-9 s over 2 ms. */
export function tdbToTtSeconds(tdbSeconds: number): number {
  return tdbSeconds - tdbMinusTtSeconds(tdbSeconds);
}

/** Julian date in the same scale as the seconds given (seconds since J2000.0 of that scale). */
export function julianDateFromJ2000Seconds(seconds: number): number {
  return JD_J2000 + seconds / SECONDS_PER_DAY;
}
