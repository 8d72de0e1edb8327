import type { CreateInvitationPayload } from '@limbus/schema/team';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { invitationsQueryKey } from './get-invitations';
import { apiRequest } from '@/lib/api-client';

const createdSchema = z.object({ id: z.string() });

/** E-mails an invitation; 409 when the address is already a member or already has an open invitation. */
export function createInvitation(teamId: string, payload: CreateInvitationPayload) {
  return apiRequest(`/api/teams/${encodeURIComponent(teamId)}/invitations`, {
    method: 'POST',
    body: payload,
    schema: createdSchema,
  });
}

export function useCreateInvitation(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (payload: CreateInvitationPayload) => createInvitation(teamId, payload),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationsQueryKey(teamId) }),
  });
}
