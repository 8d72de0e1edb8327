import type { PredictionSection } from '@limbus/schema/prediction';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

/** The section as the form sends it: defaults left to the server where a field was left empty. */
export type PredictionSettingsInput = Partial<PredictionSection> & { bodyRadiusKm: number };

/**
 * The event's prediction settings, alone (PATCH /api/events/:eventId with `prediction`); a refusal names
 * `prediction.<field>` and nothing is saved.
 */
export function updatePredictionSettings(
  eventId: string,
  prediction: PredictionSettingsInput,
): Promise<void> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}`, { method: 'PATCH', body: { prediction } });
}

export function useUpdatePredictionSettings(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (prediction: PredictionSettingsInput) => updatePredictionSettings(eventId, prediction),
    // The map, the coverage and the briefing hang under the event's key and are predicted anew.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['events', eventId] }),
  });
}
