import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import type { TableFormat } from '@/components/table-download';
import { apiBlob, apiRequest } from '@/lib/api-client';

const semiAxesSchema = z.object({ aKm: z.number(), bKm: z.number(), cKm: z.number() });
const apparentSchema = z.object({
  equatorialRadiusKm: z.number(),
  oblateness: z.number(),
  positionAngleDeg: z.number(),
});

export const shapeViewSchema = z.object({
  pole: z.object({
    raDeg: z.number(),
    decDeg: z.number(),
    source: z.enum(['entered', 'joint ring pole']),
    jointPoleId: z.string().nullable(),
  }),
  fits: z.array(
    z.object({ fitId: z.string(), eventTitle: z.string(), seenUtc: z.string(), emittedUtc: z.string() }),
  ),
  result: z.object({
    model: z.enum(['triaxial', 'spheroid']),
    semiAxesKm: semiAxesSchema,
    uncertainty: semiAxesSchema.extend({ phaseDeg: z.number(), periodHours: z.number() }),
    phaseDeg: z.number().nullable(),
    phaseFitted: z.boolean(),
    periodHours: z.number(),
    chi2: z.number(),
    dof: z.number(),
    events: z.array(
      z.object({
        id: z.string(),
        rotationAngleDeg: z.number(),
        aspectAngleDeg: z.number(),
        model: apparentSchema,
        normalizedResiduals: z.object({
          equatorialRadius: z.number().nullable(),
          oblateness: z.number().nullable(),
          positionAngle: z.number().nullable(),
        }),
        chi2: z.number(),
        rmsRadialKm: z.number(),
      }),
    ),
    equilibrium: z
      .object({
        sequence: z.enum(['Maclaurin', 'Jacobi']),
        omega2OverPiGRho: z.number(),
        densityKgM3: z.number(),
        densityKgM3Sigma: z.number(),
        cOverAOnSequence: z.number(),
        cOverAFitted: z.number(),
        caution: z.string(),
      })
      .nullable(),
    warnings: z.array(z.string()),
  }),
  cautions: z.array(z.string()),
});
export type ShapeView = z.infer<typeof shapeViewSchema>;

export const fitShapeInputSchema = z.object({
  fitIds: z.array(z.string()).min(2, 'choose at least two events'),
  pole: z.union([
    z.object({ raDeg: z.number().min(0).max(360), decDeg: z.number().min(-90).max(90) }),
    z.object({ fromJointPoleId: z.string().min(1, 'name a solved joint pole') }),
  ]),
  periodHours: z.number().positive('must be greater than 0'),
  epochUtc: z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/, 'ISO 8601 UTC ending in Z'),
  phaseDeg: z.number().optional(),
  model: z.enum(['triaxial', 'spheroid']),
});
export type FitShapeInput = z.infer<typeof fitShapeInputSchema>;

export function fitShape(bodyId: string, input: FitShapeInput): Promise<ShapeView> {
  return apiRequest(`/api/bodies/${encodeURIComponent(bodyId)}/shape`, {
    method: 'POST',
    body: fitShapeInputSchema.parse(input),
    schema: shapeViewSchema,
  });
}

/** Nothing is stored on the server, so there is no query to invalidate: the answer is the mutation's data. */
export function useFitShape(bodyId: string) {
  return useMutation({ mutationFn: (input: FitShapeInput) => fitShape(bodyId, input) });
}

/** The shape result as a table (POST /api/bodies/:bodyId/shape/table): the fit is re-run from the same input. */
export function fetchShapeTable(bodyId: string, input: FitShapeInput, format: TableFormat): Promise<Blob> {
  return apiBlob(`/api/bodies/${encodeURIComponent(bodyId)}/shape/table?format=${format}`, {
    method: 'POST',
    body: fitShapeInputSchema.parse(input),
  });
}
