import { describe, expect, it } from 'vitest';
import { subMatrix } from '../../src/fit/covariance.js';
import { solveEvent } from '../../src/solve.js';
import type { EventInput, RingCenterFrom } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { CENTRAL, HASH, RING, TRUE_CENTER, limbEvent, ringDips } from './events.js';
import { LIMB_STATIONS, scenario } from './fixtures.js';

/** The limb event of events.ts with a ring concentric with it, solved with the given ring centre source. */
function solved(centerFrom: RingCenterFrom, change: (e: EventInput) => EventInput = (e) => e) {
  const { event } = limbEvent();
  const ringEvents = ringDips(scenario(LIMB_STATIONS, CENTRAL), {
    ...RING,
    fKm: TRUE_CENTER.fKm,
    gKm: TRUE_CENTER.gKm,
  });
  return solveEvent(change({ ...event, ringEvents, fit: { ...event.fit, ring: { centerFrom } } }), {
    inputSha256: HASH,
  });
}

describe('solveEvent() ring centres', () => {
  it('solveEvent() with centerFrom "joint" reports one shared centre and the contract χ² and dof', () => {
    const s = solved('joint');
    const limb = s.limb!;
    const ring = s.rings[0]!;
    expect(ring.centerFrom).toBe('joint');
    expect(limb.sigmaMethod).toBe('linearised');
    expect(ring.centerFKm).toBe(limb.centerFKm);
    expect(ring.centerGKm).toBe(limb.centerGKm);
    expect(ring.uncertainty.centerFKm).toBe(limb.uncertainty.centerFKm);
    expect(ring.uncertainty.centerGKm).toBe(limb.uncertainty.centerGKm);
    // 7 positive chords → 14 limb points, 5 free limb parameters; 5 stations × 2 dips, 3 ring parameters.
    expect(limb.dof).toBe(14 - 5);
    expect(ring.dof).toBe(10 - 3);
    expectClose(limb.centerFKm, TRUE_CENTER.fKm, 0.02);
    expectClose(ring.radiusKm, RING.radiusKm, 0.5);
    // Astrometry carries the joint centre's 1-sigma.
    expect(s.astrometry!.uncertainty.raOffsetCosDecMas).toBeGreaterThan(0);
    // The ring's covariance shares its centre block with the limb's.
    expect(subMatrix(ring.covariance!.matrix, [0, 1])).toEqual(subMatrix(limb.covariance!.matrix, [0, 1]));
    for (const pole of ring.poles) expect(pole.uncertainty!.raDeg).toBeGreaterThan(0);
  });

  it('solveEvent() with centerFrom "limb" gives each ring the limb centre and its 1-sigma', () => {
    const s = solved('limb');
    const ring = s.rings[0]!;
    expect(ring.centerFrom).toBe('limb');
    expect(s.limb!.sigmaMethod).toBe('sampled');
    expect(ring.uncertainty.centerFKm).toBe(s.limb!.uncertainty.centerFKm);
    expect(ring.uncertainty.centerGKm).toBe(s.limb!.uncertainty.centerGKm);
    // The ring's (R, B, P) were fitted with the centre held, so no covariance with it is claimed.
    expect(ring.covariance!.matrix[0]!.slice(2)).toEqual([0, 0, 0]);
    expect(subMatrix(ring.covariance!.matrix, [0, 1])).toEqual(subMatrix(s.limb!.covariance!.matrix, [0, 1]));
  });

  it('solveEvent() with centerFrom "free" reports the ring centre fitted 1-sigma', () => {
    const ring = solved('free').rings[0]!;
    expect(ring.centerFrom).toBe('free');
    const cov = ring.covariance!.matrix;
    expectClose(ring.uncertainty.centerFKm!, Math.sqrt(cov[0]![0]!), 1e-12);
    expect(ring.uncertainty.centerFKm).toBeGreaterThan(0);
  });

  it('solveEvent() with centerFrom "joint" and no positive chord acts as "free"', () => {
    const onlyRing = (e: EventInput): EventInput => ({
      ...e,
      chords: e.chords.filter((c) => c.type === 'negative'),
    });
    const joint = solved('joint', onlyRing);
    const free = solved('free', onlyRing);
    expect(joint.limb).toBeNull();
    expect(joint.rings[0]!.centerFrom).toBe('free');
    expect(joint).toEqual(free);
  });
});
