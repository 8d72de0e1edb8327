import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const outboxMessageSchema = z.object({
  id: z.union([z.string(), z.number()]).transform(String),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string().nullable().optional(),
  html: z.string().nullable().optional(),
  date: z.string(),
});

export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

export function getOutbox(signal?: AbortSignal): Promise<OutboxMessage[]> {
  return apiRequest('/api/admin/outbox', { schema: z.array(outboxMessageSchema), signal });
}

export const outboxQueryKey = ['admin', 'outbox'] as const;

export function outboxQueryOptions() {
  return queryOptions({ queryKey: outboxQueryKey, queryFn: ({ signal }) => getOutbox(signal) });
}

export function useOutbox() {
  return useQuery(outboxQueryOptions());
}
