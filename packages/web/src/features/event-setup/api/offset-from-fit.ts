import { offsetFromFitAnswerSchema, type OffsetFromFitAnswer } from '@limbus/schema/planning';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

/**
 * Takes the astrometric offset and its 1σ that a solved fit of an earlier event of the same body measured
 * as the prediction's offsetMas and uncertaintyMas, saved at once with which fit it came from
 * (POST /api/events/:eventId/prediction/offset-from-fit).
 */
export function offsetFromFit(eventId: string, fitId: string): Promise<OffsetFromFitAnswer> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/prediction/offset-from-fit`, {
    method: 'POST',
    body: { fitId },
    schema: offsetFromFitAnswerSchema,
  });
}

export function useOffsetFromFit(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fitId: string) => offsetFromFit(eventId, fitId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['events', eventId] }),
  });
}
