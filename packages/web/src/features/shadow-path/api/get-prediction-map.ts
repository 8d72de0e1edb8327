import { predictionMapSchema, type PredictionMap } from '@limbus/schema/planning';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

/**
 * Under the event's key: a change to the event (its prediction settings, its stations) refreshes every
 * `['events', eventId, …]` query, the map among them.
 */
export const predictionMapQueryKey = (eventId: string) => ['events', eventId, 'prediction', 'map'] as const;

/** The shadow-path map as data (GET /api/events/:eventId/prediction/map), which the figure draws too. */
export function getPredictionMap(eventId: string, signal?: AbortSignal): Promise<PredictionMap> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/prediction/map`, {
    schema: predictionMapSchema,
    signal,
  });
}

export function predictionMapQueryOptions(eventId: string) {
  return queryOptions({
    queryKey: predictionMapQueryKey(eventId),
    queryFn: ({ signal }) => getPredictionMap(eventId, signal),
  });
}

export function usePredictionMap(eventId: string) {
  return useQuery(predictionMapQueryOptions(eventId));
}
