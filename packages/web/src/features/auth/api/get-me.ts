import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export const teamMembershipSchema = z.object({
  id: z.string(),
  name: z.string(),
  roles: z.array(z.string()),
});

export const meSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  isAdmin: z.boolean(),
  teams: z.array(teamMembershipSchema),
});

export type Me = z.infer<typeof meSchema>;
export type TeamMembership = z.infer<typeof teamMembershipSchema>;

export const meQueryKey = ['me'] as const;

export function getMe(signal?: AbortSignal): Promise<Me> {
  return apiRequest('/api/me', { schema: meSchema, signal });
}

export function meQueryOptions() {
  return queryOptions({ queryKey: meQueryKey, queryFn: ({ signal }) => getMe(signal) });
}

export function useMe({ enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...meQueryOptions(), enabled });
}
