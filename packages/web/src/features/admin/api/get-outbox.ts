import { outboxMessageSchema, type OutboxMessage } from '@limbus/schema/views';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export type { OutboxMessage };

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
