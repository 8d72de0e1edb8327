import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

import { computeDynamicsContext } from '@limbus/geometry';

import { run } from '../src/commands/context.js';

// An invented body and its invented satellite and ring.
const scenario = {
  format: 'limbus-context-input/1',
  body: {
    massKg: 1.7e21,
    massKgSigma: 0.08e21,
    massKgSource: 'orbit of Tesk, invented',
    radiusKm: 600,
    radiusKmSigma: 15,
    spinPeriodHours: 7.5,
    spinPeriodHoursSigma: 0.05,
  },
  particleDensityKgM3: 900,
  particleDensityKgM3Sigma: 100,
  heliocentricDistanceAu: 41.3,
  satellites: [{ name: 'Tesk', periodDays: 9.4, periodDaysSigma: 0.02 }],
  rings: [{ ring: 'R1', radiusKm: 1900, radiusKmSigma: 6 }],
};

const dir = mkdtempSync(join(tmpdir(), 'limbus-context-'));
let fileCount = 0;
function writeInput(value: unknown): string {
  const path = join(dir, `input-${fileCount++}.json`);
  writeFileSync(path, typeof value === 'string' ? value : JSON.stringify(value));
  return path;
}

let stdout = '';
let stderr = '';
beforeEach(() => {
  stdout = '';
  stderr = '';
  vi.spyOn(process.stdout, 'write').mockImplementation((chunk: string | Uint8Array) => {
    stdout += String(chunk);
    return true;
  });
  vi.spyOn(process.stderr, 'write').mockImplementation((chunk: string | Uint8Array) => {
    stderr += String(chunk);
    return true;
  });
});
afterEach(() => {
  vi.restoreAllMocks();
});

async function expectBadInput(value: unknown, line: string): Promise<void> {
  const code = await run([writeInput(value)]);
  expect(code).toBe(2);
  expect(stdout).toBe('');
  expect(stderr.split('\n')).toContain(line);
}

describe('limbus context', () => {
  it('run() prints the limbus-context/1 figures with their 1-sigma', async () => {
    expect(await run([writeInput(scenario)])).toBe(0);
    expect(stderr).toBe('');
    const out = JSON.parse(stdout) as Record<string, unknown>;
    expect(out.format).toBe('limbus-context/1');
    const { format: _format, ...input } = scenario;
    const expected = computeDynamicsContext(input);
    expect(out.rocheFluidKm).toBe(expected.rocheFluidKm);
    expect(out.hillKm).toBe(expected.hillKm);
    expect(out.spinOrbit).toEqual(expected.spinOrbit);
    expect(out.meanMotion).toEqual(expected.meanMotion);
    expect(out.ringRadii).toEqual(expected.ringRadii);
    expect(out.uncertainty).toEqual(expected.uncertainty);
    expect(out.sources).toEqual({ 'body.massKg': 'orbit of Tesk, invented' });
    for (const key of [
      'rocheFluidKm',
      'rocheRigidKm',
      'synchronousKm',
      'hillKm',
      'spinOrbit',
      'meanMotion',
      'ringRadii',
    ]) {
      expect(Object.keys(out), key).toContain(key);
      expect(Object.keys(out.uncertainty as object), key).toContain(key);
    }
  });

  it('run() exits 2 naming a field that is out of range', async () => {
    await expectBadInput(
      { ...scenario, body: { ...scenario.body, massKg: -1 } },
      'body.massKg: must be greater than 0',
    );
    await expectBadInput(
      { ...scenario, particleDensityKgM3Sigma: -3 },
      'particleDensityKgM3Sigma: must be 0 or more',
    );
  });

  it('run() exits 2 when the mass is given twice or not at all', async () => {
    await expectBadInput(
      { ...scenario, body: { ...scenario.body, densityKgM3: 1800 } },
      'body: give only one of massKg, densityKgM3',
    );
    const { massKg: _m, massKgSigma: _s, massKgSource: _n, ...noMass } = scenario.body;
    await expectBadInput(
      { ...scenario, body: noMass },
      'body: give one of massKg, densityKgM3 or massFromSatellite',
    );
  });

  it('run() exits 2 naming a satellite without period or orbit, an unknown field and a missing field', async () => {
    await expectBadInput(
      { ...scenario, satellites: [{ name: 'Tesk' }] },
      'satellites[0]: give periodDays or semiMajorAxisKm',
    );
    await expectBadInput(
      { ...scenario, body: { ...scenario.body, radiusKM: 3 } },
      'body.radiusKM: unknown field (check the spelling)',
    );
    const { heliocentricDistanceAu: _h, ...noDistance } = scenario;
    await expectBadInput(noDistance, 'heliocentricDistanceAu: missing; a number is required');
  });

  it('run() exits 2 when the mass comes from a satellite that cannot give it', async () => {
    await expectBadInput(
      { ...scenario, body: { massFromSatellite: 'Tesk', radiusKm: 600, spinPeriodHours: 7.5 } },
      'satellites[0]: a satellite that gives the mass needs both periodDays and semiMajorAxisKm',
    );
  });

  it('run() exits 2 on a wrong format tag, a file that is not JSON and a missing file', async () => {
    await expectBadInput(
      { ...scenario, format: 'limbus-event/1' },
      'format: expected "limbus-context-input/1", got the text "limbus-event/1"',
    );
    const notJson = writeInput('{ "format": ');
    expect(await run([notJson])).toBe(2);
    expect(stdout).toBe('');
    expect(stderr).toMatch(/not JSON/);
    expect(await run([join(dir, 'absent.json')])).toBe(2);
    expect(await run([])).toBe(2);
  });
});
