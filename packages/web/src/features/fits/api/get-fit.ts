import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { solutionSchema } from './solution-schema';
import { apiRequest } from '@/lib/api-client';

export const FIT_STATES = ['queued', 'running', 'solved', 'failed'] as const;
export const REVIEW_STATES = ['none', 'in_review', 'approved', 'returned'] as const;
export type FitState = (typeof FIT_STATES)[number];
export type ReviewState = (typeof REVIEW_STATES)[number];

const authorSchema = z.object({ id: z.string(), name: z.string() });

export const fitSummarySchema = z.object({
  id: z.string(),
  state: z.enum(FIT_STATES),
  reviewState: z.enum(REVIEW_STATES).default('none'),
  progress: z.number().default(0),
  error: z.string().nullable().optional(),
  createdBy: authorSchema,
  createdAt: z.string(),
  finishedAt: z.string().nullable().optional(),
  options: z.record(z.string(), z.unknown()).optional(),
});

export const fitSchema = fitSummarySchema.extend({ solution: solutionSchema.nullable().optional() });

export type FitSummary = z.infer<typeof fitSummarySchema>;
export type Fit = z.infer<typeof fitSchema>;

export const fitQueryKey = (fitId: string) => ['fits', fitId] as const;

export function getFit(fitId: string, signal?: AbortSignal): Promise<Fit> {
  return apiRequest(`/api/fits/${encodeURIComponent(fitId)}`, { schema: fitSchema, signal });
}

/** A fit still in the queue or running is polled as well as followed by its events, in case the stream drops. */
export function fitQueryOptions(fitId: string) {
  return queryOptions({
    queryKey: fitQueryKey(fitId),
    queryFn: ({ signal }) => getFit(fitId, signal),
    refetchInterval: (query) => {
      const state = query.state.data?.state;
      return state === 'queued' || state === 'running' ? 5000 : false;
    },
  });
}

export function useFit(fitId: string | null) {
  return useQuery({ ...fitQueryOptions(fitId ?? ''), enabled: fitId !== null });
}
