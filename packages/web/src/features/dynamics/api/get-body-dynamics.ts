import { queryOptions, useQuery } from '@tanstack/react-query';
import { dynamicsResponseSchema, type DynamicsView } from './dynamics-schema';
import { apiRequest } from '@/lib/api-client';

export const bodyDynamicsQueryKey = (bodyId: string) => ['bodies', bodyId, 'dynamics'] as const;

/** The body's physical parameters and its events' fitted rings against them; null before any are entered. */
export function getBodyDynamics(bodyId: string, signal?: AbortSignal): Promise<DynamicsView | null> {
  return apiRequest(`/api/bodies/${encodeURIComponent(bodyId)}/dynamics`, {
    schema: dynamicsResponseSchema,
    signal,
  });
}

export function bodyDynamicsQueryOptions(bodyId: string) {
  return queryOptions({
    queryKey: bodyDynamicsQueryKey(bodyId),
    queryFn: ({ signal }) => getBodyDynamics(bodyId, signal),
  });
}

export function useBodyDynamics(bodyId: string) {
  return useQuery(bodyDynamicsQueryOptions(bodyId));
}
