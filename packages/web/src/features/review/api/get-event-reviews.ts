import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { reviewEntrySchema, type ReviewEntry } from '@limbus/schema/views';
import { apiRequest } from '@/lib/api-client';

export type { ReviewEntry };

// Under the event's key, so anything that refreshes the event's data refreshes its review history too.
export const eventReviewsQueryKey = (eventId: string) => ['events', eventId, 'reviews'] as const;

/** Every request, approval and return of every fit of the event, so the history outlives a re-run. */
export function getEventReviews(eventId: string, signal?: AbortSignal): Promise<ReviewEntry[]> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/reviews`, {
    schema: z.array(reviewEntrySchema),
    signal,
  });
}

export function eventReviewsQueryOptions(eventId: string) {
  return queryOptions({
    queryKey: eventReviewsQueryKey(eventId),
    queryFn: ({ signal }) => getEventReviews(eventId, signal),
  });
}

export function useEventReviews(eventId: string) {
  return useQuery(eventReviewsQueryOptions(eventId));
}
