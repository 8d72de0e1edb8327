import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const invitationSchema = z.object({
  email: z.string(),
  teamName: z.string(),
  role: z.string(),
  expiresAt: z.string(),
});

export type Invitation = z.infer<typeof invitationSchema>;

export function getInvitation(token: string, signal?: AbortSignal): Promise<Invitation> {
  return apiRequest(`/api/invitations/${encodeURIComponent(token)}`, {
    schema: invitationSchema,
    signal,
    anonymous: true,
  });
}

export function invitationQueryOptions(token: string) {
  return queryOptions({
    queryKey: ['invitations', token],
    queryFn: ({ signal }) => getInvitation(token, signal),
  });
}

export function useInvitation(token: string) {
  return useQuery(invitationQueryOptions(token));
}
