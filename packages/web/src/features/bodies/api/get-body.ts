import { queryOptions, useQuery } from '@tanstack/react-query';
import { bodyDetailSchema, type BodyDetail, type BodyEventRow } from '@limbus/schema/views';
import { apiRequest } from '@/lib/api-client';

export type { BodyDetail, BodyEventRow };

export const bodyQueryKey = (bodyId: string) => ['bodies', bodyId] as const;

export function getBody(bodyId: string, signal?: AbortSignal): Promise<BodyDetail> {
  return apiRequest(`/api/bodies/${encodeURIComponent(bodyId)}`, { schema: bodyDetailSchema, signal });
}

export function bodyQueryOptions(bodyId: string) {
  return queryOptions({ queryKey: bodyQueryKey(bodyId), queryFn: ({ signal }) => getBody(bodyId, signal) });
}

export function useBody(bodyId: string) {
  return useQuery(bodyQueryOptions(bodyId));
}
