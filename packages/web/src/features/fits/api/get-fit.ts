import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { FIT_STATE_VALUES, fitStatusSchema, REVIEW_STATE_VALUES } from '@limbus/schema/views';
import { solutionSchema } from './solution-schema';
import { apiRequest } from '@/lib/api-client';

export const FIT_STATES = FIT_STATE_VALUES;
export const REVIEW_STATES = REVIEW_STATE_VALUES;
export type FitState = (typeof FIT_STATES)[number];
export type ReviewState = (typeof REVIEW_STATES)[number];

const authorSchema = z.object({ id: z.string(), name: z.string() });

/** A fit as `GET /api/events/:eventId/fits` lists it: the shared fit status, and who ran it with what. */
export const fitSummarySchema = fitStatusSchema.extend({
  progress: z.number().default(0),
  error: z.string().nullable().optional(),
  createdBy: authorSchema,
  finishedAt: z.string().nullable().optional(),
  options: z.record(z.string(), z.unknown()).optional(),
  /** SHA-256 of the event data the fit ran on; `inputMatchesEvent` compares it with the event's now. */
  dataSha256: z.string(),
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
