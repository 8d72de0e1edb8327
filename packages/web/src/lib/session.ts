import type { QueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { setAccessToken } from './api-client';

// Sign-in and accepting an invitation both end in a new session; they share this so neither feature has
// to import the other.
export const sessionResponseSchema = z.object({ accessToken: z.string().min(1) });

export function startSession(queryClient: QueryClient, accessToken: string): void {
  setAccessToken(accessToken);
  // Everything cached so far belongs to the previous (or no) user.
  queryClient.removeQueries();
}

export function endSession(queryClient: QueryClient): void {
  setAccessToken(null);
  queryClient.clear();
}
