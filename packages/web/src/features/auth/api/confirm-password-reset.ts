import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const MIN_PASSWORD_LENGTH = 10;

export const confirmPasswordResetInputSchema = z.object({
  token: z.string().min(1),
  password: z.string().min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters`),
});

export type ConfirmPasswordResetInput = z.infer<typeof confirmPasswordResetInputSchema>;

export function confirmPasswordReset(input: ConfirmPasswordResetInput): Promise<void> {
  return apiRequest('/api/auth/password-reset/confirm', { method: 'POST', body: input });
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
