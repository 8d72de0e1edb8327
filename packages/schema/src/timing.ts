// The light-curve timing document ("limbus-timing/1") that `limbus time` prints and the server stores for
// a timing job (with the fitted series added): one builder from geometry's result, one schema the client
// reads it with. docs/file-formats.md, "Timing output", describes every field. Fields were added to the
// first version (edge speeds, the dips' 1-sigma, depths, normal optical depth, lower limits); a reader of
// the first version ignores them, and this schema reads documents stored before them.

import { z } from 'zod';

import type { TimingResult } from '@limbus/geometry';

import { formatUtc, type UtcInstant } from './light-curve-csv.js';

export const TIMING_FORMAT = 'limbus-timing/1';

const timedMark = z.object({ time: z.string(), sigmaSeconds: z.number() });

const dipLowerLimits = z.object({
  reason: z.string(),
  apparentOpacity: z.number(),
  apparentOpticalDepth: z.number(),
  normalOpticalDepth: z.number().nullable(),
  equivalentDepthKm: z.number(),
});

export const timingDipSchema = z.object({
  start: timedMark,
  end: timedMark,
  apparentOpacity: z.number(),
  apparentOpticalDepth: z.number().nullable(),
  equivalentWidthKm: z.number(),
  significance: z.number(),
  marked: z.boolean(),
  // Added to the first version; absent in documents stored before.
  apparentOpacitySigma: z.number().nullable().optional(),
  apparentOpticalDepthSigma: z.number().nullable().optional(),
  widthKm: z.number().optional(),
  widthKmSigma: z.number().nullable().optional(),
  equivalentWidthKmSigma: z.number().nullable().optional(),
  equivalentDepthKm: z.number().nullable().optional(),
  equivalentDepthKmSigma: z.number().nullable().optional(),
  normalOpticalDepth: z.number().nullable().optional(),
  normalOpticalDepthSigma: z.number().nullable().optional(),
  lowerLimits: dipLowerLimits.nullable().optional(),
});
export type TimingDip = z.infer<typeof timingDipSchema>;

export const timingDocumentSchema = z.object({
  format: z.literal(TIMING_FORMAT),
  disappearance: timedMark.nullable(),
  reappearance: timedMark.nullable(),
  /** The speeds each main edge was modelled at (added to the first version). */
  edgeSpeedsKmPerS: z.object({ disappearance: z.number(), reappearance: z.number() }).optional(),
  baselineFlux: z.number(),
  bottomFlux: z.number().nullable(),
  chi2: z.number(),
  dof: z.number(),
  fresnelScaleKm: z.number(),
  starDiameterKm: z.number(),
  noiseSigmaFlux: z.number().nullable(),
  eventSignificance: z.number(),
  dips: z.array(timingDipSchema),
});
export type TimingDocument = z.infer<typeof timingDocumentSchema>;

/** The document of one timing, its times in UTC from the light curve's first row. */
export function timingDocument(result: TimingResult, origin: UtcInstant): TimingDocument {
  const mark = (edge: { timeSeconds: number; sigmaSeconds: number }) => ({
    time: formatUtc(origin, edge.timeSeconds),
    sigmaSeconds: edge.sigmaSeconds,
  });
  return {
    format: TIMING_FORMAT,
    disappearance: result.disappearance === null ? null : mark(result.disappearance),
    reappearance: result.reappearance === null ? null : mark(result.reappearance),
    edgeSpeedsKmPerS: {
      disappearance: result.edgeSpeedsKmPerS.disappearanceKmPerS,
      reappearance: result.edgeSpeedsKmPerS.reappearanceKmPerS,
    },
    baselineFlux: result.baselineFlux,
    bottomFlux: result.bottomFlux,
    chi2: result.chi2,
    dof: result.dof,
    fresnelScaleKm: result.fresnelScaleKm,
    starDiameterKm: result.starDiameterKm,
    noiseSigmaFlux: result.noiseSigmaFlux,
    eventSignificance: result.eventSignificance,
    dips: result.dips.map((d) => ({
      start: mark(d.start),
      end: mark(d.end),
      apparentOpacity: d.apparentOpacity,
      apparentOpacitySigma: d.apparentOpacitySigma,
      apparentOpticalDepth: d.apparentOpticalDepth,
      apparentOpticalDepthSigma: d.apparentOpticalDepthSigma,
      normalOpticalDepth: d.normalOpticalDepth,
      normalOpticalDepthSigma: d.normalOpticalDepthSigma,
      widthKm: d.widthKm,
      widthKmSigma: d.widthKmSigma,
      equivalentWidthKm: d.equivalentWidthKm,
      equivalentWidthKmSigma: d.equivalentWidthKmSigma,
      equivalentDepthKm: d.equivalentDepthKm,
      equivalentDepthKmSigma: d.equivalentDepthKmSigma,
      lowerLimits: d.lowerLimits,
      significance: d.significance,
      marked: d.marked,
    })),
  };
}

/**
 * The apparent opacity a ring event made from a timing's dip carries into the event file: the measured
 * value, or for a dip that is not resolved or is opaque its lower bound (docs/method.md, "Ring dips").
 * Null when the document holds no opacity 1-sigma (stored before it) or the bound is not above 0.
 */
export function ringEventOpacity(
  dip: TimingDip,
): { value: number; sigma: number; lowerLimit: boolean } | null {
  const sigma = dip.apparentOpacitySigma;
  if (sigma === undefined || sigma === null) return null;
  const limits = dip.lowerLimits ?? null;
  const value = limits === null ? dip.apparentOpacity : limits.apparentOpacity;
  if (!(value > 0)) return null;
  return { value: Math.min(1, value), sigma, lowerLimit: limits !== null };
}
