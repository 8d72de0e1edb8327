import { queryOptions, useQuery } from '@tanstack/react-query';
import { dynamicsResponseSchema, type DynamicsView } from './dynamics-schema';
import { apiRequest } from '@/lib/api-client';

export const eventDynamicsQueryKey = (eventId: string) => ['events', eventId, 'dynamics'] as const;

/** The event's body's physical parameters with this event's fitted rings; null before any are entered. */
export function getEventDynamics(eventId: string, signal?: AbortSignal): Promise<DynamicsView | null> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/dynamics`, {
    schema: dynamicsResponseSchema,
    signal,
  });
}

export function eventDynamicsQueryOptions(eventId: string) {
  return queryOptions({
    queryKey: eventDynamicsQueryKey(eventId),
    queryFn: ({ signal }) => getEventDynamics(eventId, signal),
  });
}

export function useEventDynamics(eventId: string) {
  return useQuery(eventDynamicsQueryOptions(eventId));
}
