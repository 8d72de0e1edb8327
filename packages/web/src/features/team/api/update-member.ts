import type { UpdateMemberPayload } from '@limbus/schema/team';
import { memberViewSchema } from '@limbus/schema/views';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { membersQueryKey } from './get-members';
import { apiRequest } from '@/lib/api-client';

/** Gives a member exactly these roles; 409 when that would leave the team without a coordinator. */
export function updateMember(teamId: string, userId: string, payload: UpdateMemberPayload) {
  return apiRequest(`/api/teams/${encodeURIComponent(teamId)}/members/${encodeURIComponent(userId)}`, {
    method: 'PATCH',
    body: payload,
    schema: memberViewSchema,
  });
}

export function useUpdateMember(teamId: string, userId: string, onUpdated?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (payload: UpdateMemberPayload) => updateMember(teamId, userId, payload),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: membersQueryKey(teamId) });
      onUpdated?.();
    },
  });
}
