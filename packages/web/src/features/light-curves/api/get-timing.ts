import { queryOptions, useQuery } from '@tanstack/react-query';
import { timingDetailSchema, timingQueryKey } from './timing-schema';
import { apiRequest } from '@/lib/api-client';

export function getTiming(eventId: string, timingId: string, signal?: AbortSignal) {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/timings/${encodeURIComponent(timingId)}`, {
    schema: timingDetailSchema,
    signal,
  });
}

/** A timing takes seconds, so polling while it is queued or running is enough. */
export function timingQueryOptions(eventId: string, timingId: string) {
  return queryOptions({
    queryKey: timingQueryKey(eventId, timingId),
    queryFn: ({ signal }) => getTiming(eventId, timingId, signal),
    refetchInterval: (query) => {
      const state = query.state.data?.state;
      return state === 'queued' || state === 'running' ? 1000 : false;
    },
  });
}

export function useTiming(eventId: string, timingId: string | null) {
  return useQuery({ ...timingQueryOptions(eventId, timingId ?? ''), enabled: timingId !== null });
}
