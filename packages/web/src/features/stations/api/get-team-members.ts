import { memberViewSchema, type MemberView } from '@limbus/schema/views';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export type TeamMember = MemberView;

/** The same key the team page uses, so a change of members there refreshes the observer choice here. */
export const teamMembersQueryKey = (teamId: string) => ['teams', teamId, 'members'] as const;

export function getTeamMembers(teamId: string, signal?: AbortSignal): Promise<TeamMember[]> {
  return apiRequest(`/api/teams/${encodeURIComponent(teamId)}/members`, {
    schema: z.array(memberViewSchema),
    signal,
  });
}

export function teamMembersQueryOptions(teamId: string) {
  return queryOptions({
    queryKey: teamMembersQueryKey(teamId),
    queryFn: ({ signal }) => getTeamMembers(teamId, signal),
  });
}

/** The team's members, to choose a station's observer from. */
export function useTeamMembers(teamId: string) {
  return useQuery(teamMembersQueryOptions(teamId));
}
