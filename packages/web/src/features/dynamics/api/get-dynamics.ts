import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { dynamicsQueryKey, dynamicsViewSchema, type DynamicsView, noDynamicsSchema } from './dynamics-schema';
import { apiRequest } from '@/lib/api-client';

const responseSchema = z.union([noDynamicsSchema.transform(() => null), dynamicsViewSchema]);

/** null when the event has no context yet, so the panel can offer the form. */
export function getDynamics(eventId: string, signal?: AbortSignal): Promise<DynamicsView | null> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/dynamics`, {
    schema: responseSchema,
    signal,
  });
}

export function dynamicsQueryOptions(eventId: string) {
  return queryOptions({
    queryKey: dynamicsQueryKey(eventId),
    queryFn: ({ signal }) => getDynamics(eventId, signal),
  });
}

export function useDynamics(eventId: string) {
  return useQuery(dynamicsQueryOptions(eventId));
}
