import { invitationViewSchema } from '@limbus/schema/views';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { invitationsQueryKey } from './get-invitations';
import { apiRequest } from '@/lib/api-client';

/** Sends a new link with a new expiry; the link sent before stops working. */
export function resendInvitation(teamId: string, invitationId: string) {
  return apiRequest(
    `/api/teams/${encodeURIComponent(teamId)}/invitations/${encodeURIComponent(invitationId)}/resend`,
    { method: 'POST', schema: invitationViewSchema },
  );
}

export function useResendInvitation(teamId: string, invitationId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => resendInvitation(teamId, invitationId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsQueryKey(teamId) }),
  });
}
