import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { reviewsQueryKey } from './get-reviews';
import { apiRequest } from '@/lib/api-client';

export const reviewDecisionInputSchema = z
  .object({
    decision: z.enum(['approve', 'return']),
    comment: z.string().trim().max(10_000, 'at most 10 000 characters'),
  })
  .refine((review) => review.decision === 'approve' || review.comment !== '', {
    path: ['comment'],
    message: 'say what must change before it can be approved',
  });

export type ReviewDecisionInput = z.infer<typeof reviewDecisionInputSchema>;

export function requestReview(fitId: string): Promise<void> {
  return apiRequest(`/api/fits/${encodeURIComponent(fitId)}/review-request`, { method: 'POST' });
}

export function decideReview(fitId: string, input: ReviewDecisionInput): Promise<void> {
  return apiRequest(`/api/fits/${encodeURIComponent(fitId)}/reviews`, { method: 'POST', body: input });
}

/** A review changes the fit's review state too, which the fit view and the fits list show. */
function useInvalidateReview(fitId: string) {
  const queryClient = useQueryClient();
  return async () => {
    await queryClient.invalidateQueries({ queryKey: reviewsQueryKey(fitId) });
    await queryClient.invalidateQueries({ queryKey: ['fits', fitId] });
    await queryClient.invalidateQueries({ queryKey: ['events'] });
  };
}

export function useRequestReview(fitId: string) {
  const onSuccess = useInvalidateReview(fitId);
  return useMutation({ mutationFn: () => requestReview(fitId), onSuccess });
}

export function useDecideReview(fitId: string) {
  const onSuccess = useInvalidateReview(fitId);
  return useMutation({ mutationFn: (input: ReviewDecisionInput) => decideReview(fitId, input), onSuccess });
}
