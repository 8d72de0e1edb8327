import { invitationViewSchema, type InvitationView } from '@limbus/schema/views';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export type Invitation = InvitationView;

export const invitationsQueryKey = (teamId: string) => ['teams', teamId, 'invitations'] as const;

/** The team's open invitations (not accepted, not revoked; expired ones flagged). Coordinators only. */
export function getInvitations(teamId: string, signal?: AbortSignal): Promise<Invitation[]> {
  return apiRequest(`/api/teams/${encodeURIComponent(teamId)}/invitations`, {
    schema: z.array(invitationViewSchema),
    signal,
  });
}

export function invitationsQueryOptions(teamId: string) {
  return queryOptions({
    queryKey: invitationsQueryKey(teamId),
    queryFn: ({ signal }) => getInvitations(teamId, signal),
  });
}

export function useInvitations(teamId: string, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...invitationsQueryOptions(teamId), enabled });
}
