import { useMutation, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { reportsQueryKey } from './get-reports';
import { apiRequest } from '@/lib/api-client';

// The server takes a light curve as a CSV table of at most 2 MB and checks its columns itself.
const MAX_BYTES = 2 * 1024 * 1024;

export const lightCurveInputSchema = z.object({
  file: z
    .instanceof(File, { message: 'choose a light-curve file' })
    .refine((file) => file.size > 0, 'the file is empty')
    .refine((file) => file.size <= MAX_BYTES, 'the file is larger than 2 MB (the server limit)'),
});

export function uploadLightCurve(reportId: string, file: File): Promise<void> {
  const form = new FormData();
  form.append('file', file);
  return apiRequest(`/api/reports/${encodeURIComponent(reportId)}/light-curve`, {
    method: 'POST',
    body: form,
  });
}

export function useUploadLightCurve(eventId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ reportId, file }: { reportId: string; file: File }) => uploadLightCurve(reportId, file),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: reportsQueryKey(eventId) }),
  });
}
