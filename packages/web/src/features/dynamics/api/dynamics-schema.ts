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

export const contextResultSchema = z.object({
  format: z.literal('limbus-context/1'),
  ...figures,
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
