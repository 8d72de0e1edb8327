import { useMutation, useQueryClient } from '@tanstack/react-query';
import { bodiesQueryKey } from './get-bodies';
import { bodyQueryKey } from './get-body';
import { apiRequest } from '@/lib/api-client';

/** 204; 409 while the body still has events (the message says so). */
export function deleteBody(bodyId: string): Promise<void> {
  return apiRequest(`/api/bodies/${encodeURIComponent(bodyId)}`, { method: 'DELETE' });
}

export function useDeleteBody(bodyId: string, teamId: string, onDeleted: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteBody(bodyId),
    onSuccess: async () => {
      queryClient.removeQueries({ queryKey: bodyQueryKey(bodyId) });
      await queryClient.invalidateQueries({ queryKey: bodiesQueryKey(teamId) });
      onDeleted();
    },
  });
}
