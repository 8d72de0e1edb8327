import { describe, expect, it } from 'vitest';

import { limbCrossing, predictedLimb } from '../../src/lightcurve/edge-speed.js';
import type { LimbEllipse } from '../../src/types.js';
import { expectClose } from '../expect-close.js';

describe('limbCrossing()', () => {
  it('limbCrossing() on a round limb gives v·√(1 − (b/R)²) at both edges (0.436 v at 0.9 R)', () => {
    // Plane geometry: a chord at impact b meets the circle where the radius makes the angle asin(b/R) with
    // the track, so the normal component of v is v·cos(asin(b/R)); the crossings are ±√(R² − b²)/v from
    // the foot of the perpendicular (common practice, no source).
    const circle: LimbEllipse = {
      centerFKm: 10,
      centerGKm: -20,
      equatorialRadiusKm: 300,
      oblateness: 0,
      positionAngleDeg: 0,
    };
    const v = { f: 18, g: -7 };
    const speed = Math.hypot(v.f, v.g);
    const b = 0.9 * 300;
    // Foot of the perpendicular at impact b to the left of v.
    const foot = { fKm: 10 - (v.g / speed) * b, gKm: -20 + (v.f / speed) * b };
    const c = limbCrossing(circle, foot, v);
    if (c === null) throw new Error('the chord crosses');
    expectClose(c.disappearanceKmPerS, speed * Math.sqrt(1 - 0.81), 1e-9);
    expectClose(c.reappearanceKmPerS, speed * Math.sqrt(1 - 0.81), 1e-9);
    expectClose(c.disappearanceKmPerS / speed, 0.4359, 1e-4);
    const half = Math.sqrt(300 ** 2 - b ** 2) / speed;
    expectClose(c.disappearanceSeconds, -half, 1e-9);
    expectClose(c.reappearanceSeconds, half, 1e-9);
  });

  it('limbCrossing() on an ellipse agrees with a bisection and the parametric tangent', () => {
    // Independent route: the crossing by bisection on the ellipse's implicit equation along the track, and
    // the normal speed from the tangent of the parametric form c + a·cos θ·e_major + b·sin θ·e_minor:
    // |v × t|/|t| (common practice, no source).
    const e: LimbEllipse = {
      centerFKm: -5,
      centerGKm: 12,
      equatorialRadiusKm: 400,
      oblateness: 0.3,
      positionAngleDeg: 37,
    };
    const p = (37 * Math.PI) / 180;
    const major = [Math.cos(p), -Math.sin(p)] as const;
    const minor = [Math.sin(p), Math.cos(p)] as const;
    const a = 400;
    const bAxis = 280;
    const v = { f: 11, g: 6 };
    const start = { fKm: -600, gKm: -100 };
    const inside = (t: number): number => {
      const df = start.fKm + v.f * t - e.centerFKm;
      const dg = start.gKm + v.g * t - e.centerGKm;
      const u = df * major[0] + dg * major[1];
      const w = df * minor[0] + dg * minor[1];
      return (u / a) ** 2 + (w / bAxis) ** 2 - 1;
    };
    const bisect = (lo: number, hi: number): number => {
      for (let k = 0; k < 200; k++) {
        const mid = (lo + hi) / 2;
        if (Math.sign(inside(mid)) === Math.sign(inside(lo))) lo = mid;
        else hi = mid;
      }
      return (lo + hi) / 2;
    };
    // The track enters between t = 0 (outside) and t = 40 s (inside) and leaves before t = 80 s.
    expect(inside(0)).toBeGreaterThan(0);
    expect(inside(40)).toBeLessThan(0);
    expect(inside(80)).toBeGreaterThan(0);
    const tIn = bisect(0, 40);
    const tOut = bisect(40, 80);
    const normalSpeed = (t: number): number => {
      const df = start.fKm + v.f * t - e.centerFKm;
      const dg = start.gKm + v.g * t - e.centerGKm;
      const theta = Math.atan2((df * minor[0] + dg * minor[1]) / bAxis, (df * major[0] + dg * major[1]) / a);
      const tf = -a * Math.sin(theta) * major[0] + bAxis * Math.cos(theta) * minor[0];
      const tg = -a * Math.sin(theta) * major[1] + bAxis * Math.cos(theta) * minor[1];
      return Math.abs(v.f * tg - v.g * tf) / Math.hypot(tf, tg);
    };
    const c = limbCrossing(e, start, v);
    if (c === null) throw new Error('the track crosses');
    expectClose(c.disappearanceSeconds, tIn, 1e-9);
    expectClose(c.reappearanceSeconds, tOut, 1e-9);
    expectClose(c.disappearanceKmPerS, normalSpeed(tIn), 1e-9);
    expectClose(c.reappearanceKmPerS, normalSpeed(tOut), 1e-9);
  });

  it('limbCrossing() is null for a track that misses, and floors a grazing edge at 0.1·|v|', () => {
    const circle: LimbEllipse = {
      centerFKm: 0,
      centerGKm: 0,
      equatorialRadiusKm: 100,
      oblateness: 0,
      positionAngleDeg: 0,
    };
    const v = { f: 10, g: 0 };
    expect(limbCrossing(circle, { fKm: 0, gKm: 100.5 }, v)).toBeNull();
    // At b = 0.9999 R the normal component is √(1 − 0.9998) = 0.014 of v: below the floor.
    const grazing = limbCrossing(circle, { fKm: 0, gKm: 99.99 }, v);
    expectClose(grazing?.disappearanceKmPerS ?? NaN, 1, 1e-12);
    expectClose(grazing?.reappearanceKmPerS ?? NaN, 1, 1e-12);
  });
});

describe('predictedLimb()', () => {
  it('predictedLimb() puts the circle at D·offset: 1 mas at 41 au is 29.736 km', () => {
    // 41 × 149 597 870.7 km × (π / 648 000 000) rad (IAU 2012 Resolution B2 for the au).
    const distanceKm = 41 * 149_597_870.7;
    const limb = predictedLimb({ bodyRadiusKm: 365, offsetMas: { raCosDec: 1, dec: -2 } }, distanceKm);
    expectClose(limb.centerFKm, 29.7361, 1e-4);
    expectClose(limb.centerGKm, -59.4722, 1e-4);
    expect(limb.equatorialRadiusKm).toBe(365);
    expect(limb.oblateness).toBe(0);
  });
});
