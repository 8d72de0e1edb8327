import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

const valueSigmaSchema = z.object({ value: z.number(), sigma: z.number() });
const raDecSchema = z.object({ raDeg: z.number(), decDeg: z.number() });
/** A pole's 1σ: RA in degrees of RA (not multiplied by cos Dec), Dec, and their correlation. */
export const poleSigmaSchema = z.object({ raDeg: z.number(), decDeg: z.number(), correlation: z.number() });
export type PoleSigma = z.infer<typeof poleSigmaSchema>;

export const comparisonFitSchema = z.object({
  fitId: z.string(),
  eventId: z.string(),
  eventTitle: z.string(),
  eventDateUtc: z.string().nullable(),
  reviewState: z.string(),
  finishedAt: z.string().nullable(),
  /** False when the event's data changed since the fit ran (it is based on older data). */
  inputMatchesEvent: z.boolean(),
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
      // A fit stored before pole 1σ were computed has none (null).
      poles: z.array(raDecSchema.extend({ uncertainty: poleSigmaSchema.nullable().optional() })),
    }),
  ),
});
export type ComparisonFit = z.infer<typeof comparisonFitSchema>;
export type ValueSigma = z.infer<typeof valueSigmaSchema>;

/**
 * Which fits are compared: the latest approved fit of each event (the default: what the team stands
 * behind, one per event, so no event counts twice), every approved fit, or every solved fit.
 */
export const FIT_SELECTIONS = ['latest-approved', 'approved', 'all'] as const;
export type FitSelection = (typeof FIT_SELECTIONS)[number];

export const comparisonSchema = z.object({
  selection: z.enum(FIT_SELECTIONS),
  ringLabels: z.array(z.string()),
  fits: z.array(comparisonFitSchema),
});
export type Comparison = z.infer<typeof comparisonSchema>;

export const comparisonQueryKey = (bodyId: string, selection: FitSelection) =>
  ['bodies', bodyId, 'comparison', selection] as const;

export function getComparison(
  bodyId: string,
  selection: FitSelection,
  signal?: AbortSignal,
): Promise<Comparison> {
  return apiRequest(`/api/bodies/${encodeURIComponent(bodyId)}/comparison?fits=${selection}`, {
    schema: comparisonSchema,
    signal,
  });
}

export function comparisonQueryOptions(bodyId: string, selection: FitSelection) {
  return queryOptions({
    queryKey: comparisonQueryKey(bodyId, selection),
    queryFn: ({ signal }) => getComparison(bodyId, selection, signal),
    // The table and plots on screen stay while another selection loads.
    placeholderData: keepPreviousData,
  });
}

export function useComparison(bodyId: string, selection: FitSelection) {
  return useQuery(comparisonQueryOptions(bodyId, selection));
}
