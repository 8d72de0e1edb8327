import { publicInvitationViewSchema, type PublicInvitationView } from '@limbus/schema/views';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

export type Invitation = PublicInvitationView;

/** What the e-mailed link shows before accepting; open to anyone holding the token. */
export function getInvitation(token: string, signal?: AbortSignal): Promise<Invitation> {
  return apiRequest(`/api/invitations/${encodeURIComponent(token)}`, {
    schema: publicInvitationViewSchema,
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
