import { z } from 'zod';
import { validateSolutionFile } from '@limbus/schema/solution-file';
import type { Solution } from '@limbus/geometry';

/** A stored solution (limbus-solution/1), checked with the same schema the CLI and server use. */
export const solutionSchema = z.unknown().transform((json, ctx): Solution => {
  const result = validateSolutionFile(json);
  if (result.ok) return result.solution;
  for (const problem of result.problems)
    ctx.addIssue({ code: 'custom', message: `solution ${problem.path}: ${problem.message}` });
  return z.NEVER;
});
