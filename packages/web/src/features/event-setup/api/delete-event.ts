import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiRequest } from '@/lib/api-client';

/** Archives the event (coordinators); it is restored from the events list's Archived events. */
export function deleteEvent(eventId: string): Promise<void> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}`, { method: 'DELETE' });
}

export function useDeleteEvent(eventId: string, onDeleted: () => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => deleteEvent(eventId),
    onSuccess: async () => {
      onDeleted();
      // After leaving the desk, so its own queries do not refetch an event that now answers 404.
      await queryClient.invalidateQueries({
        predicate: ({ queryKey: [scope, second, third] }) =>
          (scope === 'events' && second === 'list') ||
          scope === 'bodies' ||
          (scope === 'teams' && third === 'bodies'),
      });
      queryClient.removeQueries({ queryKey: ['events', eventId] });
    },
  });
}
