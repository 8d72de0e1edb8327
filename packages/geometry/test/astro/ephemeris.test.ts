import { describe, expect, it } from 'vitest';
import { buildEphemeris, requireWithinSpan } from '../../src/astro/ephemeris.js';
import { cubicSpline, evaluateSpline } from '../../src/astro/spline.js';
import { toRaDec } from '../../src/astro/vec3.js';
import { RAD } from '../../src/math.js';
import type { EphemerisRow } from '../../src/types.js';
import { expectClose } from '../expect-close.js';

describe('cubic spline', () => {
  it('cubicSpline() reproduces a cubic exactly on uneven knots (not-a-knot property, de Boor ch. IV)', () => {
    const x = [0, 0.7, 2.1, 2.5, 4.0, 6.2];
    const f = (t: number): number => 2 - 3 * t + 0.5 * t * t - 0.25 * t * t * t;
    const df = (t: number): number => -3 + t - 0.75 * t * t;
    const s = cubicSpline(x, x.map(f));
    for (const t of [0, 0.3, 1.9, 3.3, 5.5, 6.2]) {
      expectClose(evaluateSpline(s, t).value, f(t), 1e-12);
      expectClose(evaluateSpline(s, t).derivative, df(t), 1e-12);
    }
  });

  it('cubicSpline() follows sin within 3e-3 at 10 knots per period and converges at least as h⁴', () => {
    // Cubic-spline interpolation error is O(h⁴) for smooth data, the not-a-knot ends included (de Boor,
    // A Practical Guide to Splines, ch. IV–V): halving h must cut the error by at least ~16 (measured: 30,
    // the end intervals converging faster here).
    const worstError = (knotsPerPeriod: number): number => {
      const h = (2 * Math.PI) / knotsPerPeriod;
      const x = Array.from({ length: 2 * knotsPerPeriod + 1 }, (_, i) => i * h);
      const s = cubicSpline(x, x.map(Math.sin));
      let worst = 0;
      for (let t = 0; t <= 4 * Math.PI; t += 0.005)
        worst = Math.max(worst, Math.abs(evaluateSpline(s, t).value - Math.sin(t)));
      return worst;
    };
    const coarse = worstError(10);
    const fine = worstError(20);
    expect(coarse).toBeLessThan(3e-3);
    expect(coarse / fine).toBeGreaterThan(12);
  });

  it('cubicSpline() rejects fewer than 4 knots', () => {
    expect(() => cubicSpline([0, 1, 2], [0, 1, 2])).toThrow(RangeError);
  });
});

/** A body on a straight line in space (any cubic is reproduced exactly), written out as RA/Dec/distance rows. */
function linearRows(): { rows: EphemerisRow[]; position: (seconds: number) => [number, number, number] } {
  const p0: [number, number, number] = [-5.1e9, -2.3e9, -1.4e9];
  const v: [number, number, number] = [12.5, -21.0, 4.2];
  const position = (seconds: number): [number, number, number] => [
    p0[0] + v[0] * seconds,
    p0[1] + v[1] * seconds,
    p0[2] + v[2] * seconds,
  ];
  const rows = [0, 600, 1200, 1800, 2400].map((seconds) => {
    const r = position(seconds);
    const { raRad, decRad } = toRaDec(r);
    const minutes = String(seconds / 60).padStart(2, '0');
    return {
      time: `2028-03-14T02:${minutes}:00`,
      raDeg: raRad * RAD,
      decDeg: decRad * RAD,
      distanceKm: Math.hypot(...r),
    };
  });
  return { rows, position };
}

describe('ephemeris', () => {
  it('buildEphemeris() returns the rows’ straight-line motion to 1 m and its velocity to 1 mm/s', () => {
    const { rows, position } = linearRows();
    const e = buildEphemeris(rows, 'TT');
    for (const seconds of [0, 311.5, 1500, 2400]) {
      const { positionKm, velocityKmPerS } = e.stateAt(e.startTtSeconds + seconds);
      const expected = position(seconds);
      for (let i = 0; i < 3; i++) expectClose(positionKm[i]!, expected[i]!, 1e-3);
      expectClose(velocityKmPerS[0], 12.5, 1e-6);
      expectClose(velocityKmPerS[1], -21.0, 1e-6);
      expectClose(velocityKmPerS[2], 4.2, 1e-6);
    }
  });

  it('buildEphemeris() velocity matches the finite difference of its positions on curved motion', () => {
    const rows = [0, 1, 2, 3, 4, 5].map((i) => ({
      time: `2028-03-14T0${i}:00:00`,
      raDeg: 150 + 0.01 * i + 0.002 * i * i,
      decDeg: 10 - 0.003 * i * i,
      distanceKm: 6e9 + 1e5 * i,
    }));
    const e = buildEphemeris(rows, 'UTC');
    const t = e.startTtSeconds + 9000;
    const dt = 1;
    const ahead = e.stateAt(t + dt).positionKm;
    const behind = e.stateAt(t - dt).positionKm;
    const v = e.stateAt(t).velocityKmPerS;
    // Central-difference error ≈ |x'''| dt²/6, tiny for a spline whose knots are an hour apart.
    for (let i = 0; i < 3; i++) expectClose(v[i]!, (ahead[i]! - behind[i]!) / (2 * dt), 1e-5);
  });

  it('buildEphemeris() rejects fewer than 4 rows with the brief’s message', () => {
    expect(() => buildEphemeris(linearRows().rows.slice(0, 3), 'TT')).toThrow(
      'ephemeris.rows: at least 4 rows are needed, got 3',
    );
  });

  it('buildEphemeris() rejects rows out of time order, naming the row', () => {
    const rows = linearRows().rows;
    const swapped = [rows[0]!, rows[2]!, rows[1]!, rows[3]!];
    expect(() => buildEphemeris(swapped, 'TT')).toThrow(
      'ephemeris.rows[2].time: rows must be in strictly increasing time order',
    );
  });

  it('requireWithinSpan() names the path and the span in the brief’s format', () => {
    const { rows } = linearRows();
    const e = buildEphemeris(rows.slice(0, 5), 'TT');
    expect(() => requireWithinSpan(e, e.endTtSeconds + 1, 'chords[2].reappearance.time')).toThrow(
      'chords[2].reappearance.time: outside the ephemeris span 2028-03-14T02:00:00 – 02:40:00 TT',
    );
    expect(() => requireWithinSpan(e, e.endTtSeconds, 'x')).not.toThrow();
  });
});
