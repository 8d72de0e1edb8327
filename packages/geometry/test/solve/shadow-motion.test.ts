import { describe, expect, it } from 'vitest';
import { shadowMotionAt } from '../../src/shadow-motion.js';
import { GeometryInputError } from '../../src/types.js';
import { dot3, observerKm, scenario, STATIONS, type V3 } from './fixtures.js';

const CENTRAL = '2028-03-14T02:20:00.000Z';

describe('shadowMotionAt', () => {
  const sc = scenario(STATIONS, CENTRAL);

  // Reference computed without src/: station vectors from astronomy-engine (ObserverVector), the body on
  // its straight line, velocity by a central difference over ±1 s projected on the brief's e_f, e_g.
  const reference = (stationIndex: number, ms: number) => {
    const station = STATIONS[stationIndex]!;
    const rel = (at: number): V3 => {
      const o = observerKm(station, at, sc.event.earthRotation.dut1Seconds);
      const b = sc.body(at);
      return [o[0] - b[0], o[1] - b[1], o[2] - b[2]];
    };
    const a = rel(ms - 1000);
    const b = rel(ms + 1000);
    const v: V3 = [(b[0] - a[0]) / 2, (b[1] - a[1]) / 2, (b[2] - a[2]) / 2];
    return { f: dot3(v, sc.basis.eF), g: dot3(v, sc.basis.eG), distanceKm: Math.hypot(...sc.body(ms)) };
  };

  it('agrees with an independent velocity (astronomy-engine stations, ±1 s difference) within 1 m/s', () => {
    for (const [i, offsetMinutes] of [
      [0, 0],
      [1, -7],
      [2, 9],
    ] as const) {
      const ms = Date.parse(CENTRAL) + offsetMinutes * 60_000;
      const ours = shadowMotionAt(sc.event, STATIONS[i]!.id, new Date(ms).toISOString());
      const theirs = reference(i, ms);
      expect(Math.abs(ours.velocityKmPerS.f - theirs.f)).toBeLessThan(1e-3);
      expect(Math.abs(ours.velocityKmPerS.g - theirs.g)).toBeLessThan(1e-3);
      expect(ours.speedKmPerS).toBeCloseTo(Math.hypot(theirs.f, theirs.g), 3);
      // The ephemeris rows are geocentric distances sampled every 10 min; the spline reproduces a
      // straight line to well under a kilometre at ~41 au.
      expect(Math.abs(ours.distanceKm - theirs.distanceKm)).toBeLessThan(1);
    }
  });

  it('names the field a person must fix', () => {
    const problem = (station: string, time: string) => {
      try {
        shadowMotionAt(sc.event, station, time);
      } catch (error) {
        if (error instanceof GeometryInputError) return error.path;
      }
      return null;
    };
    expect(problem('nowhere', CENTRAL)).toBe('station');
    expect(problem(STATIONS[0]!.id, 'yesterday')).toBe('time');
    expect(problem(STATIONS[0]!.id, '2028-03-14T05:00:00Z')).toBe('time'); // outside the ephemeris span
  });
});
