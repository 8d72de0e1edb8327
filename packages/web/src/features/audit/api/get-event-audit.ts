import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { auditEntryViewSchema, type AuditEntryView } from '@limbus/schema/views';
import { apiRequest } from '@/lib/api-client';

export type { AuditEntryView };

export const eventAuditQueryKey = (eventId: string) => ['events', eventId, 'audit'] as const;

/** Who did what to the event, for its coordinators (the server answers 403 to other roles). */
export function getEventAudit(eventId: string, signal?: AbortSignal): Promise<AuditEntryView[]> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/audit`, {
    schema: z.array(auditEntryViewSchema),
    signal,
  });
}

export function eventAuditQueryOptions(eventId: string) {
  return queryOptions({
    queryKey: eventAuditQueryKey(eventId),
    queryFn: ({ signal }) => getEventAudit(eventId, signal),
  });
}

export function useEventAudit(eventId: string) {
  return useQuery(eventAuditQueryOptions(eventId));
}
