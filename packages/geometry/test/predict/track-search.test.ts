import { describe, expect, it } from 'vitest';
import { safeNewton } from '../../src/predict/root.js';
import { closestApproach, levelCrossing, type Track } from '../../src/predict/track-search.js';
import { expectClose } from '../expect-close.js';

/** A straight track (f, g) = (3, 2t) km: |(f, g)| = 3 at t = 0 and 5 at t = ±2 (3-4-5 triangle). */
const straight: Track = (t) => ({ fKm: 3, gKm: 2 * t, vfKmPerS: 0, vgKmPerS: 2 });

describe('track search', () => {
  it('safeNewton() finds √2 and a root where Newton alone would overshoot the bracket', () => {
    expectClose(
      safeNewton((x) => [x * x - 2, 2 * x], 0, 2, 1e-12),
      Math.SQRT2,
      1e-12,
    );
    // atan(x − 1): Newton from far away diverges (the classic example); the bracket keeps it at 1.
    expectClose(
      safeNewton((x) => [Math.atan(x - 1), 1 / (1 + (x - 1) ** 2)], -20, 30, 1e-12),
      1,
      1e-12,
    );
  });

  it('closestApproach() finds the foot of the perpendicular of a straight track', () => {
    const m = closestApproach(straight, -100, 250);
    expectClose(m.ttSeconds, 0, 1e-6);
    expectClose(m.distanceKm, 3, 1e-12);
  });

  it('closestApproach() keeps a window end when the track only recedes inside the window', () => {
    const m = closestApproach(straight, 10, 400);
    expect(m.ttSeconds).toBe(10);
    expectClose(m.distanceKm, Math.hypot(3, 20), 1e-12);
  });

  it('closestApproach() picks the lower of two local minima', () => {
    // f(t) = 10 sin(2πt/600) + 12 + 0.001t: minima near t = 450 (f ≈ 2.45) and 1050 (f ≈ 3.05). The first
    // is where f' = (20π/600) cos θ + 0.001 = 0 near θ = 3π/2: θ = 3π/2 − asin(0.001·600/(20π)).
    const w = (2 * Math.PI) / 600;
    const track: Track = (t) => ({
      fKm: 10 * Math.sin(w * t) + 12 + 0.001 * t,
      gKm: 0,
      vfKmPerS: 10 * w * Math.cos(w * t) + 0.001,
      vgKmPerS: 0,
    });
    const m = closestApproach(track, 0, 1200);
    const theta = (3 * Math.PI) / 2 - Math.asin((0.001 * 600) / (20 * Math.PI));
    expectClose(m.ttSeconds, theta / w, 1e-5);
  });

  it('levelCrossing() gives the two times a straight track reaches a radius, and null beyond the bound', () => {
    expectClose(levelCrossing(straight, 0, 5, 1, 1000)!, 2, 1e-6);
    expectClose(levelCrossing(straight, 0, 5, -1, -1000)!, -2, 1e-6);
    // Radius 500 is reached at t = √(500² − 9)/2 ≈ 249.99 s: not before a bound at 200 s.
    expect(levelCrossing(straight, 0, 500, 1, 200)).toBeNull();
    expectClose(levelCrossing(straight, 0, 500, 1, 300)!, Math.sqrt(500 * 500 - 9) / 2, 1e-6);
  });

  it('levelCrossing() finds the crossing of a bent track far from the straight-line guess', () => {
    // g = 2t + t²/2 (an accelerating track, f = 3): |(f, g)| = 50 where g = √2491, i.e. t² + 4t − 2√2491 = 0,
    // t = −2 ± √(4 + 2√2491): 8.19 s and −12.19 s, against the straight guess √2491/2 ≈ 25 s.
    const bent: Track = (t) => ({ fKm: 3, gKm: 2 * t + (t * t) / 2, vfKmPerS: 0, vgKmPerS: 2 + t });
    const root = Math.sqrt(4 + 2 * Math.sqrt(2491));
    expectClose(levelCrossing(bent, 0, 50, 1, 1000)!, -2 + root, 1e-6);
    expectClose(levelCrossing(bent, 0, 50, -1, -1000)!, -2 - root, 1e-6);
  });
});
