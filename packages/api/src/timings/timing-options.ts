import { lineText, TEXT_LIMITS } from '@limbus/schema';
import { z } from 'zod';

const utcText = z.string().min(1, 'must be an ISO 8601 UTC time');

/**
 * What a modeller asks of one timing job; the geometry's defaults where the trade has a usual value.
 * Each main edge may have its own (limb-normal) speed, each defaulting to `speedKmPerS`; `edgeSpeedsFrom`
 * records where they came from (the defaults route's `edgeSpeeds.from`, or "entered" by hand). With a
 * ring's opening angle the dips also get their normal optical depth.
 */
export const timingOptionsSchema = z
  .strictObject({
    speedKmPerS: z.number().positive('must be greater than 0'),
    speedDisappearanceKmPerS: z.number().positive('must be greater than 0').optional(),
    speedReappearanceKmPerS: z.number().positive('must be greater than 0').optional(),
    edgeSpeedsFrom: z.enum(['fit', 'prediction', 'full', 'entered']).optional(),
    ringOpeningAngleDeg: z.number().min(-90, 'must be within ±90°').max(90, 'must be within ±90°').optional(),
    ringOpeningAngleSigmaDeg: z.number().nonnegative('must be 0 or more').optional(),
    distanceKm: z.number().positive('must be greater than 0'),
    exposureSeconds: z.number().positive('must be greater than 0'),
    wavelengthUm: z.number().positive('must be greater than 0').default(0.65),
    bandwidthUm: z.number().nonnegative('must be 0 or more').default(0.3),
    starDiameterKm: z.number().nonnegative('must be 0 or more').default(0),
    bottom: z.enum(['free', 'zero']).default('free'),
    detectionSigma: z.number().positive('must be greater than 0').default(6),
    markedDips: z
      .array(z.strictObject({ startUtc: utcText, endUtc: utcText }))
      .max(20)
      .default([]),
  })
  .superRefine((o, ctx) => {
    if (o.ringOpeningAngleSigmaDeg !== undefined && o.ringOpeningAngleDeg === undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['ringOpeningAngleSigmaDeg'],
        message: 'needs ringOpeningAngleDeg, the angle it is the 1-sigma of',
      });
  });

export type TimingOptions = z.infer<typeof timingOptionsSchema>;

/** A dip the modeller marks by hand on a solved timing; the job is run again with it added. */
export const markDipSchema = z.strictObject({ startUtc: utcText, endUtc: utcText });
export type MarkDipPayload = z.infer<typeof markDipSchema>;

/** Which dips become ring events, and under which ring name; all dips when `dips` is left out. */
export const dipsToRingEventsSchema = z.strictObject({
  ring: lineText(TEXT_LIMITS.ringLabel, 'ring label'),
  dips: z.array(z.int().min(0)).min(1).optional(),
});
export type DipsToRingEventsPayload = z.infer<typeof dipsToRingEventsSchema>;
