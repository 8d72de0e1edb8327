import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

const valueSigmaSchema = z.object({ value: z.number(), sigma: z.number() });
const raDecSchema = z.object({ raDeg: z.number(), decDeg: z.number() });

export const comparisonFitSchema = z.object({
  fitId: z.string(),
  eventId: z.string(),
  eventTitle: z.string(),
  eventDateUtc: z.string().nullable(),
  reviewState: z.string(),
  finishedAt: z.string().nullable(),
  limb: z
    .object({
      centerFKm: valueSigmaSchema,
      centerGKm: valueSigmaSchema,
      equatorialRadiusKm: valueSigmaSchema,
      oblateness: valueSigmaSchema,
      positionAngleDeg: valueSigmaSchema,
      equivalentRadiusKm: valueSigmaSchema,
      chi2: z.number(),
      dof: z.number(),
    })
    .nullable(),
  rings: z.array(
    z.object({
      ring: z.string(),
      radiusKm: valueSigmaSchema,
      openingAngleDeg: valueSigmaSchema,
      positionAngleDeg: valueSigmaSchema,
      poles: z.array(raDecSchema),
    }),
  ),
});
export type ComparisonFit = z.infer<typeof comparisonFitSchema>;
export type ValueSigma = z.infer<typeof valueSigmaSchema>;

export const comparisonSchema = z.object({
  teamId: z.string(),
  selection: z.enum(['approved', 'all']),
  ringLabels: z.array(z.string()),
  fits: z.array(comparisonFitSchema),
});
export type Comparison = z.infer<typeof comparisonSchema>;

export type FitSelection = 'approved' | 'all';

export const comparisonQueryKey = (teamId: string, selection: FitSelection) =>
  ['teams', teamId, 'comparison', selection] as const;

export function getComparison(
  teamId: string,
  selection: FitSelection,
  signal?: AbortSignal,
): Promise<Comparison> {
  return apiRequest(`/api/teams/${encodeURIComponent(teamId)}/comparison?fits=${selection}`, {
    schema: comparisonSchema,
    signal,
  });
}

export function comparisonQueryOptions(teamId: string, selection: FitSelection) {
  return queryOptions({
    queryKey: comparisonQueryKey(teamId, selection),
    queryFn: ({ signal }) => getComparison(teamId, selection, signal),
  });
}

export function useComparison(teamId: string, selection: FitSelection) {
  return useQuery(comparisonQueryOptions(teamId, selection));
}
