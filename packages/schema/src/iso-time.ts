// The two time spellings of the event file. Chord and ring times are UTC and say so with a final Z;
// ephemeris times carry no zone because their scale (UTC, TT or TDB) is declared once for the table.
// Both keep any number of decimals: occultation timings are often given to 1 ms or better.

const ISO_BODY = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2}):(\d{2})(\.\d+)?$/;

export interface CalendarTime {
  /** Seconds since 1970-01-01T00:00:00 on a uniform 86 400 s/day count; only for ordering times. */
  orderSeconds: number;
}

function daysInMonth(year: number, month: number): number {
  return new Date(Date.UTC(year, month, 0)).getUTCDate();
}

/**
 * Calendar fields of "YYYY-MM-DDThh:mm:ss[.fff…]", checked for real dates. Second 60 is accepted
 * because a leap second can be the moment a timing was made (23:59:60 UTC); whether it is a real leap
 * second is for the time-scale code to judge.
 */
function parseBody(body: string): CalendarTime | null {
  const m = ISO_BODY.exec(body);
  if (m === null) return null;
  const [year, month, day, hour, minute, second] = m.slice(1, 7).map(Number) as [
    number,
    number,
    number,
    number,
    number,
    number,
  ];
  const fraction = m[7] === undefined ? 0 : Number(m[7]);
  if (month < 1 || month > 12 || day < 1 || day > daysInMonth(year, month)) return null;
  if (hour > 23 || minute > 59 || second > 60) return null;
  const wholeSeconds = Date.UTC(year, month - 1, day, hour, minute, 0) / 1000 + second;
  return { orderSeconds: wholeSeconds + fraction };
}

/** A UTC time such as "2028-03-14T02:11:04.123Z", or null when it is not one. */
export function parseUtcTime(text: string): CalendarTime | null {
  return text.endsWith('Z') ? parseBody(text.slice(0, -1)) : null;
}

/** An ephemeris time such as "2028-03-14T02:10:00" (no zone), or null when it is not one. */
export function parseZonelessTime(text: string): CalendarTime | null {
  return parseBody(text);
}
