import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';
import { sessionResponseSchema, startSession } from '@/lib/session';

export const signInInputSchema = z.object({
  email: z.email('Enter an e-mail address'),
  password: z.string().min(1, 'Enter your password'),
});

export type SignInInput = z.infer<typeof signInInputSchema>;

export function signIn(input: SignInInput): Promise<z.infer<typeof sessionResponseSchema>> {
  return apiRequest('/api/auth/login', {
    method: 'POST',
    body: input,
    schema: sessionResponseSchema,
    anonymous: true,
  });
}

export function useSignIn(onSignedIn?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (session) => {
      startSession(queryClient, session.accessToken);
      onSignedIn?.();
    },
  });
}
