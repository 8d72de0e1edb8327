import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { timingQueryKey } from './timing-schema';
import { apiRequest } from '@/lib/api-client';

export const ringNameSchema = z.string().trim().min(1, 'ring name must not be empty').max(100);

export function dipsToRingEvents(eventId: string, timingId: string, ring: string) {
  return apiRequest(
    `/api/events/${encodeURIComponent(eventId)}/timings/${encodeURIComponent(timingId)}/ring-events`,
    { method: 'POST', body: { ring }, schema: z.object({ ringEventIds: z.array(z.string()) }) },
  );
}

export function useDipsToRingEvents(eventId: string, timingId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (ring: string) => dipsToRingEvents(eventId, timingId, ring),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: timingQueryKey(eventId, timingId) });
      await queryClient.invalidateQueries({ queryKey: ['events'] });
    },
  });
}
