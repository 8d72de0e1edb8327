import { useMutation, useQueryClient } from '@tanstack/react-query';
import { type ContextInputFile } from '@limbus/schema';
import { dynamicsQueryKey, dynamicsViewSchema } from './dynamics-schema';
import { apiRequest } from '@/lib/api-client';

export function putDynamics(eventId: string, input: ContextInputFile) {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/dynamics`, {
    method: 'PUT',
    body: input,
    schema: dynamicsViewSchema,
  });
}

export function usePutDynamics(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ContextInputFile) => putDynamics(eventId, input),
    onSuccess: (view) => queryClient.setQueryData(dynamicsQueryKey(eventId), view),
  });
}
