import { timingDocumentSchema } from '@limbus/schema/timing';
import { z } from 'zod';

// Shapes of the timing routes (docs/file-formats.md, "Light-curve timing job").
export const TIMING_STATES = ['queued', 'running', 'solved', 'failed'] as const;
export type TimingState = (typeof TIMING_STATES)[number];

export interface TimedMark {
  time: string;
  sigmaSeconds: number;
}

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
  // Added with each edge's own speed and the dips' normal optical depth; absent in older timings.
  speedDisappearanceKmPerS: z.number().optional(),
  speedReappearanceKmPerS: z.number().optional(),
  edgeSpeedsFrom: z.enum(['fit', 'prediction', 'full', 'entered']).optional(),
  ringOpeningAngleDeg: z.number().optional(),
  ringOpeningAngleSigmaDeg: z.number().optional(),
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

/** The limbus-timing/1 document (one schema in @limbus/schema/timing) with the series the plot draws. */
export const timingResultSchema = timingDocumentSchema.extend({
  series: z.object({
    originUtc: z.string(),
    timesSeconds: z.array(z.number()),
    flux: z.array(z.number()),
    fluxErr: z.array(z.number()).nullable(),
    modelFlux: z.array(z.number()),
  }),
});
export type TimingResult = z.infer<typeof timingResultSchema>;
export type TimingDip = TimingResult['dips'][number];

export const timingDetailSchema = timingSummarySchema.extend({ result: timingResultSchema.nullable() });
export type TimingSummary = z.infer<typeof timingSummarySchema>;
export type TimingDetail = z.infer<typeof timingDetailSchema>;

export const timingsQueryKey = (eventId: string, reportId: string) => ['timings', eventId, reportId] as const;
export const timingQueryKey = (eventId: string, timingId: string) => ['timing', eventId, timingId] as const;
