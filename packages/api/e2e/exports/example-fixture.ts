// The invented example event of docs/examples, solved by the real engine, for the export specs.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { solveEvent, type EventInput, type Solution } from '@limbus/geometry';
import { validateEventFile } from '@limbus/schema';
import type { Provenance } from '../../src/exports/provenance';

export function exampleEvent(): EventInput {
  const raw: unknown = JSON.parse(
    readFileSync(join(__dirname, '../../../../docs/examples/event-example.json'), 'utf8'),
  );
  const v = validateEventFile(raw);
  if (!v.ok) throw new Error(`example event no longer validates: ${JSON.stringify(v.problems)}`);
  return v.event;
}

let cached: Solution | null = null;
export function exampleSolution(): Solution {
  cached ??= solveEvent(exampleEvent(), { inputSha256: 'c0ffee'.padEnd(64, '0') });
  return cached;
}

export const exampleProvenance: Provenance = {
  fitId: '7d3f6c1e-2b1a-4c55-9f0e-3a1b2c3d4e5f',
  inputSha256: 'c0ffee'.padEnd(64, '0'),
  engineVersion: '0.1.0',
  seed: 1,
  date: '2028-03-15T10:00:00.000Z',
  approvalState: 'approved',
};
