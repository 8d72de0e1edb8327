import { REPORT_RESULT_VALUES, reportViewSchema, type ReportView } from '@limbus/schema/views';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const REPORT_RESULTS = REPORT_RESULT_VALUES;
export type ReportResult = (typeof REPORT_RESULTS)[number];
export type Report = ReportView;
export type ReportCorrection = ReportView['corrections'][number];

/** A positive report whose times are to come from timing its light curve, not yet accepted. */
export function waitingForTiming(r: Report): boolean {
  return r.result === 'positive' && r.timesFromLightCurve && r.state === 'submitted';
}

export const reportsQueryKey = (eventId: string) => ['events', eventId, 'reports'] as const;

export function getReports(eventId: string, signal?: AbortSignal): Promise<Report[]> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/reports`, {
    schema: z.array(reportViewSchema),
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
