import type { ChordSourceValue } from '@limbus/schema/views';

export interface TimedMarkValue {
  time: string;
  sigmaSeconds: number;
}

const ISO_UTC = /^(\d{4}-\d{2}-\d{2})T(\d{2}:\d{2}:\d{2}(?:\.\d+)?)Z$/;

/**
 * An observed instant as the desk writes it, "YYYY-MM-DD hh:mm:ss.sss UTC", keeping every decimal the
 * timing carries (a chord's times matter to the millisecond, unlike a fit's start). Other text is shown
 * as it came.
 */
export function utcInstantText(iso: string): string {
  const m = ISO_UTC.exec(iso.trim());
  return m === null ? iso : `${m[1]} ${m[2]} UTC`;
}

/** A 1σ uncertainty in seconds, to three significant digits. */
export function sigmaText(sigmaSeconds: number): string {
  return `± ${Number(sigmaSeconds.toPrecision(3))} s`;
}

/** A timed mark with its 1σ: "2029-05-17 03:12:31.25 UTC ± 0.04 s". */
export function markText(mark: TimedMarkValue | null | undefined): string {
  return mark == null ? '—' : `${utcInstantText(mark.time)} ${sigmaText(mark.sigmaSeconds)}`;
}

const SOURCE_WORDS: Record<ChordSourceValue, string> = {
  timing: 'from a light-curve timing',
  report: "typed in the observer's report",
  manual: 'edited by hand in the chord table',
  csv: 'from a CSV import',
  import: 'from the event file',
};

/**
 * Where a chord's times came from, in words. `report` names the report being looked at, so its own
 * typed times read "typed in this report".
 */
export function chordSourceText(source: ChordSourceValue, view: 'report' | 'event' = 'event'): string {
  return source === 'report' && view === 'report' ? 'typed in this report' : SOURCE_WORDS[source];
}
