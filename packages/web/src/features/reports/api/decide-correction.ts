import { useMutation, useQueryClient } from '@tanstack/react-query';
import { reportsQueryKey } from './get-reports';
import { apiRequest } from '@/lib/api-client';

export type CorrectionDecision =
  | { reportId: string; correctionId: string; accept: true; replaceTimedChord?: boolean }
  | { reportId: string; correctionId: string; accept: false; reason: string };

/** Accepting applies the changes and rewrites the chord, with the same 409 as a report's accept. */
export function decideCorrection(decision: CorrectionDecision): Promise<void> {
  const base = `/api/reports/${encodeURIComponent(decision.reportId)}/corrections/${encodeURIComponent(decision.correctionId)}`;
  return decision.accept
    ? apiRequest(`${base}/accept`, {
        method: 'POST',
        body: { replaceTimedChord: decision.replaceTimedChord ?? false },
      })
    : apiRequest(`${base}/reject`, { method: 'POST', body: { reason: decision.reason } });
}

export function useDecideCorrection(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: decideCorrection,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: reportsQueryKey(eventId) });
      await queryClient.invalidateQueries({ queryKey: ['events', eventId, 'chords'] });
    },
  });
}
