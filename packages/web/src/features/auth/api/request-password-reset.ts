import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const requestPasswordResetInputSchema = z.object({ email: z.email('Enter an e-mail address') });

export type RequestPasswordResetInput = z.infer<typeof requestPasswordResetInputSchema>;

export function requestPasswordReset(input: RequestPasswordResetInput): Promise<void> {
  return apiRequest('/api/auth/password-reset', { method: 'POST', body: input, anonymous: true });
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
