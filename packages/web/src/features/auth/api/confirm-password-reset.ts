import { passwordSchema } from '@limbus/schema/team';
import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const confirmPasswordResetInputSchema = z.object({
  token: z.string().min(1),
  password: passwordSchema,
});

export type ConfirmPasswordResetInput = z.infer<typeof confirmPasswordResetInputSchema>;

export function confirmPasswordReset(input: ConfirmPasswordResetInput): Promise<void> {
  return apiRequest('/api/auth/password-reset/confirm', { method: 'POST', body: input, anonymous: true });
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset });
}
