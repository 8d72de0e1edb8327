// Two facts derived from an event's data, each in one place: the hash that tells whether a fit was run
// on the data the event holds now, and the event time a new event starts with.
import { chordFirstTimeUtc, isoToTtSeconds, ttSecondsToUtcIso, type EventInput } from '@limbus/geometry';
import { sha256Hex } from '../common/tokens';

/** The parts of an event file that a fit's result depends on; the title and the fit options are not. */
export type EventData = Pick<
  EventInput,
  'star' | 'ephemeris' | 'earthRotation' | 'stations' | 'chords' | 'ringEvents'
>;

/** JSON with object keys sorted at every level, so equal data hashes equally whatever the key order. */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/**
 * SHA-256 (hex) of the event's data. A fit stores the value of its input; the event's current value
 * differs as soon as a station, chord, ring event, the star, the ephemeris or DUT1 changes, which is
 * what marks an approved fit as based on older data. Renaming the event or changing fit defaults does not.
 */
export function eventDataSha256(file: EventData): string {
  const data = {
    star: file.star,
    ephemeris: file.ephemeris,
    earthRotation: file.earthRotation,
    stations: file.stations,
    chords: file.chords,
    ringEvents: file.ringEvents,
  };
  return sha256Hex(canonicalJson(data));
}

/**
 * When an event happened, to the whole second in UTC ("YYYY-MM-DDThh:mm:ssZ"), until someone enters it:
 * the earliest timing of its chords (a positive's disappearance, a negative's start) when it has any,
 * else the middle of its ephemeris table, which a prediction centres on the event (common practice, no
 * source).
 */
export function defaultEventTimeUtc(file: {
  ephemeris: EventInput['ephemeris'];
  chords?: EventInput['chords'] | undefined;
}): string {
  // ISO 8601 UTC texts ending in Z sort in time order.
  const timings = (file.chords ?? []).map(chordFirstTimeUtc).sort();
  const earliest = timings[0];
  if (earliest !== undefined) return wholeSecondUtc(earliest);
  const { ephemeris } = file;
  const first = ephemeris.rows[0];
  const last = ephemeris.rows.at(-1);
  if (first === undefined || last === undefined) throw new Error('an ephemeris has at least 4 rows');
  const middleTt =
    (isoToTtSeconds(first.time, ephemeris.timeScale) + isoToTtSeconds(last.time, ephemeris.timeScale)) / 2;
  return wholeSecondUtc(ttSecondsToUtcIso(middleTt));
}

/** "…T03:12:31.250Z" → "…T03:12:31Z": the event time is kept to the second, as a sortable text. */
export function wholeSecondUtc(isoUtc: string): string {
  return `${isoUtc.slice(0, 19)}Z`;
}
