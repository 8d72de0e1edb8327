import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

import { beforeAll, describe, expect, it } from 'vitest';

import { validateSolutionFile } from '@limbus/schema';

import { REPO_ROOT, buildCliIfStale, runCli, writeScratchFile } from './built-cli.js';

const EXAMPLE = join(REPO_ROOT, 'docs/examples/event-example.json');

type Json = Record<string, unknown>;
type EventJson = Json & { chords: Json[]; stations: Json[]; ringEvents: Json[] };

function example(): EventJson {
  return JSON.parse(readFileSync(EXAMPLE, 'utf8')) as EventJson;
}

function expectRefused(result: ReturnType<typeof runCli>, line: string): void {
  expect(result.code, result.stderr).toBe(2);
  expect(result.stdout).toBe('');
  expect(result.stderr.trimEnd().split('\n')).toContain(line);
  expect(result.stderr).not.toMatch(/\n\s+at /);
}

beforeAll(() => buildCliIfStale(), 240_000);

describe('limbus solve (geometry)', () => {
  it('solve prints a valid solution of the example event, hashing the file bytes', () => {
    const result = runCli(['solve', EXAMPLE]);
    expect(result.code, result.stderr).toBe(0);
    expect(result.stderr).toBe('');
    const validation = validateSolutionFile(JSON.parse(result.stdout));
    expect(validation.ok).toBe(true);
    if (!validation.ok) return;
    const { solution } = validation;
    expect(solution.engine.inputSha256).toBe(
      createHash('sha256').update(readFileSync(EXAMPLE)).digest('hex'),
    );
    // The example was generated (tools/examples/make-event-examples.ts) from this limb and ring; timings
    // rounded to 1 ms move points by ≲ 12 m, so the solution must return them within a few sigma.
    const limb = solution.limb;
    expect(limb).not.toBeNull();
    if (limb === null) return;
    expect(Math.abs(limb.centerFKm - 14)).toBeLessThan(3 * limb.uncertainty.centerFKm);
    expect(Math.abs(limb.centerGKm + 9)).toBeLessThan(3 * limb.uncertainty.centerGKm);
    expect(Math.abs(limb.equatorialRadiusKm - 415)).toBeLessThan(3 * limb.uncertainty.equatorialRadiusKm);
    expect(Math.abs(limb.oblateness - 0.12)).toBeLessThan(3 * limb.uncertainty.oblateness);
    expect(Math.abs(limb.positionAngleDeg - 35)).toBeLessThan(3 * limb.uncertainty.positionAngleDeg);
    expect(limb.negativeChordsClear).toBe(true);
    expect(solution.rings.map((r) => r.ring)).toEqual(['R1']);
  });

  it('solve takes a positive chord with one edge as one limb point (a camera started late)', () => {
    const doc = example();
    const index = doc.chords.findIndex((c) => c.type === 'positive');
    const { disappearance: _dropped, ...lateStart } = doc.chords[index] as Json;
    doc.chords[index] = lateStart;
    const result = runCli(['solve', writeScratchFile(doc)]);
    expect(result.code, result.stderr).toBe(0);
    const validation = validateSolutionFile(JSON.parse(result.stdout));
    if (!validation.ok) throw new Error('invalid solution');
    const { solution } = validation;
    expect(solution.chords[index]?.points.map((p) => p.event)).toEqual(['reappearance']);
    const full = example();
    const positives = full.chords.filter((c) => c.type === 'positive').length;
    expect(solution.limb?.radialResidualsKm).toHaveLength(2 * positives - 1);
    // One point fewer: dof = points − 5 free parameters.
    expect(solution.limb?.dof).toBe(2 * positives - 1 - 5);
  });

  it('solve refuses a timing outside the ephemeris span', () => {
    const doc = example();
    doc.chords[0] = {
      ...doc.chords[0],
      disappearance: { time: '2028-03-14T01:20:00Z', sigmaSeconds: 0.04 },
      reappearance: { time: '2028-03-14T01:20:30Z', sigmaSeconds: 0.04 },
    };
    const result = runCli(['solve', writeScratchFile(doc)]);
    expect(result.code, result.stderr).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toMatch(/^chords\[0\]\.disappearance\.time: outside the ephemeris span/);
  });

  it('solve refuses fewer points than free parameters', () => {
    const doc = example();
    doc.chords = doc.chords.slice(0, 2);
    expectRefused(
      runCli(['solve', writeScratchFile(doc)]),
      'chords: fewer points (4) than free parameters (5)',
    );
  });

  it('solve refuses chords that all lie on one line', () => {
    const doc = example();
    const first = doc.chords[0] as Json & { disappearance: { time: string; sigmaSeconds: number } };
    doc.stations.push({ ...doc.stations[0], id: 'twin' });
    // A second station at the same place: its chords run along the first one's line.
    doc.chords = [
      first,
      { ...first, station: 'twin' },
      {
        ...first,
        station: 'twin',
        disappearance: { ...first.disappearance, time: '2028-03-14T02:14:02.9Z' },
      },
    ];
    doc.ringEvents = [];
    expectRefused(
      runCli(['solve', writeScratchFile(doc)]),
      'chords: all timed points lie on one straight line, so the ellipse is not constrained across it',
    );
  });
});
