import { messageText } from '@limbus/schema/team';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { reportsQueryKey } from './get-reports';
import { reportPayload, type ReportInput } from './submit-report';
import { apiRequest } from '@/lib/api-client';

export const correctionMessageSchema = messageText.refine(
  (s) => s.length > 0,
  'say what is wrong with the accepted report',
);

export interface CorrectionRequest {
  reportId: string;
  /** The report fields to change, with their new values. */
  changes: Record<string, unknown>;
  message: string;
}

/** An observer asks to correct an accepted report; a coordinator decides. */
export function requestCorrection({ reportId, changes, message }: CorrectionRequest): Promise<void> {
  return apiRequest(`/api/reports/${encodeURIComponent(reportId)}/corrections`, {
    method: 'POST',
    body: { changes, message },
  });
}

export function useRequestCorrection(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: requestCorrection,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reportsQueryKey(eventId) }),
  });
}

// What a field holds when the result does not use it, so a change of result clears the old one's fields.
const UNUSED: Record<string, unknown> = {
  timesFromLightCurve: false,
  disappearance: null,
  reappearance: null,
  observedFromUtc: null,
  observedToUtc: null,
  ringDips: [],
  notes: null,
};

function sameValue(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (Array.isArray(a) && Array.isArray(b))
    return a.length === b.length && a.every((item, k) => sameValue(item, b[k]));
  if (typeof a === 'object' && typeof b === 'object' && a !== null && b !== null && !Array.isArray(a)) {
    const ak = Object.keys(a);
    const bk = Object.keys(b);
    return (
      ak.length === bk.length &&
      ak.every((k) => sameValue((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]))
    );
  }
  return false;
}

/** The fields whose value differs between the accepted report and the corrected form, with the new values. */
export function correctionChanges(before: ReportInput, after: ReportInput): Record<string, unknown> {
  const was = reportPayload(before);
  const now = reportPayload(after);
  const changes: Record<string, unknown> = {};
  for (const key of new Set([...Object.keys(was), ...Object.keys(now)])) {
    if (key === 'stationId') continue;
    const next = key in now ? now[key] : UNUSED[key];
    const previous = key in was ? was[key] : UNUSED[key];
    if (!sameValue(next, previous)) changes[key] = next;
  }
  return changes;
}
