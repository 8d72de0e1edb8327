// The product speaks UTC throughout, as the timings do; a local clock time would invite mix-ups.

/**
 * A server time in UTC, "2029-09-07 21:38:00 UTC" (or "2029-09-07 21:38 UTC" to the minute), whatever
 * offset it came with; text that is not a time is left as it is.
 */
export function utcText(iso: string, precision: 'seconds' | 'minutes' = 'seconds'): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return `${date
    .toISOString()
    .slice(0, precision === 'seconds' ? 19 : 16)
    .replace('T', ' ')} UTC`;
}

/** A UTC time in a form field: "2028-03-14T02:11:04Z" as "2028-03-14 02:11:04". */
export function utcFieldText(iso: string): string {
  return iso.slice(0, 19).replace('T', ' ');
}

export type UtcParse = { ok: true; iso: string } | { ok: false; message: string };

const UTC_INPUT = /^(\d{4})-(\d{2})-(\d{2})[T\s]+(\d{2}):(\d{2})(?::(\d{2})(\.\d+)?)?\s*(?:Z|UTC)?$/i;

/**
 * A UTC time as people type it — "2028-03-14 02:11", "2028-03-14 02:11:04.5", "2028-03-14T02:11:04Z",
 * with or without "UTC" — as the API's ISO 8601 form ending in Z.
 */
export function parseUtcInput(input: string): UtcParse {
  const m = UTC_INPUT.exec(input.trim());
  if (m === null) return { ok: false, message: 'not a UTC time (e.g. 2028-03-14 02:11:04)' };
  const [, y, mo, d, h, mi, s = '00', fraction = ''] = m;
  const [year, month, day, hour, minute, second] = [y, mo, d, h, mi, s].map(Number) as [
    number,
    number,
    number,
    number,
    number,
    number,
  ];
  const date = new Date(Date.UTC(year, month - 1, day));
  if (date.getUTCMonth() !== month - 1 || date.getUTCDate() !== day)
    return { ok: false, message: `${y}-${mo}-${d} is not a calendar date` };
  if (hour > 23 || minute > 59 || second > 59)
    return { ok: false, message: 'hours must be below 24, minutes and seconds below 60' };
  return { ok: true, iso: `${y}-${mo}-${d}T${h}:${mi}:${s}${fraction}Z` };
}
