import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { timingsQueryKey, timingSummarySchema } from './timing-schema';
import { apiRequest } from '@/lib/api-client';

export function getTimings(eventId: string, reportId: string, signal?: AbortSignal) {
  return apiRequest(
    `/api/events/${encodeURIComponent(eventId)}/reports/${encodeURIComponent(reportId)}/timings`,
    { schema: z.array(timingSummarySchema), signal },
  );
}

export function timingsQueryOptions(eventId: string, reportId: string) {
  return queryOptions({
    queryKey: timingsQueryKey(eventId, reportId),
    queryFn: ({ signal }) => getTimings(eventId, reportId, signal),
  });
}

export function useTimings(eventId: string, reportId: string) {
  return useQuery(timingsQueryOptions(eventId, reportId));
}
