import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { timingQueryKey } from './timing-schema';
import { apiRequest } from '@/lib/api-client';

export function acceptTiming(eventId: string, timingId: string) {
  return apiRequest(
    `/api/events/${encodeURIComponent(eventId)}/timings/${encodeURIComponent(timingId)}/accept`,
    { method: 'POST', schema: z.object({ chordId: z.string() }) },
  );
}

/** The chord changed too, so the event (which lists its chords) is refreshed as well. */
export function useAcceptTiming(eventId: string, timingId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => acceptTiming(eventId, timingId),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: timingQueryKey(eventId, timingId) });
      await queryClient.invalidateQueries({ queryKey: ['events'] });
    },
  });
}
