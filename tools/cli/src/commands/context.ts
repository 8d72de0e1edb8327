// `limbus context CONTEXT.json`: validates a dynamics-context input file and prints the body's Roche
// limits, resonance radii, synchronous orbit, Hill radius and ring radii set against them, with 1-sigma.
// Step in the data flow: file -> validated ContextInput -> geometry computeDynamicsContext -> JSON.

import { computeDynamicsContext, type ContextResult } from '@limbus/geometry';
import { contextSources, validateContextInput } from '@limbus/schema';

import { InputProblems, oneFileArgument, readJsonFile, runCommand } from '../io.js';

const USAGE = 'usage: limbus context CONTEXT.json';

export const CONTEXT_OUTPUT_FORMAT = 'limbus-context/1';

const NOTES = [
  'Roche limits use the bulk density of a sphere of radiusKm and the classical coefficients 2.44 (fluid) and 2^(1/3) ≈ 1.26 (rigid).',
  "Resonance and synchronous radii are Keplerian (point-mass body, no J2); a body's J2 moves real resonances outward by up to about a per cent.",
  "Each ring's nearest resonances include the k:1 and 1:k ones up to 8 and every p:q named in the input; a ring within a few sigma of one is near it, not shown to be in it.",
  'The Hill radius takes a circular orbit at the present heliocentric distance.',
  '1-sigma by first-order propagation of the inputs taken as independent.',
];

export interface ContextOutput extends ContextResult {
  format: typeof CONTEXT_OUTPUT_FORMAT;
  sources: Record<string, string>;
  notes: string[];
}

/** Reads and validates one context input file and computes its context; throws InputProblems on bad input. */
export async function contextFromFile(path: string): Promise<ContextOutput> {
  const { value } = await readJsonFile(path);
  const validation = validateContextInput(value);
  if (!validation.ok) throw new InputProblems(validation.problems);
  const { uncertainty, ...figures } = computeDynamicsContext(validation.input);
  // The uncertainty block goes last so that a reader meets each value before its 1-sigma.
  return {
    format: CONTEXT_OUTPUT_FORMAT,
    ...figures,
    sources: contextSources(validation.file),
    notes: NOTES,
    uncertainty,
  };
}

export async function run(args: string[]): Promise<number> {
  return runCommand(async () => {
    const output = await contextFromFile(oneFileArgument(args, USAGE, 'context file'));
    process.stdout.write(JSON.stringify(output, null, 2) + '\n');
  });
}
