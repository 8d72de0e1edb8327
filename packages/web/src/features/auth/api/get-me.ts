import { meViewSchema, type MeView } from '@limbus/schema/views';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

export type Me = MeView;
export type TeamMembership = MeView['teams'][number];

export const meQueryKey = ['me'] as const;

export function getMe(signal?: AbortSignal): Promise<Me> {
  return apiRequest('/api/me', { schema: meViewSchema, signal });
}

export function meQueryOptions() {
  return queryOptions({ queryKey: meQueryKey, queryFn: ({ signal }) => getMe(signal) });
}

export function useMe({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...meQueryOptions(), enabled });
}
