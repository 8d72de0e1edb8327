import { z } from 'zod';
import { figureQuerySchema } from '../exports/export-query';

/**
 * Approved fits are what a team stands behind. By default each event shows its latest approved fit only
 * (two fits of one event would count its chords twice); "approved" shows every approved fit, "all" adds
 * every other solved fit, on request.
 */
export const COMPARISON_SELECTIONS = ['latest-approved', 'approved', 'all'] as const;
export type ComparisonSelection = (typeof COMPARISON_SELECTIONS)[number];

export const comparisonQuerySchema = z.strictObject({
  fits: z.enum(COMPARISON_SELECTIONS).default('latest-approved'),
  /** One body of the team; on the team routes, required when the team's fits observe several bodies. */
  bodyId: z.string().min(1).max(36).optional(),
  /** Comma-separated event ids; all of the team's events when absent. */
  events: z
    .string()
    .optional()
    .transform((s) => (s === undefined || s === '' ? null : s.split(',').map((id) => id.trim()))),
});
export type ComparisonQuery = z.infer<typeof comparisonQuerySchema>;

export const comparisonFigureQuerySchema = z.strictObject({
  ...comparisonQuerySchema.shape,
  ...figureQuerySchema.shape,
  /** A solved joint-pole job of this team, drawn on the pole panel. */
  jointId: z.string().min(1).max(36).optional(),
});
export type ComparisonFigureQuery = z.infer<typeof comparisonFigureQuerySchema>;

export const jointPolePayloadSchema = z.strictObject({
  fitIds: z.array(z.string().min(1).max(36)).min(1).max(50),
  /** Ring label; the first ring of the first fit's event when absent, as in `limbus joint`. */
  ring: z.string().min(1).max(100).optional(),
});
export type JointPolePayload = z.infer<typeof jointPolePayloadSchema>;
