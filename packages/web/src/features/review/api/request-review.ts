import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { messageText } from '@limbus/schema/team';
import { useInvalidateReview } from './invalidate-review';
import { apiRequest } from '@/lib/api-client';

// The message the server's reviewRequestPayloadSchema takes; empty is a request without a message.
export const reviewRequestInputSchema = z.object({ message: messageText });

export type ReviewRequestInput = z.infer<typeof reviewRequestInputSchema>;

export function requestReview(fitId: string, input: ReviewRequestInput): Promise<void> {
  return apiRequest(`/api/fits/${encodeURIComponent(fitId)}/review-request`, {
    method: 'POST',
    body: input,
  });
}

export function useRequestReview(fitId: string) {
  const onSuccess = useInvalidateReview(fitId);
  return useMutation({ mutationFn: (input: ReviewRequestInput) => requestReview(fitId, input), onSuccess });
}
