// The shadow-path prediction (docs/file-formats.md, "Prediction section" and "Prediction file"): the
// event file's optional `prediction` section, and the `limbus-prediction/1` document that
// `limbus predict` prints and the API answers. No geometry at run time (the client imports this module
// on its own, `@limbus/schema/prediction`): the geometry types below are compile-time proofs only. The
// checks that need the ephemeris (`from` and `to` within its rows) live in event-file.ts,
// `predictionSpanProblems`.

import { z } from 'zod';

import type { Prediction, PredictionSettings } from '@limbus/geometry';

import { parseUtcTime } from './iso-time.js';
import { pathPointSchema } from './planning.js';
import { plainErrorMap, problemsFromIssues, type PathSegment, type Problem } from './problems.js';
import { lineText, TEXT_LIMITS } from './text.js';

export const PREDICTION_FORMAT = 'limbus-prediction/1';

/**
 * The path's time step: at least 1 s (a finer grid adds nothing a map can show) and at most 600 s (the
 * shadow of a main-belt body crosses the Earth in about that). The geometry refuses the same range.
 */
export const PREDICTION_STEP_SECONDS = { min: 1, max: 600, default: 10 } as const;

const utcTime = z.string().refine((s) => parseUtcTime(s) !== null, {
  message: 'not an ISO 8601 UTC time (expected e.g. "2028-03-14T02:00:00Z", ending in Z)',
});

const sigmaMas = z.number().min(0, 'must not be negative (a 1-σ in mas)');

const ringSchema = z.strictObject({
  ring: lineText(TEXT_LIMITS.ringLabel, 'ring label'),
  radiusKm: z.number().positive('radiusKm must be greater than zero'),
});

/** The event file's `prediction` section; defaults applied, every unknown key refused by name. */
export const predictionSettingsSchema = z
  .strictObject({
    bodyRadiusKm: z.number().positive('bodyRadiusKm must be greater than zero'),
    uncertaintyMas: z.strictObject({ raCosDec: sigmaMas, dec: sigmaMas }).default({ raCosDec: 0, dec: 0 }),
    offsetMas: z.strictObject({ raCosDec: z.number(), dec: z.number() }).default({ raCosDec: 0, dec: 0 }),
    rings: z.array(ringSchema).default([]),
    stepSeconds: z
      .number()
      .min(PREDICTION_STEP_SECONDS.min, `stepSeconds must be at least ${PREDICTION_STEP_SECONDS.min}`)
      .max(PREDICTION_STEP_SECONDS.max, `stepSeconds must be at most ${PREDICTION_STEP_SECONDS.max}`)
      .default(PREDICTION_STEP_SECONDS.default),
    from: utcTime.optional(),
    to: utcTime.optional(),
  })
  .superRefine((section, ctx) => {
    const from = section.from === undefined ? undefined : parseUtcTime(section.from)?.orderSeconds;
    const to = section.to === undefined ? undefined : parseUtcTime(section.to)?.orderSeconds;
    if (from !== undefined && to !== undefined && to <= from)
      ctx.addIssue({ code: 'custom', path: ['to'], message: `to must come after from (${section.from})` });
    const first = new Map<string, number>();
    section.rings.forEach((ring, i) => {
      const before = first.get(ring.ring);
      if (before === undefined) first.set(ring.ring, i);
      else
        ctx.addIssue({
          code: 'custom',
          path: ['rings', i, 'ring'],
          message: `ring "${ring.ring}" is listed twice (also rings[${before}])`,
        });
    });
  });

export type PredictionSection = z.output<typeof predictionSettingsSchema>;

export type PredictionSettingsValidation =
  { ok: true; settings: PredictionSettings } | { ok: false; problems: Problem[] };

/**
 * Validates a `prediction` section on its own (a form, a stored setting); problems are located under
 * `pathPrefix` (default `prediction`, as in the event file). `from`/`to` against the ephemeris:
 * `predictionSpanProblems` in event-file.ts.
 */
export function validatePredictionSettings(
  json: unknown,
  pathPrefix: readonly PathSegment[] = ['prediction'],
): PredictionSettingsValidation {
  const parsed = predictionSettingsSchema.safeParse(json, { error: plainErrorMap });
  if (!parsed.success)
    return {
      ok: false,
      problems: problemsFromIssues(
        parsed.error.issues.map((issue) => ({ ...issue, path: [...pathPrefix, ...issue.path] })),
      ),
    };
  // Compile-time proof that the section fits geometry's PredictionSettings.
  const settings: PredictionSettings = parsed.data;
  return { ok: true, settings };
}

const pathLine = z.array(pathPointSchema);

/** The `limbus-prediction/1` document; unknown fields are dropped, so a client keeps working when fields are added. */
export const predictionDocumentSchema = z.object({
  format: z.literal(PREDICTION_FORMAT),
  closestApproach: z.object({ timeUtc: z.string(), distanceKm: z.number(), speedKmPerS: z.number() }),
  centralLine: pathLine,
  limits: z.object({ left: pathLine, right: pathLine }),
  rings: z.array(z.object({ ring: z.string(), left: pathLine, right: pathLine })),
  stations: z.array(
    z.object({
      station: z.string(),
      closestTimeUtc: z.string(),
      distanceKm: z.number(),
      crossTrackKm: z.number(),
      sigmaCrossTrackKm: z.number(),
      disappearanceUtc: z.string().nullable(),
      reappearanceUtc: z.string().nullable(),
      rings: z.array(z.object({ ring: z.string(), window: z.tuple([z.string(), z.string()]).nullable() })),
      starAltitudeDeg: z.number(),
      sunAltitudeDeg: z.number(),
    }),
  ),
});

export type PredictionDocument = z.output<typeof predictionDocumentSchema>;

export type PredictionDocumentValidation =
  { ok: true; prediction: Prediction } | { ok: false; problems: Problem[] };

/** Checks a prediction document (the CLI checks its own output with it; the client what it receives). */
export function validatePredictionDocument(json: unknown): PredictionDocumentValidation {
  const parsed = predictionDocumentSchema.safeParse(json, { error: plainErrorMap });
  if (!parsed.success) return { ok: false, problems: problemsFromIssues(parsed.error.issues) };
  // Compile-time proof that the schema's output fits geometry's Prediction.
  const prediction: Prediction = parsed.data;
  return { ok: true, prediction };
}
