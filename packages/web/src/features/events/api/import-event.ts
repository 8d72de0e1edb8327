import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { eventsQueryKey } from './get-events';
import { apiRequest } from '@/lib/api-client';

export const eventFileInputSchema = z
  .instanceof(File, { message: 'choose an event file (limbus-event/1 JSON)' })
  .refine((file) => file.size > 0, 'the file is empty')
  .refine((file) => file.size <= 5 * 1024 * 1024, 'the file is larger than 5 MB (the server limit)');

const createdSchema = z.object({ id: z.string() });

/** The body the import goes to: one of the team's, one found or made by name, or (neither) the file's. */
export interface ImportBody {
  bodyId?: string;
  bodyName?: string;
}

export interface ImportEventInput {
  file: File;
  teamId: string | null;
  body: ImportBody;
}

/**
 * The server checks the whole file and answers 400 with every problem by JSON path, or 201 with the id.
 * The multipart fields beside the file are importFieldsSchema's: teamId, bodyId, bodyName.
 */
export function importEvent({ file, teamId, body }: ImportEventInput): Promise<{ id: string }> {
  const form = new FormData();
  form.append('file', file);
  if (teamId !== null) form.append('teamId', teamId);
  if (body.bodyId !== undefined) form.append('bodyId', body.bodyId);
  if (body.bodyName !== undefined) form.append('bodyName', body.bodyName);
  return apiRequest('/api/events/import', { method: 'POST', body: form, schema: createdSchema });
}

const namedBodySchema = z.object({ body: z.object({ name: z.string().min(1) }) });

/** The body an event file names (its optional `body.name`), or null when it names none or is not JSON. */
export async function bodyNamedInEventFile(file: File): Promise<string | null> {
  try {
    const named = namedBodySchema.safeParse(JSON.parse(await file.text()));
    return named.success ? named.data.body.name.trim() || null : null;
  } catch {
    // Not JSON: the server says what is wrong with the file when it is sent.
    return null;
  }
}

export function useImportEvent(onImported: (eventId: string) => void) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importEvent,
    onSuccess: async ({ id }) => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: eventsQueryKey }),
        queryClient.invalidateQueries({
          predicate: ({ queryKey: [scope, , part] }) => scope === 'teams' && part === 'bodies',
        }),
      ]);
      onImported(id);
    },
  });
}
