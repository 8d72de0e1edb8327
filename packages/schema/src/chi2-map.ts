// χ² maps of a fit (docs/file-formats.md, "χ² maps"): the request a modeller sends, the map the API answers,
// and the look both drawings share (the client's plot and the server's SVG/PNG/PDF figure). The client loads
// this module (@limbus/schema/chi2-map), so it imports geometry's types only, never its runtime.

import { z } from 'zod';

import { plainErrorMap, problemsFromIssues, type Problem } from './problems.js';

import type {
  CHI2_MAP_MAX_STEPS as GEOMETRY_MAX_STEPS,
  CHI2_MAP_MIN_STEPS as GEOMETRY_MIN_STEPS,
  Chi2Map,
} from '@limbus/geometry';

// Spelled out rather than imported (the client must not load geometry's runtime); the type annotations
// keep them equal to geometry's limits.
export const CHI2_MAP_MIN_STEPS: typeof GEOMETRY_MIN_STEPS = 5;
export const CHI2_MAP_MAX_STEPS: typeof GEOMETRY_MAX_STEPS = 61;
export const CHI2_MAP_STATES = ['queued', 'running', 'solved', 'failed'] as const;

const parameterName = z.string().min(1, 'must not be empty').max(120, 'at most 120 characters');
const range = z
  .strictObject({ from: z.number(), to: z.number() })
  .refine((r) => r.from < r.to, { message: 'from must be below to', path: ['to'] });

/** Body of POST /api/fits/:fitId/chi2-maps. Ranges in the parameters' solution units (km, degrees, s). */
export const chi2MapRequestSchema = z.strictObject({
  x: parameterName,
  y: parameterName,
  ranges: z.strictObject({ x: range.optional(), y: range.optional() }).optional(),
  steps: z
    .int('must be a whole number')
    .min(CHI2_MAP_MIN_STEPS, `must be ${CHI2_MAP_MIN_STEPS} or more`)
    .max(CHI2_MAP_MAX_STEPS, `must be ${CHI2_MAP_MAX_STEPS} or less`)
    .optional(),
});
export type Chi2MapRequestPayload = z.infer<typeof chi2MapRequestSchema>;

/** Checks a request body; every problem names its path, an unknown key by its own name. */
export function validateChi2MapRequest(
  json: unknown,
): { ok: true; request: Chi2MapRequestPayload } | { ok: false; problems: Problem[] } {
  const parsed = chi2MapRequestSchema.safeParse(json, { error: plainErrorMap });
  return parsed.success
    ? { ok: true, request: parsed.data }
    : { ok: false, problems: problemsFromIssues(parsed.error.issues) };
}

const unit = z.enum(['km', 'deg', 's', '']);

export const chi2MapParameterSchema = z.object({
  parameter: z.string(),
  unit,
  best: z.number(),
  sigma: z.number(),
  min: z.number().nullable(),
  max: z.number().nullable(),
});

const axis = chi2MapParameterSchema.extend({ values: z.array(z.number()) });

/** geometry's Chi2Map, as stored and answered. */
export const chi2MapResultSchema = z.object({
  chi2Of: z.enum(['limb', 'ring', 'joint']),
  ring: z.string().nullable(),
  x: axis,
  y: axis,
  profiled: z.array(z.string()),
  chi2: z.array(z.array(z.number().nullable())),
  bestChi2: z.number(),
  minChi2: z.number(),
  dof: z.int(),
  levels: z.array(
    z.object({
      sigma: z.union([z.literal(1), z.literal(2), z.literal(3)]),
      confidence: z.number(),
      deltaChi2: z.number(),
      segments: z.array(z.tuple([z.number(), z.number(), z.number(), z.number()])),
    }),
  ),
  cautions: z.array(z.string()),
});

const author = z.object({ id: z.string(), name: z.string() }).nullable();

/** A map as GET /api/fits/:fitId/chi2-maps lists it: without its grid. */
export const chi2MapSummarySchema = z.object({
  id: z.string(),
  fitId: z.string(),
  state: z.enum(CHI2_MAP_STATES),
  progress: z.number(),
  request: chi2MapRequestSchema,
  error: z.string().nullable(),
  createdBy: author,
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type Chi2MapSummary = z.infer<typeof chi2MapSummarySchema>;

/** GET /api/fits/:fitId/chi2-maps/:mapId. */
export const chi2MapViewSchema = chi2MapSummarySchema.extend({ result: chi2MapResultSchema.nullable() });
export type Chi2MapView = z.infer<typeof chi2MapViewSchema>;

/** GET /api/fits/:fitId/chi2-maps: what a map of this fit can take, and its maps, newest first. */
export const chi2MapListSchema = z.object({
  parameters: z.array(chi2MapParameterSchema),
  maps: z.array(chi2MapSummarySchema),
});
export type Chi2MapList = z.infer<typeof chi2MapListSchema>;

/**
 * The look of a map, shared by the client's plot and the exported figure: the cells shaded by the band of
 * Δχ² they fall in (below the 1σ, 2σ, 3σ levels, beyond), from ColorBrewer's sequential "Blues" (Brewer,
 * colorbrewer2.org, 4-class scheme), cells without a fit hatched grey; contours solid, dashed and dotted.
 */
export const CHI2_MAP_STYLE = {
  bandFills: ['#2171b5', '#6baed6', '#bdd7e7', '#eff3ff'],
  emptyFill: '#bdbdbd',
  contour: '#000000',
  best: '#d94801',
  dashes: ['', '4 2', '1 2'],
} as const;

/** Which shading band a Δχ² falls in, 0 … levels (the last: beyond every level). */
export function chi2BandOf(deltaChi2: number, levels: ReadonlyArray<{ deltaChi2: number }>): number {
  const k = levels.findIndex((l) => deltaChi2 < l.deltaChi2);
  return k === -1 ? levels.length : k;
}

/** A stored or received map result, checked; the assignment is the compile-time proof it is geometry's Chi2Map. */
export function parseChi2MapResult(json: unknown): Chi2Map {
  const result: Chi2Map = chi2MapResultSchema.parse(json);
  return result;
}
