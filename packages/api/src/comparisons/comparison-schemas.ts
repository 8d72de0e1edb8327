import { z } from 'zod';
import { figureQuerySchema } from '../exports/export-query';

/** Approved fits are what a team stands behind; "all" adds every other solved fit, on request. */
export const comparisonQuerySchema = z.strictObject({
  fits: z.enum(['approved', 'all']).default('approved'),
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
