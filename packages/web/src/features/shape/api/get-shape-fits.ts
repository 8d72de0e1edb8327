import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

// Only what the shape panel needs of the body's comparison: which fits have a limb, that limb, and
// enough to tell two fits of one event apart (when each finished, and who ran it).
const valueSigmaSchema = z.object({ value: z.number(), sigma: z.number() });

export const shapeFitRowSchema = z.object({
  fitId: z.string(),
  eventId: z.string(),
  eventTitle: z.string(),
  eventDateUtc: z.string().nullable(),
  reviewState: z.string(),
  finishedAt: z.string().nullable(),
  createdBy: z.object({ id: z.string(), name: z.string() }).optional(),
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

export const shapeFitsQueryKey = (bodyId: string) => ['bodies', bodyId, 'shape-fits'] as const;

/** Every solved fit of the body with a limb, approved or not: a modeller may try a shape before review. */
export function shapeFitsQueryOptions(bodyId: string) {
  return queryOptions({
    queryKey: shapeFitsQueryKey(bodyId),
    queryFn: async ({ signal }) =>
      (
        await apiRequest(`/api/bodies/${encodeURIComponent(bodyId)}/comparison?fits=all`, {
          schema: shapeFitsSchema,
          signal,
        })
      ).fits.filter((f) => f.limb !== null),
  });
}

export function useShapeFits(bodyId: string) {
  return useQuery(shapeFitsQueryOptions(bodyId));
}

/**
 * The fits a shape starts from: one per event, its latest approved fit, else its latest solved one.
 * Two fits of one event are one observation twice over, so a second one is left for the modeller to pick.
 */
export function defaultShapeFitIds(rows: ShapeFitRow[]): Set<string> {
  const best = new Map<string, ShapeFitRow>();
  const rank = (r: ShapeFitRow) => `${r.reviewState === 'approved' ? 1 : 0}${r.finishedAt ?? ''}`;
  for (const row of rows) {
    const kept = best.get(row.eventId);
    if (kept === undefined || rank(row) > rank(kept)) best.set(row.eventId, row);
  }
  return new Set([...best.values()].map((r) => r.fitId));
}
