import { noteText, TEXT_LIMITS } from '@limbus/schema/text';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { reportsQueryKey } from './get-reports';
import { apiRequest } from '@/lib/api-client';

export const rejectInputSchema = z.object({
  reason: noteText(TEXT_LIMITS.reason).refine(
    (s) => s.length > 0,
    'a reason is required so the observer knows what to fix',
  ),
});

export type ReportDecision =
  | { reportId: string; accept: true; replaceTimedChord?: boolean }
  | { reportId: string; accept: false; reason: string };

/**
 * An accept that would overwrite better-timed chord values is refused with 409
 * `replaces-better-timing` until it is repeated with `replaceTimedChord: true`.
 */
export function decideReport(decision: ReportDecision): Promise<void> {
  const base = `/api/reports/${encodeURIComponent(decision.reportId)}`;
  return decision.accept
    ? apiRequest(`${base}/accept`, {
        method: 'POST',
        body: { replaceTimedChord: decision.replaceTimedChord ?? false },
      })
    : apiRequest(`${base}/reject`, { method: 'POST', body: { reason: decision.reason } });
}

/** Accepting a report writes its chord, so the chord table is refreshed as well. */
export function useDecideReport(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: decideReport,
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: reportsQueryKey(eventId) });
      await queryClient.invalidateQueries({ queryKey: ['events', eventId, 'chords'] });
    },
  });
}
