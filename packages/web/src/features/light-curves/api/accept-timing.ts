import { useMutation, useQueryClient } from '@tanstack/react-query';
import { timingQueryKey } from './timing-schema';
import { apiRequest } from '@/lib/api-client';

/**
 * Writes the timing's D and R into the station's chord and accepts its report. An accept that would
 * replace better-timed chord values is refused with 409 `replaces-better-timing` until it is repeated
 * with `replaceTimedChord: true`.
 */
export function acceptTiming(eventId: string, timingId: string, replaceTimedChord: boolean): Promise<void> {
  return apiRequest(
    `/api/events/${encodeURIComponent(eventId)}/timings/${encodeURIComponent(timingId)}/accept`,
    { method: 'POST', body: { replaceTimedChord } },
  );
}

/** The chord and the report changed too, so the event's queries (chords, reports, timings) are refreshed. */
export function useAcceptTiming(eventId: string, timingId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ replaceTimedChord = false }: { replaceTimedChord?: boolean } = {}) =>
      acceptTiming(eventId, timingId, replaceTimedChord),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: timingQueryKey(eventId, timingId) });
      await queryClient.invalidateQueries({ queryKey: ['timings', eventId] });
      await queryClient.invalidateQueries({ queryKey: ['events'] });
    },
  });
}
