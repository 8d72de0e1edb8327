import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { fitSummarySchema, type FitSummary } from './get-fit';
import { apiRequest } from '@/lib/api-client';

export const fitsQueryKey = (eventId: string) => ['events', eventId, 'fits'] as const;

export function getFits(eventId: string, signal?: AbortSignal): Promise<FitSummary[]> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/fits`, {
    schema: z.array(fitSummarySchema),
    signal,
  });
}

export function fitsQueryOptions(eventId: string) {
  return queryOptions({ queryKey: fitsQueryKey(eventId), queryFn: ({ signal }) => getFits(eventId, signal) });
}

export function useFits(eventId: string) {
  return useQuery(fitsQueryOptions(eventId));
}
