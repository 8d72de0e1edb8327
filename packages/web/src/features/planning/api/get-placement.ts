import { placementAnswerSchema, type PlacementAnswer, type PlacementRegion } from '@limbus/schema/planning';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

export interface PlacementRequest {
  sites: number;
  ringsToo: boolean;
  region: PlacementRegion | null;
}

/**
 * Outside the event's key on purpose: the suggestions a coordinator is working through stay put while
 * each one made into a station refreshes the event; "Suggest again" asks anew.
 */
export const placementQueryKey = (eventId: string, request: PlacementRequest) =>
  ['placement', eventId, request] as const;

/** The query string of GET /api/events/:eventId/placement: region as latMin,latMax,lonMin,lonMax. */
export function placementQuery(request: PlacementRequest): URLSearchParams {
  const q = new URLSearchParams({ sites: String(request.sites), ringsToo: String(request.ringsToo) });
  const r = request.region;
  if (r !== null) q.set('region', [r.latMinDeg, r.latMaxDeg, r.lonMinDeg, r.lonMaxDeg].join(','));
  return q;
}

/** Cross-track offsets that fill the largest gaps in coverage, each with a ground point at night. */
export function getPlacement(
  eventId: string,
  request: PlacementRequest,
  signal?: AbortSignal,
): Promise<PlacementAnswer> {
  return apiRequest(
    `/api/events/${encodeURIComponent(eventId)}/placement?${placementQuery(request).toString()}`,
    { schema: placementAnswerSchema, signal },
  );
}

export function placementQueryOptions(eventId: string, request: PlacementRequest) {
  return queryOptions({
    queryKey: placementQueryKey(eventId, request),
    queryFn: ({ signal }) => getPlacement(eventId, request, signal),
    staleTime: Number.POSITIVE_INFINITY,
    placeholderData: keepPreviousData,
  });
}

/** Asks only once the coordinator has sent the form (`request` null until then). */
export function usePlacement(eventId: string, request: PlacementRequest | null) {
  return useQuery({
    ...placementQueryOptions(eventId, request ?? { sites: 1, ringsToo: false, region: null }),
    enabled: request !== null,
  });
}
