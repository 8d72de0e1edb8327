import { queryOptions, useQuery } from '@tanstack/react-query';
import { bodySummarySchema, type BodySummary } from '@limbus/schema/views';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

export type { BodySummary };

export const bodiesQueryKey = (teamId: string) => ['teams', teamId, 'bodies'] as const;

export function getBodies(teamId: string, signal?: AbortSignal): Promise<BodySummary[]> {
  return apiRequest(`/api/teams/${encodeURIComponent(teamId)}/bodies`, {
    schema: z.array(bodySummarySchema),
    signal,
  });
}

export function bodiesQueryOptions(teamId: string) {
  return queryOptions({
    queryKey: bodiesQueryKey(teamId),
    queryFn: ({ signal }) => getBodies(teamId, signal),
  });
}

/** The team's bodies; idle while no team is chosen. */
export function useBodies(teamId: string | null) {
  return useQuery({ ...bodiesQueryOptions(teamId ?? ''), enabled: teamId !== null });
}
