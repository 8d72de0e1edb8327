import { useMutation, useQueryClient } from '@tanstack/react-query';
import { chordsQueryKey } from './get-chords';
import { apiRequest } from '@/lib/api-client';

export function deleteChord(chordId: string): Promise<void> {
  return apiRequest(`/api/chords/${encodeURIComponent(chordId)}`, { method: 'DELETE' });
}

export function useDeleteChord(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteChord,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: chordsQueryKey(eventId) }),
  });
}
