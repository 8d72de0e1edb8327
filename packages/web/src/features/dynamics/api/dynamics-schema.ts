import { z } from 'zod';

// The answer of GET/PUT /api/bodies/:bodyId/dynamics and GET /api/events/:eventId/dynamics: the body's
// physical parameters, what follows from them, and the fitted rings set against them (docs/file-formats.md,
// "Dynamics context route").
const entry = <T extends z.ZodRawShape>(shape: T) => z.object(shape);

const figures = {
  massKg: z.number(),
  densityKgM3: z.number(),
  rocheFluidKm: z.number(),
  rocheRigidKm: z.number(),
  rocheFluidBodyRadii: z.number(),
  rocheRigidBodyRadii: z.number(),
  synchronousKm: z.number(),
  hillKm: z.number(),
  spinOrbit: z.array(entry({ k: z.number(), radiusKm: z.number() })),
  meanMotion: z.array(
    entry({
      satellite: z.string(),
      p: z.number(),
      q: z.number(),
      order: z.number(),
      side: z.enum(['inner', 'outer']),
      radiusKm: z.number(),
      /** Listed because the input named it; absent from answers made before named resonances. */
      named: z.boolean().default(false),
    }),
  ),
  ringRadii: z.array(
    entry({
      ring: z.string(),
      radiusKm: z.number(),
      inBodyRadii: z.number(),
      inRocheFluid: z.number(),
      inRocheRigid: z.number(),
      inSynchronous: z.number(),
    }),
  ),
};

/**
 * A resonance near a ring (geometry's ResonanceNearRing): distanceKm = ring radius − resonance radius, with
 * its 1-sigma from both, and that distance in units of each 1-sigma (null where one is 0).
 */
export const resonanceNearRingSchema = z.object({
  kind: z.enum(['mean-motion', 'spin-orbit']),
  satellite: z.string().nullable(),
  p: z.number(),
  q: z.number(),
  radiusKm: z.number(),
  radiusKmSigma: z.number(),
  distanceKm: z.number(),
  distanceKmSigma: z.number(),
  distanceInRingSigma: z.number().nullable(),
  distanceInResonanceSigma: z.number().nullable(),
  distanceInSigma: z.number().nullable(),
});
export type ResonanceNearRing = z.infer<typeof resonanceNearRingSchema>;

export const contextResultSchema = z.object({
  format: z.literal('limbus-context/1'),
  ...figures,
  ringResonances: z
    .array(
      z.object({
        ring: z.string(),
        radiusKm: z.number(),
        radiusKmSigma: z.number(),
        nearest: z.array(resonanceNearRingSchema),
      }),
    )
    .default([]),
  massFrom: z.enum(['massKg', 'densityKgM3', 'satellite']),
  propagation: z.literal('first-order'),
  sources: z.record(z.string(), z.string()),
  notes: z.array(z.string()),
  uncertainty: z.object(figures),
});
export type ContextResult = z.infer<typeof contextResultSchema>;

export const ringFitSchema = z.object({
  fitId: z.string(),
  /** The event whose fit this ring comes from (on the body page, one fit per event). */
  eventId: z.string(),
  eventTitle: z.string(),
  ring: z.string(),
  radiusKm: z.number(),
  radiusKmSigma: z.number(),
  inBodyRadii: z.number(),
  inRocheFluid: z.number(),
  inRocheRigid: z.number(),
  inSynchronous: z.number(),
  uncertainty: z.object({
    inBodyRadii: z.number(),
    inRocheFluid: z.number(),
    inRocheRigid: z.number(),
    inSynchronous: z.number(),
  }),
  nearestResonances: z.array(resonanceNearRingSchema).default([]),
});
export type RingFit = z.infer<typeof ringFitSchema>;

export const dynamicsViewSchema = z.object({
  bodyId: z.string(),
  input: z.record(z.string(), z.unknown()),
  result: contextResultSchema,
  ringFits: z.array(ringFitSchema),
  updatedAt: z.string(),
});
export type DynamicsView = z.infer<typeof dynamicsViewSchema>;

/** What the routes answer before the body's parameters are entered. */
export const noDynamicsSchema = z.object({ bodyId: z.string(), input: z.null(), result: z.null() });

/** null while the body has no parameters entered, so the panel can offer the form. */
export const dynamicsResponseSchema = z.union([noDynamicsSchema.transform(() => null), dynamicsViewSchema]);
