import { briefingSchema, type Briefing } from '@limbus/schema/planning';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

/** Under the event's key, so a change of its stations or prediction settings refreshes the briefing. */
export const briefingQueryKey = (eventId: string) => ['events', eventId, 'briefing'] as const;

/**
 * The briefing of the caller's own stations (a coordinator's: every station), as the e-mail states it:
 * predicted times with their ±, watch window, pointing, the Moon, and the cautions
 * (GET /api/events/:eventId/briefing).
 */
export function getBriefing(eventId: string, signal?: AbortSignal): Promise<Briefing> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/briefing`, {
    schema: briefingSchema,
    signal,
  });
}

export function briefingQueryOptions(eventId: string) {
  return queryOptions({
    queryKey: briefingQueryKey(eventId),
    queryFn: ({ signal }) => getBriefing(eventId, signal),
  });
}

export function useBriefing(eventId: string) {
  return useQuery(briefingQueryOptions(eventId));
}
