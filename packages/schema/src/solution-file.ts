// The solution file ("limbus-solution/1") that `limbus solve` prints and the server stores, so that a
// client can check what it receives. Its shape is geometry's `Solution`; docs/file-formats.md,
// "Solution file", gives the units and sign conventions.

import { z } from 'zod';

import type { RingCenterFrom, Solution } from '@limbus/geometry';

import { plainErrorMap, problemsFromIssues, type Problem } from './problems.js';

export const SOLUTION_FORMAT = 'limbus-solution/1';

const skyPoint = { fKm: z.number(), gKm: z.number() };

const limbEllipseShape = {
  centerFKm: z.number(),
  centerGKm: z.number(),
  equatorialRadiusKm: z.number(),
  oblateness: z.number(),
  positionAngleDeg: z.number(),
};

const limbEllipse = z.object(limbEllipseShape);

const chord = z.object({
  station: z.string(),
  type: z.enum(['positive', 'negative']),
  points: z.array(
    z.object({ ...skyPoint, event: z.enum(['disappearance', 'reappearance']), sigmaKm: z.number() }),
  ),
  path: z.array(z.object(skyPoint)),
  velocityKmPerS: z.object({ f: z.number(), g: z.number() }),
});

/** A covariance in the solution's units, rows and columns in the order of `parameters` (square). */
const covariance = z
  .object({ parameters: z.array(z.string()), matrix: z.array(z.array(z.number())) })
  .refine(
    (c) =>
      c.matrix.length === c.parameters.length && c.matrix.every((row) => row.length === c.parameters.length),
    { message: 'matrix must be square, one row and column per parameter' },
  );

/** The ensemble sampler's acceptance, autocorrelation times and effective samples (docs/file-formats.md). */
const sampler = z.object({
  walkers: z.int().positive(),
  burnInSteps: z.int().nonnegative(),
  steps: z.int().positive(),
  acceptanceFraction: z.number().min(0).max(1),
  parameters: z.array(
    z.object({
      parameter: z.string(),
      autocorrelationSteps: z.number().positive(),
      effectiveSamples: z.number().positive(),
    }),
  ),
  cautions: z.array(z.string()),
});

// Fields added after solutions were first stored are optional, so that every stored fit still reads.
const limb = z.object({
  ...limbEllipseShape,
  equivalentRadiusKm: z.number(),
  uncertainty: z.object({ ...limbEllipseShape, equivalentRadiusKm: z.number() }),
  chi2: z.number(),
  dof: z.int(),
  radialResidualsKm: z.array(
    z.object({
      station: z.string(),
      event: z.enum(['disappearance', 'reappearance']),
      residualKm: z.number(),
    }),
  ),
  negativeChordsClear: z.boolean(),
  timeOffsets: z.array(z.object({ station: z.string(), seconds: z.number(), sigma: z.number() })),
  band: z.array(limbEllipse),
  covariance: covariance.optional(),
  sigmaMethod: z.enum(['sampled', 'linearised']).optional(),
  sampler: sampler.optional(),
});

const pole = z.object({
  raDeg: z.number(),
  decDeg: z.number(),
  uncertainty: z.object({ raDeg: z.number(), decDeg: z.number(), correlation: z.number() }).optional(),
});

// Spelled out rather than imported: the client loads this module, and geometry's runtime must stay out of
// it (DEVELOPERS.md, "The client imports @limbus/schema through subpaths"). The type check below keeps the
// list equal to geometry's RING_CENTER_SOURCES.
const RING_CENTER_SOURCES = ['limb', 'free', 'joint'] as const satisfies readonly RingCenterFrom[];

const measured = z.object({ value: z.number(), sigma: z.number() });

/** A ring crossing's dip products (docs/file-formats.md, "Solution file"); null optical depths when opaque. */
const crossingDip = z.object({
  lowerLimit: z.boolean(),
  apparentOpacity: measured,
  apparentOpticalDepth: measured.nullable(),
  normalOpticalDepth: measured.nullable(),
  equivalentWidthKm: measured,
  normalEquivalentWidthKm: measured,
  equivalentDepthKm: measured.nullable(),
  normalEquivalentDepthKm: measured.nullable(),
});

const ring = z.object({
  ring: z.string(),
  centerFrom: z.enum(RING_CENTER_SOURCES).optional(),
  centerFKm: z.number(),
  centerGKm: z.number(),
  radiusKm: z.number(),
  openingAngleDeg: z.number(),
  positionAngleDeg: z.number(),
  uncertainty: z.object({
    radiusKm: z.number(),
    openingAngleDeg: z.number(),
    positionAngleDeg: z.number(),
    centerFKm: z.number().optional(),
    centerGKm: z.number().optional(),
  }),
  covariance: covariance.optional(),
  sampler: sampler.optional(),
  poles: z.tuple([pole, pole]),
  crossings: z.array(
    z.object({
      ...skyPoint,
      station: z.string(),
      radialWidthKm: z.number(),
      radialWidthKmSigma: z.number().optional(),
      dip: crossingDip.optional(),
    }),
  ),
  chi2: z.number(),
  dof: z.int(),
});

const astrometry = z.object({
  referenceTimeUtc: z.string(),
  raOffsetCosDecMas: z.number(),
  decOffsetMas: z.number(),
  uncertainty: z.object({ raOffsetCosDecMas: z.number(), decOffsetMas: z.number() }),
});

export const solutionFileSchema = z.object({
  format: z.literal(SOLUTION_FORMAT),
  chords: z.array(chord),
  limb: limb.nullable(),
  rings: z.array(ring),
  astrometry: astrometry.nullable(),
  engine: z.object({ version: z.string(), inputSha256: z.string().regex(/^[0-9a-f]{64}$/), seed: z.int() }),
});

export type SolutionValidation = { ok: true; solution: Solution } | { ok: false; problems: Problem[] };

/** Checks a received solution document; unknown fields are dropped so that older clients keep working. */
export function validateSolutionFile(json: unknown): SolutionValidation {
  const parsed = solutionFileSchema.safeParse(json, { error: plainErrorMap });
  if (!parsed.success) return { ok: false, problems: problemsFromIssues(parsed.error.issues) };
  // Compile-time proof that the schema's output fits geometry's Solution.
  const solution: Solution = parsed.data;
  return { ok: true, solution };
}
