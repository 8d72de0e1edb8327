// The dynamics-context input file ("limbus-context-input/1") that `limbus context` reads: a body's mass
// or density, radius and spin, the ring-particle density, the heliocentric distance, satellites and ring
// radii, each measured value with an optional "…Sigma" (1-sigma, same unit) and "…Source" (a note of
// where it came from) twin. docs/file-formats.md, "Context input", gives the units.

import { z } from 'zod';

import type { ContextInput } from '@limbus/geometry';

import { plainErrorMap, problemsFromIssues, type Problem } from './problems.js';

export const CONTEXT_INPUT_FORMAT = 'limbus-context-input/1';

const positive = z.number().positive('must be greater than 0');
const sigma = z.number().nonnegative('must be 0 or more').optional();
const source = z.string().optional();

type Twins<K extends string> = Record<`${K}Sigma`, typeof sigma> & Record<`${K}Source`, typeof source>;

function twins<const K extends string>(key: K): Twins<K> {
  return { [`${key}Sigma`]: sigma, [`${key}Source`]: source } as Twins<K>;
}

/** A required measured value with its optional 1-sigma and source note. */
function measured<const K extends string>(key: K): Record<K, typeof positive> & Twins<K> {
  return { [key]: positive, ...twins(key) } as Record<K, typeof positive> & Twins<K>;
}

/** An optional measured value with its optional 1-sigma and source note. */
function maybeMeasured<const K extends string>(key: K): Record<K, z.ZodOptional<typeof positive>> & Twins<K> {
  return { [key]: positive.optional(), ...twins(key) } as Record<K, z.ZodOptional<typeof positive>> &
    Twins<K>;
}

const body = z
  .strictObject({
    ...maybeMeasured('massKg'),
    ...maybeMeasured('densityKgM3'),
    massFromSatellite: z.string().min(1).optional(),
    ...measured('radiusKm'),
    ...measured('spinPeriodHours'),
  })
  .superRefine((b, ctx) => {
    const given = ['massKg', 'densityKgM3', 'massFromSatellite'].filter(
      (k) => k in b && Reflect.get(b, k) !== undefined,
    );
    if (given.length !== 1) {
      ctx.addIssue({
        code: 'custom',
        message:
          given.length === 0
            ? 'give one of massKg, densityKgM3 or massFromSatellite'
            : `give only one of ${given.join(', ')}`,
      });
    }
  });

const satellite = z
  .strictObject({
    name: z.string().min(1, 'must not be empty'),
    ...maybeMeasured('periodDays'),
    ...maybeMeasured('semiMajorAxisKm'),
  })
  .refine((s) => s.periodDays !== undefined || s.semiMajorAxisKm !== undefined, {
    message: 'give periodDays or semiMajorAxisKm',
  });

const ring = z.strictObject({ ring: z.string().min(1, 'must not be empty'), ...measured('radiusKm') });

function greatestCommonDivisor(x: number, y: number): number {
  return y === 0 ? x : greatestCommonDivisor(y, x % y);
}

/** A mean-motion resonance p:q (n_particle/n_satellite) to list besides the default ones. */
const resonance = z
  .strictObject({
    p: z.int('must be a whole number').min(1, 'must be 1 or more').max(50, 'must be 50 or less'),
    q: z.int('must be a whole number').min(1, 'must be 1 or more').max(50, 'must be 50 or less'),
  })
  .superRefine((r, ctx) => {
    if (r.p === r.q)
      ctx.addIssue({ code: 'custom', message: "p and q must differ (1:1 is the satellite's own orbit)" });
    else {
      const k = greatestCommonDivisor(r.p, r.q);
      if (k !== 1)
        ctx.addIssue({
          code: 'custom',
          message: `write ${r.p}:${r.q} in lowest terms, ${r.p / k}:${r.q / k}`,
        });
    }
  });

export const contextInputSchema = z.strictObject({
  format: z.literal(CONTEXT_INPUT_FORMAT),
  body,
  ...measured('particleDensityKgM3'),
  ...measured('heliocentricDistanceAu'),
  satellites: z.array(satellite).default([]),
  rings: z.array(ring).default([]),
  spinOrbitK: z.array(z.int().min(1, 'must be 1 or more')).min(1).optional(),
  resonanceMaxOrder: z.int().min(1).max(10).optional(),
  resonanceMaxInteger: z.int().min(2).max(50).optional(),
  resonances: z.array(resonance).max(50, 'at most 50 resonances').optional(),
});

export type ContextInputFile = z.infer<typeof contextInputSchema>;

export type ContextInputValidation =
  { ok: true; input: ContextInput; file: ContextInputFile } | { ok: false; problems: Problem[] };

/** Every "…Source" note of the file, keyed by the JSON path of the value it describes. */
export function contextSources(file: ContextInputFile): Record<string, string> {
  const sources: Record<string, string> = {};
  const collect = (prefix: string, object: object): void => {
    for (const [key, value] of Object.entries(object)) {
      if (key.endsWith('Source') && typeof value === 'string')
        sources[`${prefix}${key.slice(0, -6)}`] = value;
    }
  };
  collect('', file);
  collect('body.', file.body);
  file.satellites.forEach((s, i) => collect(`satellites[${i}].`, s));
  file.rings.forEach((r, i) => collect(`rings[${i}].`, r));
  return sources;
}

export function validateContextInput(json: unknown): ContextInputValidation {
  const parsed = contextInputSchema.safeParse(json, { error: plainErrorMap });
  if (!parsed.success) return { ok: false, problems: problemsFromIssues(parsed.error.issues) };
  // This assignment is the compile-time proof that the schema's output fits geometry's ContextInput.
  const input: ContextInput = parsed.data;
  return { ok: true, input, file: parsed.data };
}
