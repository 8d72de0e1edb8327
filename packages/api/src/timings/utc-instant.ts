/**
 * A UTC instant split into whole Unix seconds and the fraction, so that microsecond digits survive
 * arithmetic that a single double of ~2e9 seconds would round (a double keeps ~0.2 µs there).
 */
export interface UtcInstant {
  unixSeconds: number;
  fractionSeconds: number;
}

const ISO_UTC = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2}):(\d{2})(\.\d+)?(Z|[+-]00:?00)?$/;

/** Parses ISO 8601 in UTC ("Z", "+00:00" or no zone, read as UTC); a message saying why when it cannot. */
export function parseUtcInstant(text: string): UtcInstant | string {
  const m = ISO_UTC.exec(text.trim());
  if (m === null) return 'not an ISO 8601 UTC time (e.g. 2031-05-20T03:14:15.25Z)';
  const [year, month, day, hour, minute, second] = m.slice(1, 7).map(Number) as [
    number,
    number,
    number,
    number,
    number,
    number,
  ];
  if (month < 1 || month > 12) return 'month out of range';
  if (day < 1 || day > new Date(Date.UTC(year, month, 0)).getUTCDate()) return 'day out of range';
  if (hour > 23 || minute > 59) return 'hour or minute out of range';
  if (second === 60) return 'a leap second (:60) cannot be placed on this time axis';
  if (second > 59) return 'second out of range';
  return {
    unixSeconds: Date.UTC(year, month - 1, day, hour, minute, second) / 1000,
    fractionSeconds: m[7] === undefined ? 0 : Number(`0${m[7]}`),
  };
}

/** Seconds from `origin` to `instant`. */
export function secondsBetween(origin: UtcInstant, instant: UtcInstant): number {
  return instant.unixSeconds - origin.unixSeconds + (instant.fractionSeconds - origin.fractionSeconds);
}

/** ISO 8601 UTC with six decimals of a second, `offsetSeconds` after `origin`. */
export function formatUtcInstant(origin: UtcInstant, offsetSeconds: number): string {
  const total = origin.fractionSeconds + offsetSeconds;
  let whole = Math.floor(total);
  let micro = Math.round((total - whole) * 1e6);
  if (micro >= 1_000_000) {
    whole += 1;
    micro -= 1_000_000;
  }
  const base = new Date((origin.unixSeconds + whole) * 1000).toISOString().slice(0, 19);
  return `${base}.${String(micro).padStart(6, '0')}Z`;
}
