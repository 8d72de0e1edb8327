import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { timingsQueryKey, timingSummarySchema } from './timing-schema';
import { apiRequest } from '@/lib/api-client';

const positive = (what: string) =>
  z.number({ error: `${what} must be a number` }).positive(`${what} must be greater than zero`);

/** The form's fields, checked before they are sent; the server checks them again. */
export const createTimingInputSchema = z.object({
  speedKmPerS: positive('speedKmPerS'),
  distanceKm: positive('distanceKm'),
  exposureSeconds: positive('exposureSeconds'),
  bottom: z.enum(['free', 'zero']),
});
export type CreateTimingInput = z.infer<typeof createTimingInputSchema>;

export function createTiming(eventId: string, reportId: string, input: CreateTimingInput) {
  return apiRequest(
    `/api/events/${encodeURIComponent(eventId)}/reports/${encodeURIComponent(reportId)}/timings`,
    { method: 'POST', body: input, schema: timingSummarySchema },
  );
}

export function useCreateTiming(eventId: string, reportId: string, onQueued: (timingId: string) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateTimingInput) => createTiming(eventId, reportId, input),
    onSuccess: async ({ id }) => {
      onQueued(id);
      await queryClient.invalidateQueries({ queryKey: timingsQueryKey(eventId, reportId) });
    },
  });
}
