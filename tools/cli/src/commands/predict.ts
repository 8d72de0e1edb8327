// `limbus predict EVENT.json`: validates one event file with its `prediction` section and prints the
// shadow path and every station's outlook as a limbus-prediction/1 document on stdout.
// Step in the data flow: file -> validated EventInput + PredictionSettings -> geometry prediction -> JSON.

// Subpath imports, not the package indexes (see solve.ts): only what the prediction needs is loaded.
import type { Prediction } from '@limbus/geometry';
import { predictEvent } from '@limbus/geometry/predict';
import { validatePredictionEventFile } from '@limbus/schema/event-file';
import { validatePredictionDocument } from '@limbus/schema/prediction';

import { InputProblems, oneFileArgument, readJsonFile, runCommand } from '../io.js';

const USAGE = 'usage: limbus predict EVENT.json';

/** Reads, validates and predicts one event file; throws InputProblems for anything a person can fix. */
export async function predictEventFile(path: string): Promise<Prediction> {
  const { value } = await readJsonFile(path);
  const validation = validatePredictionEventFile(value);
  if (!validation.ok) throw new InputProblems(validation.problems);
  const prediction = predictEvent(validation.event, validation.prediction);
  // A document that does not meet its own format is the engine's fault, not the user's: exit 1.
  const check = validatePredictionDocument(prediction);
  if (!check.ok)
    throw new Error(
      `prediction does not match limbus-prediction/1: ${check.problems.map((p) => `${p.path}: ${p.message}`).join('; ')}`,
    );
  return prediction;
}

export async function run(args: string[]): Promise<number> {
  return runCommand(async () => {
    const prediction = await predictEventFile(oneFileArgument(args, USAGE, 'event file'));
    process.stdout.write(JSON.stringify(prediction, null, 2) + '\n');
  });
}
