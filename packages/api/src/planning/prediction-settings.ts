// Rules of the event's prediction settings that the event's own PATCH applies: the section must fit the
// ephemeris it predicts from, and the record of where its offset came from lasts only while the offset and
// its σ are still the fit's.
import type { EphemerisRow, PredictionSettings, TimeScale } from '@limbus/geometry';
import { type PredictionOffsetSource, predictionSpanProblems } from '@limbus/schema';
import type { FieldIssue } from '../common/domain-errors';

/** `prediction.from` and `prediction.to` within the ephemeris rows, by the event file's own rule. */
export function predictionSettingsProblems(
  ephemeris: { timeScale: TimeScale; rows: EphemerisRow[] },
  settings: PredictionSettings | null,
): FieldIssue[] {
  return settings === null ? [] : predictionSpanProblems({ ephemeris, prediction: settings });
}

const same = (a: { raCosDec: number; dec: number }, b: { raCosDec: number; dec: number }) =>
  a.raCosDec === b.raCosDec && a.dec === b.dec;

/** Whether new settings still carry the offset and σ a fit gave (else the source no longer holds). */
export function keepsOffsetSource(
  source: PredictionOffsetSource,
  settings: PredictionSettings | null,
): boolean {
  return (
    settings !== null &&
    same(settings.offsetMas, source.offsetMas) &&
    same(settings.uncertaintyMas, source.uncertaintyMas)
  );
}
