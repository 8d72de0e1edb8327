import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

// Only what the shape panel needs of the team comparison: which fits have a limb, and that limb.
const valueSigmaSchema = z.object({ value: z.number(), sigma: z.number() });

export const shapeFitRowSchema = z.object({
  fitId: z.string(),
  eventTitle: z.string(),
  eventDateUtc: z.string().nullable(),
  reviewState: z.string(),
  limb: z
    .object({
      equatorialRadiusKm: valueSigmaSchema,
      oblateness: valueSigmaSchema,
      positionAngleDeg: valueSigmaSchema,
    })
    .nullable(),
});
export type ShapeFitRow = z.infer<typeof shapeFitRowSchema>;

const shapeFitsSchema = z.object({ fits: z.array(shapeFitRowSchema) });

export const shapeFitsQueryKey = (teamId: string) => ['teams', teamId, 'shape-fits'] as const;

/** Every solved fit, approved or not: a modeller may try a shape before review. */
export function shapeFitsQueryOptions(teamId: string) {
  return queryOptions({
    queryKey: shapeFitsQueryKey(teamId),
    queryFn: async ({ signal }) =>
      (
        await apiRequest(`/api/teams/${encodeURIComponent(teamId)}/comparison?fits=all`, {
          schema: shapeFitsSchema,
          signal,
        })
      ).fits.filter((f) => f.limb !== null),
  });
}

export function useShapeFits(teamId: string) {
  return useQuery(shapeFitsQueryOptions(teamId));
}
