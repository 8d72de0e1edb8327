import { readFileSync } from 'node:fs';
import { join } from 'node:path';

import { beforeAll, describe, expect, it } from 'vitest';

import { REPO_ROOT, buildCliIfStale, runCli, writeScratchFile } from './built-cli.js';

// Three invented events of the body Tessivane (tools/examples/make-event-examples.ts), all made from one
// ring of radius 1080 km about the pole RA 41°, Dec +27°, seen from star directions 16° apart; the 2036
// event has no positive chord, so its ring centre is free.
const EVENT_2028 = join(REPO_ROOT, 'docs/examples/event-example.json');
const EVENT_2031 = join(REPO_ROOT, 'tools/cli/test/fixtures/joint-2031.json');
const EVENT_2036 = join(REPO_ROOT, 'tools/cli/test/fixtures/joint-2036.json');

interface JointDocument {
  format: string;
  ring: string;
  pole: { raDeg: number; decDeg: number };
  uncertainty: { raDeg: number; decDeg: number; correlation: number };
  radiusKm: number;
  radiusSigmaKm: number;
  chi2: number;
  dof: number;
  reducedChi2: number | null;
  sigmaScale: number;
  familyDeltaChi2: number;
  notes: string[];
  events: Array<{ title: string; openingAngleDeg: number; positionAngleDeg: number }>;
  ambiguityResolved: boolean;
  alternativePole: { raDeg: number; decDeg: number; chi2: number };
}

function runJoint(args: string[]): JointDocument {
  const result = runCli(['joint', ...args]);
  expect(result.code, result.stderr).toBe(0);
  return JSON.parse(result.stdout) as JointDocument;
}

beforeAll(() => buildCliIfStale(), 240_000);

describe('limbus joint', () => {
  it('joint recovers the generating pole and radius from three events and resolves the ambiguity', () => {
    const doc = runJoint([EVENT_2028, EVENT_2031, EVENT_2036]);
    expect(doc.format).toBe('limbus-joint/1');
    expect(doc.ring).toBe('R1');
    expect(Math.abs(doc.pole.raDeg - 41)).toBeLessThan(3 * doc.uncertainty.raDeg);
    expect(Math.abs(doc.pole.decDeg - 27)).toBeLessThan(3 * doc.uncertainty.decDeg);
    expect(Math.abs(doc.radiusKm - 1080)).toBeLessThan(3 * doc.radiusSigmaKm);
    // 40 dip mid-times; pole (2) + radius (1) + the 2036 event's free centre (2).
    expect(doc.dof).toBe(40 - 5);
    expect(doc.events.map((e) => e.title.slice(0, 36))).toEqual([
      'Tessivane occults star LX-7721, 2028',
      'Tessivane occults star LX-9034, 2031',
      'Tessivane occults star LX-11802, 203',
    ]);
    expect(doc.events[0]?.positionAngleDeg).toBeGreaterThanOrEqual(0);
    expect(doc.events[0]?.positionAngleDeg).toBeLessThan(180);
    expect(doc.ambiguityResolved).toBe(true);
    expect(doc.alternativePole.chi2 - doc.chi2).toBeGreaterThan(9);
    // χ²/dof as printed, the scale applied above 1 (√(χ²/dof); Bevington & Robinson, 3rd ed., §8.1), the
    // signed family difference and the sentences that say both.
    expect(doc.reducedChi2).toBe(doc.chi2 / doc.dof);
    expect(doc.sigmaScale).toBe(Math.max(1, Math.sqrt(doc.chi2 / doc.dof)));
    expect(doc.familyDeltaChi2).toBe(doc.alternativePole.chi2 - doc.chi2);
    expect(doc.notes).toHaveLength(2);
    expect(doc.notes[1]).toMatch(/differs by \+\d+(\.\d)?, more than 9: it is ruled out/);
    expect(Math.abs(doc.uncertainty.correlation)).toBeLessThanOrEqual(1);
  });

  it('joint of the single-event solve agrees with that event’s own ring fit', () => {
    const joint = runJoint([EVENT_2028]);
    const solve = runCli(['solve', EVENT_2028]);
    const ring = (
      JSON.parse(solve.stdout) as {
        rings: Array<{ radiusKm: number; openingAngleDeg: number; positionAngleDeg: number }>;
      }
    ).rings[0];
    expect(ring).toBeDefined();
    if (!ring) return;
    expect(Math.abs(joint.radiusKm - ring.radiusKm)).toBeLessThan(0.01);
    expect(
      Math.abs(Math.abs(joint.events[0]?.openingAngleDeg ?? NaN) - Math.abs(ring.openingAngleDeg)),
    ).toBeLessThan(0.01);
  });

  it('joint of one event leaves both poles standing', () => {
    const doc = runJoint([EVENT_2028]);
    expect(doc.ambiguityResolved).toBe(false);
    expect(Math.abs(doc.alternativePole.chi2 - doc.chi2)).toBeLessThan(9);
    const poles = [doc.pole, doc.alternativePole];
    expect(poles.some((p) => Math.abs(p.raDeg - 41) < 0.1 && Math.abs(p.decDeg - 27) < 0.1)).toBe(true);
  });

  it('joint refuses an event without dips of the ring, naming the file', () => {
    const doc = JSON.parse(readFileSync(EVENT_2031, 'utf8')) as { ringEvents?: unknown[] };
    delete doc.ringEvents;
    const path = writeScratchFile(doc, 'no-rings.json');
    const result = runCli(['joint', EVENT_2028, path]);
    expect(result.code, result.stderr).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toBe(`${path}: no dips of ring "R1" in this event (it has no ring events)\n`);
  });

  it('joint refuses a ring label that the first event does not have', () => {
    const result = runCli(['joint', '--ring', 'R9', EVENT_2028, EVENT_2031]);
    expect(result.code).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr.trimEnd().split('\n')).toEqual([
      `${EVENT_2028}: no dips of ring "R9" in this event (its rings: "R1")`,
      `${EVENT_2031}: no dips of ring "R9" in this event (its rings: "R1")`,
    ]);
  });

  it('joint names the file and the JSON path of a schema problem', () => {
    const doc = JSON.parse(readFileSync(EVENT_2031, 'utf8')) as { stations: Array<Record<string, unknown>> };
    doc.stations[0] = { ...doc.stations[0], latDeg: 123 };
    const path = writeScratchFile(doc, 'bad-latitude.json');
    const result = runCli(['joint', EVENT_2028, path]);
    expect(result.code).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toBe(`${path}: stations[0].latDeg: latitude must be within ±90°\n`);
  });

  it('joint without files prints its usage as a problem', () => {
    const result = runCli(['joint']);
    expect(result.code).toBe(2);
    expect(result.stderr).toBe(
      'arguments: expected at least one event file; usage: limbus joint [--ring LABEL] EVENT1.json EVENT2.json …\n',
    );
  });
});
