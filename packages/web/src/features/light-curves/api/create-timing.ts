import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { timingsQueryKey, timingSummarySchema } from './timing-schema';
import { apiRequest } from '@/lib/api-client';

const positive = (what: string) =>
  z.number({ error: `${what} must be a number` }).positive(`${what} must be greater than zero`);

/** The form's fields, checked before they are sent; the server checks them again. */
export const createTimingInputSchema = z.object({
  speedKmPerS: positive('speedKmPerS'),
  speedDisappearanceKmPerS: positive('speedDisappearanceKmPerS'),
  speedReappearanceKmPerS: positive('speedReappearanceKmPerS'),
  edgeSpeedsFrom: z.enum(['fit', 'prediction', 'full', 'entered']),
  distanceKm: positive('distanceKm'),
  exposureSeconds: positive('exposureSeconds'),
  bottom: z.enum(['free', 'zero']),
  ringOpeningAngleDeg: z
    .number()
    .min(-90, 'ringOpeningAngleDeg must be within ±90°')
    .max(90, 'ringOpeningAngleDeg must be within ±90°')
    .optional(),
  ringOpeningAngleSigmaDeg: z.number().nonnegative('ringOpeningAngleSigmaDeg must be 0 or more').optional(),
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
