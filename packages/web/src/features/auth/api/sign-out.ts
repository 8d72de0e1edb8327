import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';
import { endSession } from '@/lib/session';

export function signOut(): Promise<void> {
  // Anonymous: the refresh cookie is what the server revokes, and a page without a token may sign out.
  return apiRequest('/api/auth/logout', { method: 'POST', anonymous: true });
}

export function useSignOut(onSignedOut?: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    // The local session ends even when the server call fails: a user who asked to sign out must not
    // stay signed in on this screen.
    onSettled: () => {
      endSession(queryClient);
      onSignedOut?.();
    },
  });
}
