import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationsQueryKey } from './get-invitations';
import { apiRequest } from '@/lib/api-client';

/** Withdraws an open invitation; its link stops working. */
export function revokeInvitation(teamId: string, invitationId: string): Promise<void> {
  return apiRequest(
    `/api/teams/${encodeURIComponent(teamId)}/invitations/${encodeURIComponent(invitationId)}`,
    { method: 'DELETE' },
  );
}

export function useRevokeInvitation(teamId: string, invitationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => revokeInvitation(teamId, invitationId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsQueryKey(teamId) }),
  });
}
