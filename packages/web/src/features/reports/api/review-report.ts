import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { reportsQueryKey } from './get-reports';
import { apiRequest } from '@/lib/api-client';

export const rejectInputSchema = z.object({
  reason: z
    .string()
    .trim()
    .min(1, 'a reason is required so the observer knows what to fix')
    .max(2000, 'at most 2000 characters'),
});

export type ReportDecision =
  { reportId: string; accept: true } | { reportId: string; accept: false; reason: string };

export function decideReport(decision: ReportDecision): Promise<void> {
  const base = `/api/reports/${encodeURIComponent(decision.reportId)}`;
  return decision.accept
    ? apiRequest(`${base}/accept`, { method: 'POST' })
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
