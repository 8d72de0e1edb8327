import { z } from 'zod';
import { waitingForTiming, type Report, type ReportResult } from '../api/get-reports';
import { inputOf, type ReportInput } from '../api/submit-report';
import { chordSourceText, markText, utcInstantText } from '@/components/timing-text';

export const RESULT_WORDS: Record<ReportResult, string> = {
  positive: 'positive',
  negative: 'negative',
  clouded_out: 'clouded out',
  technical_failure: 'technical failure',
};

/** The report's state in words that agree with the chord: an accepted positive says where its times came from. */
export function stateText(r: Report): string {
  if (waitingForTiming(r)) return 'waiting for timing';
  if (r.state === 'accepted' && r.result === 'positive' && r.chord !== null)
    return `accepted — times ${chordSourceText(r.chord.source)}`;
  return r.state;
}

export function pendingCorrection(r: Report) {
  return r.corrections.find((c) => c.state === 'pending') ?? null;
}

/** The report fields a correction may change, in the order the form shows them. */
export const CORRECTION_FIELDS = [
  ['result', 'Result'],
  ['timesFromLightCurve', 'Times'],
  ['disappearance', 'Disappearance (UTC, 1σ)'],
  ['reappearance', 'Reappearance (UTC, 1σ)'],
  ['observedFromUtc', 'Watched from (UTC)'],
  ['observedToUtc', 'Watched to (UTC)'],
  ['ringDips', 'Ring dips (UTC, 1σ)'],
  ['notes', 'Notes'],
] as const satisfies ReadonlyArray<readonly [keyof ReportInput, string]>;

const markSchema = z.object({ time: z.string(), sigmaSeconds: z.number() });
const dipsSchema = z.array(z.object({ ring: z.string(), start: markSchema, end: markSchema }));

/** A report field's value in words, for a correction's "current" and "proposed" columns. */
export function fieldValueText(field: keyof ReportInput, value: unknown): string {
  if (value === null || value === undefined) return '—';
  if (field === 'timesFromLightCurve')
    return value === true ? 'to be timed from the light curve' : 'typed in the report';
  if (field === 'result' && typeof value === 'string' && value in RESULT_WORDS)
    return RESULT_WORDS[value as ReportResult];
  if (field === 'ringDips') {
    const dips = dipsSchema.safeParse(value);
    if (!dips.success) return JSON.stringify(value);
    if (dips.data.length === 0) return 'none';
    return dips.data.map((d) => `${d.ring}: ${markText(d.start)} to ${markText(d.end)}`).join('; ');
  }
  const mark = markSchema.safeParse(value);
  if (mark.success) return markText(mark.data);
  if (typeof value === 'string')
    return field === 'observedFromUtc' || field === 'observedToUtc' ? utcInstantText(value) : value;
  return JSON.stringify(value);
}

/** The report's current value of a field a correction names. */
export function currentValue(report: Report, field: keyof ReportInput): unknown {
  return inputOf(report)[field];
}
