import { useMutation, useQueryClient } from '@tanstack/react-query';
import { patchBodyPayloadSchema, type PatchBodyPayload } from '@limbus/schema/bodies';
import { bodyDetailSchema, type BodyDetail } from '@limbus/schema/views';
import { bodiesQueryKey } from './get-bodies';
import { bodyQueryKey } from './get-body';
import { apiRequest } from '@/lib/api-client';

/** Renames the body or changes its designation (coordinators); 400 `name` when the name is taken. */
export function updateBody(bodyId: string, payload: PatchBodyPayload): Promise<BodyDetail> {
  return apiRequest(`/api/bodies/${encodeURIComponent(bodyId)}`, {
    method: 'PATCH',
    body: patchBodyPayloadSchema.parse(payload),
    schema: bodyDetailSchema,
  });
}

export function useUpdateBody(bodyId: string, teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (payload: PatchBodyPayload) => updateBody(bodyId, payload),
    onSuccess: async (detail) => {
      queryClient.setQueryData(bodyQueryKey(bodyId), detail);
      // The list and the events carry the name too.
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: bodiesQueryKey(teamId) }),
        queryClient.invalidateQueries({ queryKey: ['events'] }),
      ]);
    },
  });
}
