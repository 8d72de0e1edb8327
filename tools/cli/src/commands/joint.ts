// `limbus joint [--ring LABEL] EVENT1.json EVENT2.json …`: one ring pole and radius fitted to the dips of
// one ring in several event files at once; prints a "limbus-joint/1" document (docs/file-formats.md,
// "Joint pole"). Problems are named by file, then by JSON path inside it.

import {
  GeometryInputError,
  fitJointPole,
  jointEventFromInput,
  jointPoleDocument,
  ringLabels,
  type EventInput,
  type JointEvent,
} from '@limbus/geometry';
import { validateEventFile } from '@limbus/schema';

import { InputProblems, readJsonFile, runCommand, type Problem } from '../io.js';

const USAGE = 'usage: limbus joint [--ring LABEL] EVENT1.json EVENT2.json …';

export interface JointArguments {
  ring: string | null;
  files: string[];
}

export function parseJointArguments(args: string[]): JointArguments {
  const problems: Problem[] = [];
  const files: string[] = [];
  let ring: string | null = null;
  for (let i = 0; i < args.length; i++) {
    const arg = args[i] as string;
    if (arg === '--ring') {
      const value = args[++i];
      if (value === undefined || value === '')
        problems.push({ path: 'arguments', message: `--ring needs a label; ${USAGE}` });
      else ring = value;
    } else if (arg.startsWith('--ring=')) {
      ring = arg.slice('--ring='.length);
    } else if (arg.startsWith('-')) {
      problems.push({ path: 'arguments', message: `unknown option ${arg}; ${USAGE}` });
    } else {
      files.push(arg);
    }
  }
  if (files.length === 0)
    problems.push({ path: 'arguments', message: `expected at least one event file; ${USAGE}` });
  if (problems.length > 0) throw new InputProblems(problems);
  return { ring, files };
}

function inFile(file: string, path: string): string {
  return path === file ? file : `${file}: ${path}`;
}

/** Reads and validates every file, collecting the problems of all of them before giving up. */
async function readEvents(files: string[]): Promise<EventInput[]> {
  const problems: Problem[] = [];
  const events: EventInput[] = [];
  for (const file of files) {
    try {
      const { value } = await readJsonFile(file);
      const validation = validateEventFile(value);
      if (validation.ok) events.push(validation.event);
      else
        problems.push(
          ...validation.problems.map((p) => ({ path: inFile(file, p.path), message: p.message })),
        );
    } catch (error) {
      if (!(error instanceof InputProblems)) throw error;
      problems.push(...error.problems);
    }
  }
  if (problems.length > 0) throw new InputProblems(problems);
  return events;
}

export async function run(args: string[]): Promise<number> {
  return runCommand(async () => {
    const { ring: requested, files } = parseJointArguments(args);
    const events = await readEvents(files);
    const firstFile = files[0] as string;
    const ring = requested ?? ringLabels(events[0] as EventInput)[0];
    if (ring === undefined)
      throw new InputProblems([
        {
          path: firstFile,
          message: 'has no ring events, so there is no ring to fit (name one with --ring LABEL)',
        },
      ]);
    const problems: Problem[] = [];
    const jointEvents: JointEvent[] = [];
    events.forEach((event, k) => {
      const file = files[k] as string;
      try {
        jointEvents.push(jointEventFromInput(event, ring, file));
      } catch (error) {
        if (!(error instanceof GeometryInputError)) throw error;
        problems.push({ path: inFile(file, error.path), message: error.detail });
      }
    });
    if (problems.length > 0) throw new InputProblems(problems);
    const document = jointPoleDocument(ring, fitJointPole(jointEvents));
    process.stdout.write(JSON.stringify(document, null, 2) + '\n');
  });
}
