import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const reviewSchema = z.object({
  id: z.string(),
  decision: z.enum(['approve', 'return']),
  comment: z.string(),
  reviewer: z.object({ id: z.string(), name: z.string() }),
  createdAt: z.string(),
});

export type Review = z.infer<typeof reviewSchema>;

export const reviewsQueryKey = (fitId: string) => ['fits', fitId, 'reviews'] as const;

export function getReviews(fitId: string, signal?: AbortSignal): Promise<Review[]> {
  return apiRequest(`/api/fits/${encodeURIComponent(fitId)}/reviews`, {
    schema: z.array(reviewSchema),
    signal,
  });
}

export function reviewsQueryOptions(fitId: string) {
  return queryOptions({
    queryKey: reviewsQueryKey(fitId),
    queryFn: ({ signal }) => getReviews(fitId, signal),
  });
}

export function useReviews(fitId: string) {
  return useQuery(reviewsQueryOptions(fitId));
}
