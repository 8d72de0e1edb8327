import { readFileSync } from 'node:fs';
import { solveEvent } from '@limbus/geometry';
import { validateEventFile } from '@limbus/schema';
import { describe, expect, it } from 'vitest';
import { DEMO_EVENT_PATH, DEMO_OBSERVERS } from './demo-scenario';

// The truth is the limb and ring tools/demo/make-demo-event.ts built the file from (a = 380 km,
// ε = 0.08, position angle 118°, ring radius 1100 km); the timings carry seeded noise of their own σ,
// so the fit must land within a few of its own σ of that truth, not on it.
describe('the demo event file', () => {
  const validation = validateEventFile(JSON.parse(readFileSync(DEMO_EVENT_PATH, 'utf8')));

  it('validateEventFile() accepts quillon-event.json and every station has an invented observer', () => {
    if (!validation.ok) throw new Error(JSON.stringify(validation.problems));
    expect(validation.event.stations.map((s) => s.id).sort()).toEqual(
      DEMO_OBSERVERS.map((o) => o.station).sort(),
    );
    expect(validation.event.chords.filter((c) => c.type === 'negative')).toHaveLength(2);
    const ringSides = new Map<string, number>();
    for (const r of validation.event.ringEvents)
      ringSides.set(r.station, (ringSides.get(r.station) ?? 0) + 1);
    expect([...ringSides.values()].every((n) => n === 2)).toBe(true);
  });

  it('solveEvent() on quillon-event.json recovers the limb and ring it was built from', () => {
    if (!validation.ok) throw new Error('invalid');
    const solution = solveEvent(validation.event, { inputSha256: 'x' });
    const limb = solution.limb;
    if (!limb) throw new Error('no limb');
    expect(Math.abs(limb.equatorialRadiusKm - 380)).toBeLessThan(4 * limb.uncertainty.equatorialRadiusKm);
    expect(Math.abs(limb.oblateness - 0.08)).toBeLessThan(4 * limb.uncertainty.oblateness);
    expect(Math.abs(limb.positionAngleDeg - 118)).toBeLessThan(4 * limb.uncertainty.positionAngleDeg);
    expect(limb.negativeChordsClear).toBe(true);
    const ring = solution.rings[0];
    expect(ring?.ring).toBe('R1');
    expect(Math.abs((ring?.radiusKm ?? 0) - 1100)).toBeLessThan(4 * (ring?.uncertainty.radiusKm ?? 0));
  });
});
