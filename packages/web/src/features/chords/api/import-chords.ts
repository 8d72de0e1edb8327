import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { chordsQueryKey } from './get-chords';
import { ApiError, apiRequest } from '@/lib/api-client';

export const csvFileSchema = z
  .instanceof(File, { message: 'choose a CSV file' })
  .refine((file) => file.size > 0, 'the file is empty')
  .refine((file) => file.size <= 1024 * 1024, 'the file is larger than 1 MB (the server limit)');

export interface CsvRowProblem {
  row: number;
  column: string | null;
  message: string;
}

const rowProblemsSchema = z.object({
  issues: z.array(
    z.object({
      row: z.number(),
      column: z.string().nullable().optional(),
      message: z.string(),
    }),
  ),
});

// A preview lists what would be written; the rows are shown as the server read them.
const previewRowSchema = z.record(z.string(), z.unknown());
const previewSchema = z.union([
  z.array(previewRowSchema).transform((chords) => ({ chords })),
  z.object({ chords: z.array(previewRowSchema) }),
]);

export type CsvPreview =
  { ok: true; rows: Array<Record<string, unknown>> } | { ok: false; problems: CsvRowProblem[] };

/** The server's 400 lists row problems in its own body shape; read it from the raw response. */
async function postCsv(eventId: string, file: File, preview: boolean): Promise<CsvPreview> {
  const form = new FormData();
  form.append('file', file);
  const url = `/api/events/${encodeURIComponent(eventId)}/chords/import${preview ? '?preview=1' : ''}`;
  try {
    const result = await apiRequest(url, { method: 'POST', body: form, schema: z.unknown() });
    const parsed = previewSchema.safeParse(result);
    return { ok: true, rows: parsed.success ? parsed.data.chords : [] };
  } catch (error) {
    const problems = error instanceof ApiError && error.status === 400 ? parseRowProblems(error.body) : [];
    if (problems.length > 0) return { ok: false, problems };
    throw error;
  }
}

export function parseRowProblems(body: unknown): CsvRowProblem[] {
  const parsed = rowProblemsSchema.safeParse(body);
  if (!parsed.success) return [];
  return parsed.data.issues.map((i) => ({ row: i.row, column: i.column ?? null, message: i.message }));
}

export function useCsvPreview(eventId: string) {
  return useMutation({ mutationFn: (file: File) => postCsv(eventId, file, true) });
}

export function useCsvImport(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => postCsv(eventId, file, false),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: chordsQueryKey(eventId) }),
  });
}
