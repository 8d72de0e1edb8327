import type { QueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { forgetSessionHint, setAccessToken } from './api-client';

// Sign-in and accepting an invitation both end in a new session; they share this so neither feature has
// to import the other.
export const sessionResponseSchema = z.object({ accessToken: z.string().min(1) });

export function startSession(queryClient: QueryClient, accessToken: string): void {
  setAccessToken(accessToken);
  // Everything cached so far belongs to the previous (or no) user. Queries the current page still
  // observes (the invitation being accepted) are left: removing them would make the page fetch them
  // again, and an accepted invitation no longer exists. The page is about to be left anyway.
  queryClient.removeQueries({ predicate: (query) => query.getObserversCount() === 0 });
}

export function endSession(queryClient: QueryClient): void {
  setAccessToken(null);
  forgetSessionHint();
  queryClient.clear();
}
