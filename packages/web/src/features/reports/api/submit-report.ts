import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { REPORT_RESULTS, reportsQueryKey } from './get-reports';
import { apiRequest } from '@/lib/api-client';

const UTC_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/;
const utcTime = z.string().regex(UTC_TIME, 'expected a UTC time such as "2028-03-14T02:11:04.25Z"');
const timedMark = z.object({
  time: utcTime,
  sigmaSeconds: z
    .number({ error: 'σ must be a number of seconds' })
    .positive('σ must be greater than zero (a 1-σ timing uncertainty)'),
});

const later = (a: string, b: string) => Date.parse(b) > Date.parse(a);

/** What a result needs, as the server checks it: a positive both timings in order, a negative its span. */
export const reportInputSchema = z
  .object({
    stationId: z.string().min(1, 'choose the station'),
    result: z.enum(REPORT_RESULTS),
    disappearance: timedMark.nullable(),
    reappearance: timedMark.nullable(),
    observedFromUtc: utcTime.nullable(),
    observedToUtc: utcTime.nullable(),
    notes: z.string().trim().max(10_000, 'at most 10 000 characters').nullable(),
  })
  .superRefine((report, ctx) => {
    if (report.result === 'positive') {
      if (report.disappearance === null)
        ctx.addIssue({
          code: 'custom',
          path: ['disappearance'],
          message: 'a positive report needs the disappearance',
        });
      if (report.reappearance === null)
        ctx.addIssue({
          code: 'custom',
          path: ['reappearance'],
          message: 'a positive report needs the reappearance',
        });
      if (
        report.disappearance &&
        report.reappearance &&
        !later(report.disappearance.time, report.reappearance.time)
      )
        ctx.addIssue({
          code: 'custom',
          path: ['reappearance'],
          message: 'reappearance must come after disappearance',
        });
    }
    if (report.result === 'negative') {
      if (report.observedFromUtc === null)
        ctx.addIssue({
          code: 'custom',
          path: ['observedFromUtc'],
          message: 'a negative report needs the start of the span watched',
        });
      if (report.observedToUtc === null)
        ctx.addIssue({
          code: 'custom',
          path: ['observedToUtc'],
          message: 'a negative report needs the end of the span watched',
        });
      if (
        report.observedFromUtc &&
        report.observedToUtc &&
        !later(report.observedFromUtc, report.observedToUtc)
      )
        ctx.addIssue({
          code: 'custom',
          path: ['observedToUtc'],
          message: 'the end must come after the start',
        });
    }
  });

export type ReportInput = z.infer<typeof reportInputSchema>;

/** Only the fields the result uses travel, so a report changed from positive to clouded out drops its times. */
export function reportPayload(input: ReportInput): Record<string, unknown> {
  const { stationId, result, notes } = input;
  if (result === 'positive')
    return { stationId, result, notes, disappearance: input.disappearance, reappearance: input.reappearance };
  if (result === 'negative')
    return {
      stationId,
      result,
      notes,
      observedFromUtc: input.observedFromUtc,
      observedToUtc: input.observedToUtc,
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
