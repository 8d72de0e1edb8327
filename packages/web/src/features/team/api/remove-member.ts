import { useMutation, useQueryClient } from '@tanstack/react-query';
import { membersQueryKey } from './get-members';
import { apiRequest } from '@/lib/api-client';

/** Takes a member out of the team; 409 when they are its last coordinator. */
export function removeMember(teamId: string, userId: string): Promise<void> {
  return apiRequest(`/api/teams/${encodeURIComponent(teamId)}/members/${encodeURIComponent(userId)}`, {
    method: 'DELETE',
  });
}

export function useRemoveMember(teamId: string, userId: string, onRemoved?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => removeMember(teamId, userId),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: membersQueryKey(teamId) });
      onRemoved?.();
    },
  });
}
