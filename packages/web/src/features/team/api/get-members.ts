import { memberViewSchema, type MemberView } from '@limbus/schema/views';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export type Member = MemberView;

export const membersQueryKey = (teamId: string) => ['teams', teamId, 'members'] as const;

export function getMembers(teamId: string, signal?: AbortSignal): Promise<Member[]> {
  return apiRequest(`/api/teams/${encodeURIComponent(teamId)}/members`, {
    schema: z.array(memberViewSchema),
    signal,
  });
}

export function membersQueryOptions(teamId: string) {
  return queryOptions({
    queryKey: membersQueryKey(teamId),
    queryFn: ({ signal }) => getMembers(teamId, signal),
  });
}

export function useMembers(teamId: string) {
  return useQuery(membersQueryOptions(teamId));
}
