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
  /** False when the event's data changed since the fit ran; read when the answer carries it. */
  inputMatchesEvent: z.boolean().optional(),
  /** Who ran the fit; read when the answer carries it. */
  createdBy: z.object({ id: z.string(), name: z.string() }).optional(),
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
  selection: z.enum(['approved', 'all']),
  ringLabels: z.array(z.string()),
  fits: z.array(comparisonFitSchema),
});
export type Comparison = z.infer<typeof comparisonSchema>;

/**
 * Which fits are compared: the latest approved fit of each event (what the team stands behind, one
 * per event), every approved fit, or every solved fit.
 */
export type FitSelection = 'latest' | 'approved' | 'all';

/** What the route is asked for; the latest approved fit per event is picked from the approved ones. */
export const routeSelection = (selection: FitSelection): 'approved' | 'all' =>
  selection === 'all' ? 'all' : 'approved';

/** The newest approved fit of each event (by when it finished), in the answer's order. */
export function latestApprovedPerEvent(fits: ComparisonFit[]): ComparisonFit[] {
  const newest = new Map<string, ComparisonFit>();
  for (const fit of fits) {
    if (fit.reviewState !== 'approved') continue;
    const kept = newest.get(fit.eventId);
    if (kept === undefined || (fit.finishedAt ?? '') > (kept.finishedAt ?? '')) newest.set(fit.eventId, fit);
  }
  return fits.filter((f) => newest.get(f.eventId) === f);
}

/** The route's answer narrowed to the chosen selection, with only the rings those fits have. */
export function comparedFits(data: Comparison, selection: FitSelection): Comparison {
  if (selection !== 'latest') return data;
  const fits = latestApprovedPerEvent(data.fits);
  const ringLabels = data.ringLabels.filter((l) => fits.some((f) => f.rings.some((r) => r.ring === l)));
  return { ...data, fits, ringLabels };
}

export const comparisonQueryKey = (bodyId: string, selection: 'approved' | 'all') =>
  ['bodies', bodyId, 'comparison', selection] as const;

export function getComparison(
  bodyId: string,
  selection: 'approved' | 'all',
  signal?: AbortSignal,
): Promise<Comparison> {
  return apiRequest(`/api/bodies/${encodeURIComponent(bodyId)}/comparison?fits=${selection}`, {
    schema: comparisonSchema,
    signal,
  });
}

/** The route's answer as sent: for the latest approved fits, every approved one (see comparedFits). */
export function comparisonQueryOptions(bodyId: string, selection: FitSelection) {
  const asked = routeSelection(selection);
  return queryOptions({
    queryKey: comparisonQueryKey(bodyId, asked),
    queryFn: ({ signal }) => getComparison(bodyId, asked, signal),
  });
}

export function useComparison(bodyId: string, selection: FitSelection) {
  return useQuery(comparisonQueryOptions(bodyId, selection));
}
