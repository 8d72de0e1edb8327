import { z } from 'zod';

// Shapes of the timing routes (docs/file-formats.md, "Light-curve timing job").
export const TIMING_STATES = ['queued', 'running', 'solved', 'failed'] as const;
export type TimingState = (typeof TIMING_STATES)[number];

const timedMarkSchema = z.object({ time: z.string(), sigmaSeconds: z.number() });
export type TimedMark = z.infer<typeof timedMarkSchema>;

export const timingOptionsSchema = z.object({
  speedKmPerS: z.number(),
  distanceKm: z.number(),
  exposureSeconds: z.number(),
  wavelengthUm: z.number(),
  bandwidthUm: z.number(),
  starDiameterKm: z.number(),
  bottom: z.enum(['free', 'zero']),
  detectionSigma: z.number(),
  markedDips: z.array(z.object({ startUtc: z.string(), endUtc: z.string() })),
});

export const timingSummarySchema = z.object({
  id: z.string(),
  reportId: z.string(),
  stationId: z.string(),
  state: z.enum(TIMING_STATES),
  error: z.string().nullable(),
  options: timingOptionsSchema,
  acceptedAt: z.string().nullable(),
  /** True while the chord holds this timing's times; an accepted timing since replaced is false. */
  inChord: z.boolean(),
  ringEventsCreatedAt: z.string().nullable(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});

export const dipSchema = z.object({
  start: timedMarkSchema,
  end: timedMarkSchema,
  apparentOpacity: z.number(),
  apparentOpticalDepth: z.number().nullable(),
  equivalentWidthKm: z.number(),
  significance: z.number(),
  marked: z.boolean(),
});
export type TimingDip = z.infer<typeof dipSchema>;

export const timingResultSchema = z.object({
  format: z.literal('limbus-timing/1'),
  disappearance: timedMarkSchema.nullable(),
  reappearance: timedMarkSchema.nullable(),
  baselineFlux: z.number(),
  bottomFlux: z.number().nullable(),
  chi2: z.number(),
  dof: z.number(),
  fresnelScaleKm: z.number(),
  starDiameterKm: z.number(),
  noiseSigmaFlux: z.number().nullable(),
  eventSignificance: z.number(),
  dips: z.array(dipSchema),
  series: z.object({
    originUtc: z.string(),
    timesSeconds: z.array(z.number()),
    flux: z.array(z.number()),
    fluxErr: z.array(z.number()).nullable(),
    modelFlux: z.array(z.number()),
  }),
});
export type TimingResult = z.infer<typeof timingResultSchema>;

export const timingDetailSchema = timingSummarySchema.extend({ result: timingResultSchema.nullable() });
export type TimingSummary = z.infer<typeof timingSummarySchema>;
export type TimingDetail = z.infer<typeof timingDetailSchema>;

export const timingsQueryKey = (eventId: string, reportId: string) => ['timings', eventId, reportId] as const;
export const timingQueryKey = (eventId: string, timingId: string) => ['timing', eventId, timingId] as const;
