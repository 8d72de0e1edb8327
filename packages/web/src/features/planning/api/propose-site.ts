import type { SiteProposalPayload } from '@limbus/schema/planning';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

/**
 * An observer's own site for the event: a station of status `proposed`, with them as its observer, until a
 * coordinator accepts or declines it (POST /api/events/:eventId/site-proposals).
 */
export function proposeSite(eventId: string, input: SiteProposalPayload): Promise<void> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/site-proposals`, {
    method: 'POST',
    body: input,
  });
}

export function useProposeSite(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SiteProposalPayload) => proposeSite(eventId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['events', eventId] }),
  });
}
