import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createBodyPayloadSchema, type CreateBodyPayload } from '@limbus/schema/bodies';
import { bodySummarySchema, type BodySummary } from '@limbus/schema/views';
import { bodiesQueryKey } from './get-bodies';
import { apiRequest } from '@/lib/api-client';

export { createBodyPayloadSchema };
export type { CreateBodyPayload };

/** 201 with the new body; 400 `name` when the team already has a body of that name. */
export function createBody(teamId: string, payload: CreateBodyPayload): Promise<BodySummary> {
  return apiRequest(`/api/teams/${encodeURIComponent(teamId)}/bodies`, {
    method: 'POST',
    body: createBodyPayloadSchema.parse(payload),
    schema: bodySummarySchema,
  });
}

export function useCreateBody(teamId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (payload: CreateBodyPayload) => createBody(teamId, payload),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: bodiesQueryKey(teamId) }),
  });
}
