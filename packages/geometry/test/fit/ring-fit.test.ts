import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { gaussian, mulberry32 } from '../../src/fit/prng.js';
import { type RingPoint, fitRing, ringPlaneRadiusKm } from '../../src/fit/ring-fit.js';
import { GeometryInputError } from '../../src/types.js';
import type { LimbEllipse, VelocityKmPerS } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { crossingTimes } from './synthetic-chords.js';

// An invented ring: radius 1200 km, opening angle 40°, pole at position angle 110°, around a body at (5, −3).
const center = { fKm: 5, gKm: -3 };
const radiusKm = 1200;
const openingDeg = 40;
const poleDeg = 110;
// The projected ring as an apparent ellipse: semi-major R, semi-minor R·sin B (common practice, no source).
const ringEllipse: LimbEllipse = {
  centerFKm: center.fKm,
  centerGKm: center.gKm,
  equatorialRadiusKm: radiusKm,
  oblateness: 1 - Math.sin((openingDeg * Math.PI) / 180),
  positionAngleDeg: poleDeg,
};
const velocity: VelocityKmPerS = { f: 21, g: 4 };
const impactKm = [-700, -380, -90, 250, 560];

function ringPoints(sigmaSeconds: number, noise?: () => number): RingPoint[] {
  const speed = Math.hypot(velocity.f, velocity.g);
  return impactKm.flatMap((h, i) => {
    const times = crossingTimes(ringEllipse, velocity, h);
    if (!times) throw new Error(`impact ${h} km misses the ring`);
    const foot = { f: center.fKm - (velocity.g / speed) * h, g: center.gKm + (velocity.f / speed) * h };
    return times.map((t0) => {
      const t = t0 + (noise ? sigmaSeconds * noise() : 0);
      return {
        station: `R${i + 1}`,
        fKm: foot.f + velocity.f * t,
        gKm: foot.g + velocity.g * t,
        sigmaSeconds,
        velocity,
      };
    });
  });
}

describe('fitRing()', () => {
  it('fitRing() recovers radius, opening angle and pole exactly from noise-free dips, centre given', () => {
    const r = fitRing({ ring: 'alpha', points: ringPoints(0.2), center, seed: 3 });
    expectClose(r.radiusKm, radiusKm, 1e-5);
    expectClose(r.openingAngleDeg, openingDeg, 1e-6);
    expectClose(r.positionAngleDeg, poleDeg, 1e-6);
    expect(r.centerFKm).toBe(center.fKm);
    expect(r.uncertainty.centerFKm).toBe(0);
    expect(r.dof).toBe(10 - 3);
    expectClose(r.chi2, 0, 1e-9);
  });

  it('fitRing() with a free centre recovers every parameter within 2 sigma from noisy dips', () => {
    const r = fitRing({
      ring: 'alpha',
      points: ringPoints(0.2, gaussian(mulberry32(17))),
      center: null,
      seed: 3,
    });
    expect(r.dof).toBe(10 - 5);
    const checks: Array<[number, number, number]> = [
      [r.radiusKm, radiusKm, r.uncertainty.radiusKm],
      [r.openingAngleDeg, openingDeg, r.uncertainty.openingAngleDeg],
      [r.positionAngleDeg, poleDeg, r.uncertainty.positionAngleDeg],
      [r.centerFKm, center.fKm, r.uncertainty.centerFKm],
      [r.centerGKm, center.gKm, r.uncertainty.centerGKm],
    ];
    for (const [value, truth, sigma] of checks) {
      expect(sigma).toBeGreaterThan(0);
      expectClose(value, truth, 2 * sigma);
    }
  });

  it('fitRing() refuses fewer dips than free parameters, naming the ring', () => {
    const points = ringPoints(0.2).slice(0, 2);
    expect(() => fitRing({ ring: 'beta', points, center, seed: 1 })).toThrow(GeometryInputError);
    expect(() => fitRing({ ring: 'beta', points, center, seed: 1 })).toThrow(
      /ring "beta": fewer points \(2\) than free parameters \(3\)/,
    );
  });
});

describe('ringPlaneRadiusKm()', () => {
  it('ringPlaneRadiusKm() gives R for every point of the projected ring', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), (t) => {
        // Point of the ring circle at ring longitude t, projected: x = R cos t along the line of nodes,
        // y = R sin t · sin B along the projected pole (common practice, no source).
        const p = (poleDeg * Math.PI) / 180;
        const x = radiusKm * Math.cos(t);
        const y = radiusKm * Math.sin(t) * Math.sin((openingDeg * Math.PI) / 180);
        const point = {
          fKm: center.fKm + x * Math.cos(p) + y * Math.sin(p),
          gKm: center.gKm - x * Math.sin(p) + y * Math.cos(p),
        };
        expectClose(ringPlaneRadiusKm(point, center, openingDeg, poleDeg), radiusKm, 1e-9 * radiusKm);
      }),
    );
  });

  it('ringPlaneRadiusKm() stretches a point on the projected pole by 1 / sin B', () => {
    const p = (poleDeg * Math.PI) / 180;
    const point = { fKm: center.fKm + 100 * Math.sin(p), gKm: center.gKm + 100 * Math.cos(p) };
    expectClose(ringPlaneRadiusKm(point, center, 30, poleDeg), 200, 1e-9);
  });

  it('ringPlaneRadiusKm() refuses a ring seen edge-on', () => {
    expect(() => ringPlaneRadiusKm({ fKm: 1, gKm: 1 }, center, 0, poleDeg)).toThrow(/edge-on/);
  });
});
