import { z } from 'zod';

const isoUtc = z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/, 'ISO 8601 UTC ending in Z');

/** A pole given by hand, or the solved joint ring pole of this team (the ring plane taken as the equator). */
const poleSchema = z.union([
  z.strictObject({ raDeg: z.number().min(0).max(360), decDeg: z.number().min(-90).max(90) }),
  z.strictObject({ fromJointPoleId: z.string().min(1).max(36) }),
]);

export const shapePayloadSchema = z.strictObject({
  fitIds: z.array(z.string().min(1).max(36)).min(1).max(50),
  pole: poleSchema,
  periodHours: z.number().positive().max(10_000),
  periodHoursSigma: z.number().min(0).max(10_000).optional(),
  /** The instant at which the rotation angle is phaseDeg, at the body (light time removed). */
  epochUtc: isoUtc,
  /** Fitted when absent in the triaxial model; the spheroid does not use it. */
  phaseDeg: z.number().min(-360).max(720).optional(),
  model: z.enum(['triaxial', 'spheroid']),
});
export type ShapePayload = z.infer<typeof shapePayloadSchema>;
