import type { AcceptInvitationPayload } from '@limbus/schema/team';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { sessionResponseSchema, startSession } from '@/lib/session';

/** Joins the team: a new address gets an account, an existing one proves itself with its password. */
export function acceptInvitation(token: string, payload: AcceptInvitationPayload) {
  return apiRequest(`/api/invitations/${encodeURIComponent(token)}/accept`, {
    method: 'POST',
    body: payload,
    schema: sessionResponseSchema,
    anonymous: true,
  });
}

export function useAcceptInvitation(token: string, onAccepted: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (payload: AcceptInvitationPayload) => acceptInvitation(token, payload),
    onSuccess: (session) => {
      startSession(queryClient, session.accessToken);
      onAccepted();
    },
  });
}
