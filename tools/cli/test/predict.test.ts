import { readFileSync } from 'node:fs';
import { join } from 'node:path';

import { beforeAll, describe, expect, it } from 'vitest';

import { predictEvent } from '@limbus/geometry/predict';
import { validatePredictionDocument } from '@limbus/schema/prediction';
import { validatePredictionEventFile } from '@limbus/schema/event-file';

import { buildCliIfStale, REPO_ROOT, runCli, writeScratchFile } from './built-cli.js';

type Json = Record<string, unknown>;

// The invented planning event (fixtures/make-predict-event.ts): the distant slow body Brennock with a
// ring, five invented sites, no chords.
const FIXTURE = join(REPO_ROOT, 'tools/cli/test/fixtures/predict-brennock.json');
const fixture = (): Json & { prediction: Json } =>
  JSON.parse(readFileSync(FIXTURE, 'utf8')) as Json & { prediction: Json };

function predictWith(change: (doc: Json & { prediction: Json }) => void) {
  const doc = fixture();
  change(doc);
  return runCli(['predict', writeScratchFile(doc)]);
}

/** Exit 2, nothing on stdout, every expected line on stderr and no stack trace. */
function expectRefused(result: ReturnType<typeof runCli>, expectedLines: string[]): void {
  expect(result.code, result.stderr).toBe(2);
  expect(result.stdout).toBe('');
  const lines = result.stderr.trimEnd().split('\n');
  for (const line of expectedLines) expect(lines).toContain(line);
  expect(result.stderr).not.toMatch(/\n\s+at /);
}

beforeAll(() => buildCliIfStale(), 240_000);

describe('limbus predict', () => {
  it('predict prints one limbus-prediction/1 document, exit 0, the one the geometry computes in-process', () => {
    const result = runCli(['predict', FIXTURE]);
    expect(result.code, result.stderr).toBe(0);
    expect(result.stderr).toBe('');
    const printed: unknown = JSON.parse(result.stdout);
    const check = validatePredictionDocument(printed);
    if (!check.ok) throw new Error(JSON.stringify(check.problems));
    // The command adds nothing and loses nothing: the same document as predictEvent on the same file.
    const validation = validatePredictionEventFile(fixture());
    if (!validation.ok) throw new Error(JSON.stringify(validation.problems));
    expect(printed).toEqual(
      JSON.parse(JSON.stringify(predictEvent(validation.event, validation.prediction))),
    );
    const doc = check.prediction;
    expect(doc.stations.map((s) => s.station)).toEqual([
      'cerro-alto',
      'salar-norte',
      'pampa-alta',
      'costa-sur',
      'isla-norte',
    ]);
    expect(doc.rings.map((r) => r.ring)).toEqual(['R1']);
    // The fixture's sites: three inside the body's path, one only inside the ring's, one outside both.
    expect(doc.stations.map((s) => s.disappearanceUtc !== null)).toEqual([true, true, true, false, false]);
    expect(doc.stations.map((s) => s.rings[0]!.window !== null)).toEqual([true, true, true, true, false]);
  });

  it('predict is listed by --help', () => {
    const result = runCli(['--help']);
    expect(result.code).toBe(0);
    expect(result.stdout).toMatch(/^ {2}predict {2}shadow path and each station's predicted times/m);
  });

  it('predict accepts an event with an empty chord list', () => {
    const result = predictWith((doc) => (doc.chords = []));
    expect(result.code, result.stderr).toBe(0);
  });

  it('predict refuses an event without the prediction section, naming it', () => {
    expectRefused(
      predictWith((doc) => delete (doc as Json).prediction),
      [
        'prediction: missing; predict needs the prediction section, at least { "bodyRadiusKm": … } (docs/file-formats.md)',
      ],
    );
  });

  it('predict refuses unknown keys in prediction, from ≥ to, and from outside the ephemeris, by path', () => {
    expectRefused(
      predictWith((doc) => {
        doc.prediction.bodyRadius = 410;
        doc.prediction.from = '2029-06-21T03:30:00Z';
        doc.prediction.to = '2029-06-21T03:10:00Z';
      }),
      [
        'prediction.bodyRadius: unknown field (check the spelling)',
        'prediction.to: to must come after from (2029-06-21T03:30:00Z)',
      ],
    );
    // Rows 02:21:09.184–04:21:09.184 TDB ≈ 02:20:00–04:20:00 UTC (TT − UTC = 69.184 s, TDB − TT < 2 ms).
    expectRefused(
      predictWith((doc) => (doc.prediction.from = '2029-06-21T02:18:00Z')),
      ['prediction.from: outside the ephemeris span 2029-06-21T02:21:09.184 – 04:21:09.184 TDB'],
    );
  });

  it('predict refuses a call without exactly one file, and a file that does not exist', () => {
    expectRefused(runCli(['predict']), [
      'arguments: expected one event file, got 0; usage: limbus predict EVENT.json',
    ]);
    expectRefused(runCli(['predict', FIXTURE, '--fast']), [
      'arguments: unknown option --fast; usage: limbus predict EVENT.json',
    ]);
    expectRefused(runCli(['predict', '/nonexistent/event.json']), ['/nonexistent/event.json: no such file']);
  });
});
