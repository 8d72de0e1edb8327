import type { PatchReportPayload, ReportTimings } from '@limbus/schema';
import type { Report } from './entities/report.entity';

/** The fields an observer writes: what an edit or a correction changes. */
export type ReportFields = Pick<
  Report,
  | 'result'
  | 'timesFromLightCurve'
  | 'disappearance'
  | 'reappearance'
  | 'observedFromUtc'
  | 'observedToUtc'
  | 'ringDips'
  | 'notes'
>;

/** The fields the report's chord is made of; changing any of them rewrites the chord. */
export const CHORD_FIELDS = [
  'result',
  'timesFromLightCurve',
  'disappearance',
  'reappearance',
  'observedFromUtc',
  'observedToUtc',
] as const satisfies ReadonlyArray<keyof ReportFields & keyof ReportTimings>;

/** A field left out of the payload keeps its value; null clears it. */
export function applyReportFields(target: ReportFields, body: PatchReportPayload): void {
  if (body.result !== undefined) target.result = body.result;
  if (body.timesFromLightCurve !== undefined) target.timesFromLightCurve = body.timesFromLightCurve;
  if (body.disappearance !== undefined) target.disappearance = body.disappearance;
  if (body.reappearance !== undefined) target.reappearance = body.reappearance;
  if (body.observedFromUtc !== undefined) target.observedFromUtc = body.observedFromUtc;
  if (body.observedToUtc !== undefined) target.observedToUtc = body.observedToUtc;
  if (body.ringDips !== undefined) target.ringDips = body.ringDips;
  if (body.notes !== undefined) target.notes = body.notes;
}

/** A detached copy, to check a change before it touches the stored report. */
export function reportFieldsOf(report: Report): ReportFields {
  return {
    result: report.result,
    timesFromLightCurve: report.timesFromLightCurve,
    disappearance: report.disappearance,
    reappearance: report.reappearance,
    observedFromUtc: report.observedFromUtc,
    observedToUtc: report.observedToUtc,
    ringDips: report.ringDips,
    notes: report.notes,
  };
}
