import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { eventsQueryKey } from './get-events';
import { apiRequest } from '@/lib/api-client';

export const eventFileInputSchema = z
  .instanceof(File, { message: 'choose an event file (limbus-event/1 JSON)' })
  .refine((file) => file.size > 0, 'the file is empty')
  .refine((file) => file.size <= 5 * 1024 * 1024, 'the file is larger than 5 MB (the server limit)');

const createdSchema = z.object({ id: z.string() });

/** The server checks the whole file and answers 400 with every problem by JSON path, or 201 with the id. */
export function importEvent(file: File, teamId: string | null): Promise<{ id: string }> {
  const form = new FormData();
  form.append('file', file);
  if (teamId !== null) form.append('teamId', teamId);
  return apiRequest('/api/events/import', { method: 'POST', body: form, schema: createdSchema });
}

export function useImportEvent(onImported: (eventId: string) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ file, teamId }: { file: File; teamId: string | null }) => importEvent(file, teamId),
    onSuccess: async ({ id }) => {
      await queryClient.invalidateQueries({ queryKey: eventsQueryKey });
      onImported(id);
    },
  });
}
