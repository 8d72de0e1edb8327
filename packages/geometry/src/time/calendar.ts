// Gregorian calendar arithmetic and ISO 8601 text, kept apart from the time scales so that a leap
// second (23:59:60) can be represented: a calendar instant is a day number plus seconds of that day.
import { JD_J2000, SECONDS_PER_DAY } from '../math.js';

export interface CalendarInstant {
  year: number;
  month: number;
  day: number;
  /** Seconds since 0h of that day; 86 400 ≤ s < 86 401 only inside a leap second. */
  secondsOfDay: number;
  /** Whether the text ended in "Z". */
  zulu: boolean;
}

/** Days from 2000-01-01 to the given Gregorian date (Hinnant's days_from_civil, shifted to 2000). */
export function daysFromJ2000Date(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400;
  const mp = (month + 9) % 12;
  const doy = Math.floor((153 * mp + 2) / 5) + day - 1;
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy;
  return era * 146_097 + doe - 719_468 - 10_957;
}

/** The Gregorian date of a day number counted from 2000-01-01 (Hinnant's civil_from_days). */
export function dateFromJ2000Days(days: number): { year: number; month: number; day: number } {
  const z = days + 10_957 + 719_468;
  const era = Math.floor(z / 146_097);
  const doe = z - era * 146_097;
  const yoe = Math.floor(
    (doe - Math.floor(doe / 1460) + Math.floor(doe / 36_524) - Math.floor(doe / 146_096)) / 365,
  );
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100));
  const mp = Math.floor((5 * doy + 2) / 153);
  const day = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const month = mp < 10 ? mp + 3 : mp - 9;
  return { year: yoe + era * 400 + (month <= 2 ? 1 : 0), month, day };
}

export function daysInMonth(year: number, month: number): number {
  return (
    daysFromJ2000Date(month === 12 ? year + 1 : year, month === 12 ? 1 : month + 1, 1) -
    daysFromJ2000Date(year, month, 1)
  );
}

const ISO = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2}):(\d{2}(?:\.\d+)?)(Z?)$/;

/**
 * Parses "YYYY-MM-DDThh:mm:ss[.sss][Z]". Second 60 is accepted only at 23:59 (a leap second); whether
 * that day really had one is the UTC scale's business. Returns a reason string when the text is wrong.
 */
export function parseIsoCalendar(text: string): CalendarInstant | string {
  const m = ISO.exec(text);
  if (!m) return `"${text}" is not an ISO 8601 time like 2028-03-14T02:10:00.000Z`;
  const [year, month, day, hour, minute] = [m[1], m[2], m[3], m[4], m[5]].map(Number) as [
    number,
    number,
    number,
    number,
    number,
  ];
  const second = Number(m[6]);
  if (month < 1 || month > 12) return `"${text}" has month ${month}`;
  if (day < 1 || day > daysInMonth(year, month)) return `"${text}" has day ${day}, not in that month`;
  if (hour > 23 || minute > 59) return `"${text}" has hour or minute out of range`;
  if (second >= 61 || (second >= 60 && !(hour === 23 && minute === 59)))
    return `"${text}" has second ${m[6]} out of range`;
  return { year, month, day, secondsOfDay: hour * 3600 + minute * 60 + second, zulu: m[7] === 'Z' };
}

/** Julian date of a calendar instant read in any uniform scale (Meeus, Astronomical Algorithms, ch. 7). */
export function julianDate(
  instant: Pick<CalendarInstant, 'year' | 'month' | 'day' | 'secondsOfDay'>,
): number {
  return (
    JD_J2000 -
    0.5 +
    daysFromJ2000Date(instant.year, instant.month, instant.day) +
    instant.secondsOfDay / SECONDS_PER_DAY
  );
}

/** Seconds since 2000-01-01T12:00:00 of the same scale, counting every day as 86 400 s. */
export function calendarSecondsFromJ2000(
  instant: Pick<CalendarInstant, 'year' | 'month' | 'day' | 'secondsOfDay'>,
): number {
  return (
    (daysFromJ2000Date(instant.year, instant.month, instant.day) - 0.5) * SECONDS_PER_DAY +
    instant.secondsOfDay
  );
}

function pad(n: number, width: number): string {
  return String(n).padStart(width, '0');
}

/**
 * "YYYY-MM-DDThh:mm:ss.sss" for a day number (from 2000-01-01) and seconds of that day, rounded to the
 * millisecond. A day that ends in a leap second is 86 401 s long and its last second is shown as 60.
 */
export function formatIsoCalendar(
  days: number,
  secondsOfDay: number,
  dayLengthSeconds = SECONDS_PER_DAY,
): string {
  let ms = Math.round(secondsOfDay * 1000);
  let d = days;
  if (ms >= dayLengthSeconds * 1000) {
    d += 1;
    ms -= dayLengthSeconds * 1000;
  }
  const { year, month, day } = dateFromJ2000Days(d);
  const leapMs = ms - SECONDS_PER_DAY * 1000;
  const hh = leapMs >= 0 ? 23 : Math.floor(ms / 3_600_000);
  const mm = leapMs >= 0 ? 59 : Math.floor((ms % 3_600_000) / 60_000);
  const ssMs = leapMs >= 0 ? 60_000 + leapMs : ms % 60_000;
  return `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}T${pad(hh, 2)}:${pad(mm, 2)}:${pad(Math.floor(ssMs / 1000), 2)}.${pad(ssMs % 1000, 3)}`;
}
