// `limbus solve EVENT.json`: validates one event file, solves it and prints the solution file on stdout.
// Step in the data flow: file -> validated EventInput -> geometry solve -> solution JSON.

import { createHash } from 'node:crypto';

// Subpath imports, not the package indexes: the indexes also load the light-curve, shape and API modules,
// which the solve never uses and which cost ~80 ms of the command's start-up (docs/performance.md).
import type { Solution } from '@limbus/geometry';
import { solveEvent } from '@limbus/geometry/solve';
import { validateEventFile } from '@limbus/schema/event-file';
import { validateSolutionFile } from '@limbus/schema/solution-file';

import { InputProblems, oneFileArgument, readJsonFile, runCommand } from '../io.js';

const USAGE = 'usage: limbus solve EVENT.json';

/** Reads, validates and solves one event file; throws InputProblems for anything a person can fix. */
export async function solveEventFile(path: string): Promise<Solution> {
  const { value, bytes } = await readJsonFile(path);
  const validation = validateEventFile(value);
  if (!validation.ok) throw new InputProblems(validation.problems);
  const inputSha256 = createHash('sha256').update(bytes).digest('hex');
  const solution = solveEvent(validation.event, { inputSha256 });
  // A solution that does not meet its own file format is the engine's fault, not the user's: exit 1.
  const check = validateSolutionFile(solution);
  if (!check.ok)
    throw new Error(
      `solution does not match limbus-solution/1: ${check.problems.map((p) => `${p.path}: ${p.message}`).join('; ')}`,
    );
  return solution;
}

export async function run(args: string[]): Promise<number> {
  return runCommand(async () => {
    const solution = await solveEventFile(oneFileArgument(args, USAGE, 'event file'));
    process.stdout.write(JSON.stringify(solution, null, 2) + '\n');
  });
}
