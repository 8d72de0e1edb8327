import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const REPORT_RESULTS = ['positive', 'negative', 'clouded_out', 'technical_failure'] as const;
export type ReportResult = (typeof REPORT_RESULTS)[number];

const timedMarkSchema = z.object({ time: z.string(), sigmaSeconds: z.number() });

export const reportSchema = z.object({
  id: z.string(),
  stationId: z.string(),
  result: z.enum(REPORT_RESULTS),
  state: z.string(),
  disappearance: timedMarkSchema.nullable().optional(),
  reappearance: timedMarkSchema.nullable().optional(),
  observedFromUtc: z.string().nullable().optional(),
  observedToUtc: z.string().nullable().optional(),
  notes: z.string().nullable().optional(),
  rejectReason: z.string().nullable().optional(),
  authorName: z.string().nullable().optional(),
  lightCurve: z.object({ id: z.string(), name: z.string().optional() }).nullable().optional(),
});

export type Report = z.infer<typeof reportSchema>;

export const reportsQueryKey = (eventId: string) => ['events', eventId, 'reports'] as const;

export function getReports(eventId: string, signal?: AbortSignal): Promise<Report[]> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/reports`, {
    schema: z.array(reportSchema),
    signal,
  });
}

export function reportsQueryOptions(eventId: string) {
  return queryOptions({
    queryKey: reportsQueryKey(eventId),
    queryFn: ({ signal }) => getReports(eventId, signal),
  });
}

export function useReports(eventId: string) {
  return useQuery(reportsQueryOptions(eventId));
}
