import { beforeAll, describe, expect, it } from 'vitest';

import { validEventJson } from '../../../packages/schema/test/event-fixture.js';
import { buildCliIfStale, runCli, writeScratchFile } from './built-cli.js';

type Json = Record<string, unknown>;

// The same small valid event the schema's own tests break one way at a time.
const baseEvent = (): Json => validEventJson();

function solveWith(change: (doc: Json & { chords: Json[]; stations: Json[] }) => void) {
  const doc = baseEvent() as Json & { chords: Json[]; stations: Json[] };
  change(doc);
  return runCli(['solve', writeScratchFile(doc)]);
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

describe('limbus solve (bad input)', () => {
  it('solve refuses a file that does not exist, naming it', () => {
    expectRefused(runCli(['solve', '/nonexistent/event.json']), ['/nonexistent/event.json: no such file']);
  });

  it('solve refuses a call without exactly one file', () => {
    const result = runCli(['solve']);
    expectRefused(result, ['arguments: expected one event file, got 0; usage: limbus solve EVENT.json']);
  });

  it('solve refuses text that is not JSON, with line and column', () => {
    const path = writeScratchFile('{\n  "format": "limbus-event/1",\n  "title" "x"\n}\n', 'broken.json');
    expectRefused(runCli(['solve', path]), [`${path}: not JSON at line 3, column 11: Unexpected string`]);
  });

  it('solve refuses missing and wrong-typed fields, naming each path', () => {
    const result = solveWith((doc) => {
      delete doc.title;
      doc.stations[0] = { ...doc.stations[0], heightM: '820 m' };
    });
    expectRefused(result, [
      'title: missing; a text string is required',
      'stations[0].heightM: expected a number, got the text "820 m"',
    ]);
  });

  it('solve refuses latitude outside ±90 and longitude outside ±180', () => {
    const result = solveWith((doc) => {
      doc.stations[0] = { ...doc.stations[0], latDeg: -91 };
      doc.stations[1] = { ...doc.stations[1], lonDeg: 200 };
    });
    expectRefused(result, [
      'stations[0].latDeg: latitude must be within ±90°',
      'stations[1].lonDeg: longitude must be within ±180° (east positive)',
    ]);
  });

  it('solve refuses a reappearance before the disappearance', () => {
    const result = solveWith((doc) => {
      doc.chords[0] = {
        ...doc.chords[0],
        reappearance: { time: '2028-03-14T02:13:41.870Z', sigmaSeconds: 0.05 },
      };
    });
    expectRefused(result, [
      'chords[0].reappearance.time: reappearance must come after disappearance (2028-03-14T02:14:03.210Z)',
    ]);
  });

  it('solve refuses a positive chord with neither edge, naming the chord', () => {
    const result = solveWith((doc) => {
      const { disappearance: _d, reappearance: _r, ...rest } = doc.chords[0] as Json;
      doc.chords[0] = rest;
    });
    expectRefused(result, ['chords[0]: a positive chord needs a disappearance, a reappearance or both']);
  });

  it('solve refuses a chord naming an unknown station', () => {
    const result = solveWith((doc) => (doc.chords[1] = { ...doc.chords[1], station: 'hilltop' }));
    expectRefused(result, [
      'chords[1].station: unknown station "hilltop"; stations are "north-ridge", "salt-flat"',
    ]);
  });

  it('solve refuses zero and negative sigma', () => {
    const result = solveWith((doc) => {
      doc.chords[0] = {
        ...doc.chords[0],
        disappearance: { time: '2028-03-14T02:14:03.210Z', sigmaSeconds: 0 },
        reappearance: { time: '2028-03-14T02:14:41.870Z', sigmaSeconds: -0.02 },
      };
    });
    const message = 'sigmaSeconds must be greater than zero (a 1-σ timing uncertainty)';
    expectRefused(result, [
      `chords[0].disappearance.sigmaSeconds: ${message}`,
      `chords[0].reappearance.sigmaSeconds: ${message}`,
    ]);
  });

  it('solve refuses an empty chord list', () => {
    expectRefused(
      solveWith((doc) => (doc.chords = [])),
      ['chords: at least one chord is needed'],
    );
  });

  it('solve refuses a malformed time', () => {
    const result = solveWith((doc) => (doc.chords[1] = { ...doc.chords[1], start: '2028-03-14T02:10Z' }));
    expectRefused(result, [
      'chords[1].start: not an ISO 8601 UTC time (expected e.g. "2028-03-14T02:11:04.25Z", ending in Z)',
    ]);
  });

  it('solve refuses a wrong format tag', () => {
    const result = solveWith((doc) => (doc.format = 'limbus-solution/1'));
    expectRefused(result, ['format: expected "limbus-event/1", got the text "limbus-solution/1"']);
  });

  it('solve reports every problem of a file at once', () => {
    const result = solveWith((doc) => {
      doc.format = 'x';
      doc.stations[0] = { ...doc.stations[0], latDeg: 100 };
      doc.chords[1] = { ...doc.chords[1], station: 'hilltop' };
    });
    expect(
      result.stderr
        .trimEnd()
        .split('\n')
        .map((l) => l.split(':')[0]),
    ).toEqual(['format', 'stations[0].latDeg', 'chords[1].station']);
    expect(result.code).toBe(2);
  });
});
