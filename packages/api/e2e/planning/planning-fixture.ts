// The demo's invented Quillon event, imported into a test workspace with prediction settings: the event
// the planning e2e tests predict, place and brief (its shadow crosses the Arabian Sea at night).
import { readFileSync } from 'node:fs';
import { DEMO_EVENT_PATH } from '../../src/demo/demo-scenario';
import { importExample, patch, type Workspace } from '../events/workspace';
import type { TestApp } from '../setup';

/** The demo event file without its prediction section (the tests give their own). */
export function quillonFile(): Record<string, unknown> {
  const file = JSON.parse(readFileSync(DEMO_EVENT_PATH, 'utf8')) as Record<string, unknown>;
  delete file.prediction;
  return file;
}

/** Invented settings near the demo's: a 365 km body with a 1100 km ring, 3 × 4 mas of 1σ. */
export const SETTINGS = {
  bodyRadiusKm: 365,
  uncertaintyMas: { raCosDec: 3, dec: 4 },
  offsetMas: { raCosDec: 0, dec: 0 },
  rings: [{ ring: 'R1', radiusKm: 1100 }],
  stepSeconds: 10,
};

/** A new Quillon event of the workspace's team, with prediction settings set by its coordinator. */
export async function plannedEvent(
  t: TestApp,
  w: Workspace,
  settings: Record<string, unknown> = SETTINGS,
): Promise<string> {
  const eventId = await importExample(t, w, quillonFile(), { bodyName: 'Quillon' });
  await patch(t, `/api/events/${eventId}`)
    .set(w.auth('coordinator'))
    .send({ prediction: settings })
    .expect(200);
  return eventId;
}
