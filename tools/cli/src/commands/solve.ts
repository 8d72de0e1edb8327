// `limbus solve EVENT.json`: validates one event file, solves it and prints the solution file on stdout.
// Step in the data flow: file -> validated EventInput -> geometry solve -> solution JSON.

import { createHash } from 'node:crypto';

// Subpath imports, not the package indexes: the indexes also load the light-curve, shape and API modules,
// which the solve never uses and which cost ~80 ms of the command's start-up (docs/performance.md).
import type { Solution } from '@limbus/geometry';
import { solveEvent } from '@limbus/geometry/solve';
import { validateEventFile } from '@limbus/schema/event-file';
import { validateSolutionFile } from '@limbus/schema/solution-file';

import { InputProblems, readJsonFile, runCommand } from '../io.js';

const USAGE = 'usage: limbus solve EVENT.json';

export function parseSolveArguments(args: string[]): string {
  const files = args.filter((a) => !a.startsWith('-'));
  const flags = args.filter((a) => a.startsWith('-'));
  const problems = flags.map((flag) => ({ path: 'arguments', message: `unknown option ${flag}; ${USAGE}` }));
  if (files.length !== 1)
    problems.push({ path: 'arguments', message: `expected one event file, got ${files.length}; ${USAGE}` });
  if (problems.length > 0) throw new InputProblems(problems);
  return files[0] as string;
}

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
    const solution = await solveEventFile(parseSolveArguments(args));
    process.stdout.write(JSON.stringify(solution, null, 2) + '\n');
  });
}
