import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { noteText, TEXT_LIMITS } from '@limbus/schema/text';
import { useInvalidateReview } from './invalidate-review';
import { apiRequest } from '@/lib/api-client';

// The server's reviewDecisionPayloadSchema, with one thing more: no decision until the reviewer picks one,
// so nobody approves a fit by leaving a pre-selected choice alone.
export const reviewDecisionInputSchema = z
  .object({
    decision: z.enum(['approve', 'return'], { error: 'choose whether to approve or return the fit' }),
    comment: noteText(TEXT_LIMITS.note),
  })
  .refine((review) => review.decision === 'approve' || review.comment !== '', {
    path: ['comment'],
    message: 'say what must change before it can be approved',
  });

export type ReviewDecisionInput = z.infer<typeof reviewDecisionInputSchema>;

export function decideReview(fitId: string, input: ReviewDecisionInput): Promise<void> {
  return apiRequest(`/api/fits/${encodeURIComponent(fitId)}/reviews`, { method: 'POST', body: input });
}

export function useDecideReview(fitId: string) {
  const onSuccess = useInvalidateReview(fitId);
  return useMutation({ mutationFn: (input: ReviewDecisionInput) => decideReview(fitId, input), onSuccess });
}
