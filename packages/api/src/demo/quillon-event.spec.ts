import { readFileSync } from 'node:fs';
import { briefStations, predictEvent, solveEvent } from '@limbus/geometry';
import { validateEventFile } from '@limbus/schema';
import { describe, expect, it } from 'vitest';
import { DEMO_EVENT_PATH, DEMO_OBSERVERS, DEMO_PLANNED_SITES } from './demo-scenario';

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

// The prediction section is invented too, but it must agree with the file's own ephemeris: the chords
// the generator built from its truth (the body where the ephemeris says, a = 380 km, ε = 0.08, ring 1100 km)
// must fall where the prediction puts them, within its stated σ.
describe("the demo event's prediction", () => {
  const validation = validateEventFile(JSON.parse(readFileSync(DEMO_EVENT_PATH, 'utf8')));

  it('predictEvent() on quillon-event.json puts every positive chord inside the path, each disappearance within 3σ', () => {
    if (!validation.ok || !validation.prediction) throw new Error('the demo file has a prediction section');
    const settings = validation.prediction;
    const prediction = predictEvent(validation.event, settings);
    const briefs = briefStations(validation.event, settings, prediction);
    for (const chord of validation.event.chords) {
      const predicted = prediction.stations.find((s) => s.station === chord.station);
      const brief = briefs.find((b) => b.station === chord.station);
      if (!predicted || !brief) throw new Error(`no prediction for ${chord.station}`);
      if (chord.type === 'negative') {
        // The two negatives were placed beyond the 380 km limb and inside the ring (the generator's design).
        expect(predicted.disappearanceUtc).toBeNull();
        continue;
      }
      expect(predicted.disappearanceUtc).not.toBeNull();
      const observed = Date.parse(chord.disappearance?.time ?? '') / 1000;
      const expected = Date.parse(predicted.disappearanceUtc ?? '') / 1000;
      expect(Math.abs(observed - expected)).toBeLessThan(3 * (brief.disappearanceSigmaSeconds ?? 0));
    }
  });

  it("the planned sites fill the body's widest gaps and the proposed one lies in the ring only", () => {
    if (!validation.ok || !validation.prediction) throw new Error('the demo file has a prediction section');
    const stations = [
      ...validation.event.stations,
      ...DEMO_PLANNED_SITES.map((s) => ({
        id: s.code,
        latDeg: s.latDeg,
        lonDeg: s.lonDeg,
        heightM: s.heightM,
      })),
    ];
    const prediction = predictEvent({ ...validation.event, stations }, validation.prediction);
    const outlook = (code: string) => prediction.stations.find((s) => s.station === code);
    // Inside the 365 km body, beyond the outermost chord on each side (tarrow-knoll at −302 km, saltmarsh-point
    // at +257 km of this prediction).
    expect(outlook('corrie-gap')?.crossTrackKm).toBeLessThan(-302);
    expect(outlook('corrie-gap')?.disappearanceUtc).not.toBeNull();
    expect(outlook('fenwick-shoal')?.crossTrackKm).toBeGreaterThan(257);
    expect(outlook('fenwick-shoal')?.disappearanceUtc).not.toBeNull();
    expect(outlook('darrow-lookout')?.disappearanceUtc).toBeNull();
    expect(outlook('darrow-lookout')?.rings[0]?.window).not.toBeNull();
  });
});
