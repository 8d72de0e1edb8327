import { lineText, noteText, TEXT_LIMITS } from '@limbus/schema/text';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { REPORT_RESULTS, reportsQueryKey, type Report } from './get-reports';
import { apiRequest } from '@/lib/api-client';

// The form checks only what each field is on its own (a UTC time, a σ, a text's length); what a result
// needs as a whole (both times of a positive, in order) is the server's rule, and its 400 lands on the
// fields it names.
const UTC_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/;
const utcTime = z.string().regex(UTC_TIME, 'expected a UTC time such as "2028-03-14T02:11:04.25Z"');
const timedMark = z.object({
  time: utcTime,
  sigmaSeconds: z
    .number({ error: 'σ must be a number of seconds' })
    .positive('σ must be greater than zero (a 1-σ timing uncertainty)'),
});

export const reportInputSchema = z.object({
  stationId: z.string().min(1, 'choose the station'),
  result: z.enum(REPORT_RESULTS),
  /** A positive whose times are to come from timing its light curve; the typed times are then optional. */
  timesFromLightCurve: z.boolean(),
  disappearance: timedMark.nullable(),
  reappearance: timedMark.nullable(),
  observedFromUtc: utcTime.nullable(),
  observedToUtc: utcTime.nullable(),
  ringDips: z.array(
    z.object({ ring: lineText(TEXT_LIMITS.ringLabel, 'ring label'), start: timedMark, end: timedMark }),
  ),
  notes: noteText(TEXT_LIMITS.note).nullable(),
});

export type ReportInput = z.infer<typeof reportInputSchema>;

/** A stored report as the form's input, to compare an edit against. */
export function inputOf(report: Report): ReportInput {
  return {
    stationId: report.stationId,
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

/**
 * Only the fields the result uses travel, so a report changed from positive to clouded out drops its
 * times. Ring dips belong to positives and negatives alike: a ring can hide the star either way.
 */
export function reportPayload(input: ReportInput): Record<string, unknown> {
  const { stationId, result, notes } = input;
  if (result === 'positive')
    return {
      stationId,
      result,
      notes,
      timesFromLightCurve: input.timesFromLightCurve,
      disappearance: input.disappearance,
      reappearance: input.reappearance,
      ringDips: input.ringDips,
    };
  if (result === 'negative')
    return {
      stationId,
      result,
      notes,
      observedFromUtc: input.observedFromUtc,
      observedToUtc: input.observedToUtc,
      ringDips: input.ringDips,
    };
  return { stationId, result, notes };
}

const createdSchema = z.object({ id: z.string() });

/** Creates the report, or edits it when `reportId` is given (allowed until a coordinator accepts it). */
export async function submitReport(
  eventId: string,
  input: ReportInput,
  reportId: string | null,
): Promise<string> {
  const payload = reportPayload(input);
  if (reportId === null) {
    const created = await apiRequest(`/api/events/${encodeURIComponent(eventId)}/reports`, {
      method: 'POST',
      body: payload,
      schema: createdSchema,
    });
    return created.id;
  }
  const { stationId: _stationId, ...patch } = payload;
  await apiRequest(`/api/reports/${encodeURIComponent(reportId)}`, { method: 'PATCH', body: patch });
  return reportId;
}

export function useSubmitReport(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ input, reportId }: { input: ReportInput; reportId: string | null }) =>
      submitReport(eventId, input, reportId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reportsQueryKey(eventId) }),
  });
}
