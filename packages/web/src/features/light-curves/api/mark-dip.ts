import { useMutation, useQueryClient } from '@tanstack/react-query';
import { timingsQueryKey, timingSummarySchema } from './timing-schema';
import { apiRequest } from '@/lib/api-client';

export interface MarkDipInput {
  startUtc: string;
  endUtc: string;
}

/** The server measures the marked dip by running the timing again with it; the new run is returned. */
export function markDip(eventId: string, timingId: string, input: MarkDipInput) {
  return apiRequest(
    `/api/events/${encodeURIComponent(eventId)}/timings/${encodeURIComponent(timingId)}/dips`,
    {
      method: 'POST',
      body: input,
      schema: timingSummarySchema,
    },
  );
}

export function useMarkDip(
  eventId: string,
  reportId: string,
  timingId: string,
  onQueued: (id: string) => void,
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: MarkDipInput) => markDip(eventId, timingId, input),
    onSuccess: async ({ id }) => {
      onQueued(id);
      await queryClient.invalidateQueries({ queryKey: timingsQueryKey(eventId, reportId) });
    },
  });
}
