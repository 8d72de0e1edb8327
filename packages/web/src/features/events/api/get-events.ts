import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { ApiError, apiRequest } from '@/lib/api-client';

export const eventSummarySchema = z.object({
  id: z.string(),
  title: z.string(),
  teamId: z.string(),
  // Summary fields the events endpoint adds; optional so an older server still lists titles.
  eventDate: z.string().nullable().optional(),
  counts: z
    .object({ stations: z.number(), chords: z.number(), reports: z.number(), fits: z.number() })
    .optional(),
  latestFit: z.object({ id: z.string(), state: z.string() }).nullable().optional(),
});

export type EventSummary = z.infer<typeof eventSummarySchema>;

export async function getEvents(signal?: AbortSignal): Promise<EventSummary[]> {
  try {
    return await apiRequest('/api/events', { schema: z.array(eventSummarySchema), signal });
  } catch (error) {
    // Until the events endpoint lands the server answers 404; that is "no events", not a failure.
    if (error instanceof ApiError && error.status === 404) return [];
    throw error;
  }
}

export const eventsQueryKey = ['events'] as const;

export function eventsQueryOptions() {
  return queryOptions({ queryKey: eventsQueryKey, queryFn: ({ signal }) => getEvents(signal) });
}

export function useEvents() {
  return useQuery(eventsQueryOptions());
}
