import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { fitsQueryKey } from './get-fits';
import { apiRequest } from '@/lib/api-client';
import { LIMB_PARAMETERS, RING_CENTER_SOURCES } from '@/lib/fit-numbers';

const fixedSchema = z
  .object({
    centerFKm: z.number().optional(),
    centerGKm: z.number().optional(),
    equatorialRadiusKm: z.number().positive('the radius must be greater than zero').optional(),
    oblateness: z
      .number()
      .min(0, 'oblateness must be in [0, 1)')
      .lt(1, 'oblateness must be in [0, 1)')
      .optional(),
    positionAngleDeg: z.number().optional(),
  })
  .refine((fixed) => Object.keys(fixed).length < LIMB_PARAMETERS.length, {
    message: 'at least one limb parameter must stay free',
  });

export const fitOptionsInputSchema = z.object({
  limb: z.object({
    fixed: fixedSchema,
    modelErrorKm: z
      .number({ error: 'model error must be a number of km' })
      .min(0, 'model error must not be negative'),
    fitTimeOffsets: z.array(z.string()),
  }),
  ring: z.object({ centerFrom: z.enum(RING_CENTER_SOURCES) }),
});

export type FitOptionsInput = z.infer<typeof fitOptionsInputSchema>;

const acceptedSchema = z.object({ id: z.string() });

export function submitFit(eventId: string, options: FitOptionsInput): Promise<{ id: string }> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/fits`, {
    method: 'POST',
    body: { options },
    schema: acceptedSchema,
  });
}

export function useSubmitFit(eventId: string, onQueued: (fitId: string) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (options: FitOptionsInput) => submitFit(eventId, options),
    onSuccess: async ({ id }) => {
      onQueued(id);
      await queryClient.invalidateQueries({ queryKey: fitsQueryKey(eventId) });
    },
  });
}
