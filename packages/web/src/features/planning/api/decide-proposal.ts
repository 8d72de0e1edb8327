import type {
  acceptSiteProposalPayloadSchema,
  declineSiteProposalPayloadSchema,
} from '@limbus/schema/planning';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export type ProposalDecision =
  | { stationId: string; decision: 'accept'; body: z.input<typeof acceptSiteProposalPayloadSchema> }
  | { stationId: string; decision: 'decline'; body: z.input<typeof declineSiteProposalPayloadSchema> };

/**
 * A coordinator's answer to a proposed site: accepted, it becomes a planned station; declined, it is
 * removed, with the reason kept in the audit (POST …/site-proposals/:stationId/accept | decline).
 */
export function decideProposal(eventId: string, decision: ProposalDecision): Promise<void> {
  return apiRequest(
    `/api/events/${encodeURIComponent(eventId)}/site-proposals/${encodeURIComponent(decision.stationId)}/${decision.decision}`,
    { method: 'POST', body: decision.body },
  );
}

export function useDecideProposal(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (decision: ProposalDecision) => decideProposal(eventId, decision),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['events', eventId] }),
  });
}
