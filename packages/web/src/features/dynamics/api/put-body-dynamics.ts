import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ContextInputFile } from '@limbus/schema';
import { dynamicsViewSchema } from './dynamics-schema';
import { bodyDynamicsQueryKey } from './get-body-dynamics';
import { apiRequest } from '@/lib/api-client';

/** Writes the body's physical parameters (coordinators and modellers); 400 names the field of the document. */
export function putBodyDynamics(bodyId: string, input: ContextInputFile) {
  return apiRequest(`/api/bodies/${encodeURIComponent(bodyId)}/dynamics`, {
    method: 'PUT',
    body: input,
    schema: dynamicsViewSchema,
  });
}

export function usePutBodyDynamics(bodyId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ContextInputFile) => putBodyDynamics(bodyId, input),
    onSuccess: async (view) => {
      queryClient.setQueryData(bodyDynamicsQueryKey(bodyId), view);
      // Every event of the body reads these parameters, and the body lists say whether they are entered.
      await queryClient.invalidateQueries({
        predicate: ({ queryKey: [scope, , part] }) =>
          (scope === 'events' && part === 'dynamics') ||
          (scope === 'teams' && part === 'bodies') ||
          (scope === 'bodies' && part === undefined),
      });
    },
  });
}
