import { useMutation, useQueryClient } from '@tanstack/react-query';
import { eventKey } from './create-station';
import { apiRequest } from '@/lib/api-client';

export function deleteStation(eventId: string, stationId: string): Promise<void> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/stations/${encodeURIComponent(stationId)}`, {
    method: 'DELETE',
  });
}

export function useDeleteStation(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (stationId: string) => deleteStation(eventId, stationId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: eventKey(eventId) }),
  });
}
