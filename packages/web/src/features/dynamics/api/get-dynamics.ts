import { queryOptions, useQuery } from '@tanstack/react-query';
import { dynamicsQueryKey, dynamicsViewSchema, type DynamicsView } from './dynamics-schema';
import { ApiError, apiRequest } from '@/lib/api-client';

/** null when the event has no context yet (404), so the panel can offer the form instead of an error. */
export async function getDynamics(eventId: string, signal?: AbortSignal): Promise<DynamicsView | null> {
  try {
    return await apiRequest(`/api/events/${encodeURIComponent(eventId)}/dynamics`, {
      schema: dynamicsViewSchema,
      signal,
    });
  } catch (error) {
    if (error instanceof ApiError && error.status === 404) return null;
    throw error;
  }
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
