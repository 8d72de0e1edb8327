import { useMutation, useQueryClient } from '@tanstack/react-query';
import { eventKey, type StationInput } from './create-station';
import { apiRequest } from '@/lib/api-client';

/** Sends every field of the form, so a cleared one (an observer, an exposure) is cleared on the server. */
export function updateStation(eventId: string, stationId: string, input: StationInput): Promise<void> {
  return apiRequest(`/api/events/${encodeURIComponent(eventId)}/stations/${encodeURIComponent(stationId)}`, {
    method: 'PATCH',
    body: input,
  });
}

export function useUpdateStation(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ stationId, input }: { stationId: string; input: StationInput }) =>
      updateStation(eventId, stationId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: eventKey(eventId) }),
  });
}
