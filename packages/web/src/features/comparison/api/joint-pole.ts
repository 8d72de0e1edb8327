import { queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from '@/lib/api-client';

const raDecSchema = z.object({ raDeg: z.number(), decDeg: z.number() });

export const jointPoleDocumentSchema = z.object({
  format: z.literal('limbus-joint/1'),
  ring: z.string(),
  pole: raDecSchema,
  // A job solved before the correlation, χ²/dof scaling and notes were added has none of them.
  uncertainty: raDecSchema.extend({ correlation: z.number().optional() }),
  radiusKm: z.number(),
  radiusSigmaKm: z.number(),
  chi2: z.number(),
  dof: z.number(),
  reducedChi2: z.number().nullable().optional(),
  sigmaScale: z.number().optional(),
  familyDeltaChi2: z.number().optional(),
  notes: z.array(z.string()).optional(),
  events: z.array(
    z.object({
      fitId: z.string(),
      title: z.string(),
      openingAngleDeg: z.number(),
      positionAngleDeg: z.number(),
    }),
  ),
  ambiguityResolved: z.boolean(),
  alternativePole: raDecSchema.extend({ chi2: z.number() }),
});
export type JointPoleDocument = z.infer<typeof jointPoleDocumentSchema>;

export const jointPoleJobSchema = z.object({
  id: z.string(),
  state: z.enum(['queued', 'running', 'solved', 'failed']),
  fitIds: z.array(z.string()),
  ring: z.string().nullable(),
  result: jointPoleDocumentSchema.nullable(),
  issues: z.array(z.object({ path: z.string(), message: z.string() })),
  createdAt: z.string(),
});
export type JointPoleJob = z.infer<typeof jointPoleJobSchema>;

export const submitJointPoleInputSchema = z.object({
  fitIds: z.array(z.string()).min(1),
  ring: z.string().optional(),
});
export type SubmitJointPoleInput = z.infer<typeof submitJointPoleInputSchema>;

export function submitJointPole(bodyId: string, input: SubmitJointPoleInput): Promise<{ id: string }> {
  return apiRequest(`/api/bodies/${encodeURIComponent(bodyId)}/joint-poles`, {
    method: 'POST',
    body: submitJointPoleInputSchema.parse(input),
    schema: z.object({ id: z.string() }),
  });
}

export function useSubmitJointPole(bodyId: string, onQueued: (id: string) => void) {
  return useMutation({
    mutationFn: (input: SubmitJointPoleInput) => submitJointPole(bodyId, input),
    onSuccess: ({ id }) => onQueued(id),
  });
}

export const jointPoleQueryKey = (jointId: string) => ['joint-poles', jointId] as const;

/** How often an unfinished job is looked at; a joint fit of a few events takes about a second. */
const POLL_MS = 500;

export function jointPoleQueryOptions(jointId: string) {
  return queryOptions({
    queryKey: jointPoleQueryKey(jointId),
    queryFn: ({ signal }) =>
      apiRequest(`/api/joint-poles/${encodeURIComponent(jointId)}`, { schema: jointPoleJobSchema, signal }),
    refetchInterval: (query) => {
      const state = query.state.data?.state;
      return state === 'solved' || state === 'failed' ? false : POLL_MS;
    },
  });
}

export function useJointPole(jointId: string | null) {
  return useQuery({ ...jointPoleQueryOptions(jointId ?? ''), enabled: jointId !== null });
}
