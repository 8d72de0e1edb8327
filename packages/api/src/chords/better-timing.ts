// The rule every accept into a chord obeys (report, light-curve timing, report correction): it never
// silently replaces better-timed values. Times from a light-curve timing, or a σ smaller than the incoming
// one, are kept unless the person, told what would be replaced, repeats the accept with
// `replaceTimedChord: true`. Our product decision (issue 11); common practice, no source.
import type { TimedMark } from '@limbus/geometry';
import type { ChordSourceValue, ReplacesBetterTiming } from '@limbus/schema';

/** The chord as it stands before the accept. */
export interface StandingChord {
  id: string;
  station: string;
  type: 'positive' | 'negative';
  source: ChordSourceValue;
  timingId: string | null;
  disappearance: TimedMark | null;
  reappearance: TimedMark | null;
}

/** What the accept would write: a positive's D and R, a negative (no marks), or no chord at all. */
export interface IncomingChord {
  type: 'positive' | 'negative' | null;
  disappearance: TimedMark | null;
  reappearance: TimedMark | null;
  /** The timing the values come from, when they do; accepting the same timing again replaces nothing. */
  timingId: string | null;
  /** Who brings them, for the message: "the report", "the corrected report", "this timing". */
  what: string;
  /** Their times, for the message: "the report's typed times", "this timing's times". */
  times: string;
}

export interface BetterTimingReplaced {
  message: string;
  detail: ReplacesBetterTiming;
}

const SOURCE_WORDS: Record<ChordSourceValue, string> = {
  import: 'imported',
  report: 'reported',
  manual: 'hand-entered',
  csv: 'CSV-imported',
  timing: 'timed',
};

/** Two significant digits, the way a measurement's error is quoted (common practice, no source). */
function seconds(sigma: number): string {
  return `${Number(sigma.toPrecision(2))} s`;
}

function sigmas(d: TimedMark | null, r: TimedMark | null): string {
  if (!d || !r) return 'no σ';
  const [atD, atR] = [seconds(d.sigmaSeconds), seconds(r.sigmaSeconds)];
  return atD === atR ? `σ ${atD}` : `σ ${atD} at disappearance and ${atR} at reappearance`;
}

function smaller(current: TimedMark | null, incoming: TimedMark | null): boolean {
  return current !== null && incoming !== null && current.sigmaSeconds < incoming.sigmaSeconds;
}

/** Null when the accept may go ahead; otherwise what it would replace, worded for the person. */
export function betterTimingReplaced(
  chord: StandingChord,
  incoming: IncomingChord,
): BetterTimingReplaced | null {
  const fromTiming =
    chord.source === 'timing' && !(incoming.timingId !== null && incoming.timingId === chord.timingId);
  const lessPrecise =
    chord.type === 'positive' &&
    incoming.type === 'positive' &&
    (smaller(chord.disappearance, incoming.disappearance) ||
      smaller(chord.reappearance, incoming.reappearance));
  if (!fromTiming && !lessPrecise) return null;
  const current = sigmas(chord.disappearance, chord.reappearance);
  const holds = fromTiming
    ? `holds times from a light-curve timing (${current})`
    : `holds ${SOURCE_WORDS[chord.source]} times with ${current}`;
  const instead =
    incoming.type === 'positive'
      ? `${incoming.times} have ${sigmas(incoming.disappearance, incoming.reappearance)}`
      : incoming.type === 'negative'
        ? `${incoming.what} would make it a negative chord`
        : `${incoming.what} would remove it`;
  return {
    message: `the chord of ${chord.station} ${holds}; ${instead}`,
    detail: {
      chordId: chord.id,
      station: chord.station,
      source: chord.source,
      timingId: chord.timingId,
      current: { disappearance: chord.disappearance, reappearance: chord.reappearance },
      incoming: { disappearance: incoming.disappearance, reappearance: incoming.reappearance },
    },
  };
}
