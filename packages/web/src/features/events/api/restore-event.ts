import { useMutation, useQueryClient } from '@tanstack/react-query';
import { eventsQueryKey } from './get-events';
import { apiRequest } from '@/lib/api-client';

/** Brings an archived (deleted) event back (coordinators). */
export function restoreEvent(eventId: string): Promise<void> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/restore`, { method: 'POST' });
}

export function useRestoreEvent() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: restoreEvent,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: eventsQueryKey }),
  });
}
