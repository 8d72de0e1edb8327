import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { sessionResponseSchema, startSession } from '@/lib/session';

export const MIN_PASSWORD_LENGTH = 10;

export const acceptInvitationInputSchema = z.object({
  name: z.string().trim().min(1, 'Enter your name'),
  password: z.string().min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters`),
});

export type AcceptInvitationInput = z.infer<typeof acceptInvitationInputSchema>;

export function acceptInvitation(token: string, input: AcceptInvitationInput) {
  return apiRequest(`/api/invitations/${encodeURIComponent(token)}/accept`, {
    method: 'POST',
    body: input,
    schema: sessionResponseSchema,
    anonymous: true,
  });
}

export function useAcceptInvitation(token: string, onAccepted: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AcceptInvitationInput) => acceptInvitation(token, input),
    onSuccess: (session) => {
      startSession(queryClient, session.accessToken);
      onAccepted();
    },
  });
}
