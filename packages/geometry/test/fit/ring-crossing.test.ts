import { describe, expect, it } from 'vitest';

import { ringCrossing } from '../../src/fit/ring-crossing.js';
import type { RingDip } from '../../src/project.js';
import { expectClose } from '../expect-close.js';

// A ring about the origin with its apparent major axis along f (P = 0): a track along f on that axis sees
// ring-plane radius r = |f| whatever B, so the radial width equals the track length and every product has
// a closed form. The 1-sigma below are the textbook rules for sums and products of independent errors
// (Taylor, An Introduction to Error Analysis, 2nd ed., §3.11, eqs. 3.47–3.48).

const DEG = Math.PI / 180;
const ring = { centerFKm: 0, centerGKm: 0, openingAngleDeg: 30, positionAngleDeg: 0 };
const noRingError = Array.from({ length: 5 }, () => new Array<number>(5).fill(0));

function dip(extra: Partial<RingDip> = {}): RingDip {
  // From r = 1000 km to r = 1012 km at 8 km/s: 1.5 s.
  return {
    station: 'S1',
    start: { fKm: 1000, gKm: 0 },
    end: { fKm: 1012, gKm: 0 },
    durationSeconds: 1.5,
    startSigmaSeconds: 0.03,
    endSigmaSeconds: 0.04,
    velocity: { f: 8, g: 0 },
    ...extra,
  };
}

describe('ringCrossing()', () => {
  it('ringCrossing() gives the radial width and its 1-sigma from the two timing sigmas', () => {
    const c = ringCrossing(dip(), { fKm: 1006, gKm: 0, station: 'S1' }, ring, noRingError);
    expectClose(c.radialWidthKm, 12, 1e-9);
    // σW = |dr/dt|·√(σs² + σe²) = 8 km/s × 0.05 s.
    expectClose(c.radialWidthKmSigma ?? NaN, 0.4, 1e-6);
    expect(c.dip).toBeUndefined();
  });

  it('ringCrossing() adds the ring position angle’s error to the radial width across the major axis', () => {
    // Turning P by δ moves the ring's major axis off the track: r(point) = √(u² + (w/sin B)²) with
    // u = f cos δ and w = f sin δ, so W grows to second order only and σW stays that of the timings.
    const covariance = noRingError.map((row) => [...row]);
    (covariance[4] as number[])[4] = 0.5 ** 2;
    const c = ringCrossing(dip(), { fKm: 1006, gKm: 0, station: 'S1' }, ring, covariance);
    expectClose(c.radialWidthKmSigma ?? NaN, 0.4, 1e-4);
  });

  it('ringCrossing() gives τ, τ_N = τ·|sin B| and the equivalent widths and depths with their 1-sigma', () => {
    const covariance = noRingError.map((row) => [...row]);
    (covariance[3] as number[])[3] = 1.5 ** 2;
    const opacity = { value: 0.4, sigma: 0.02, lowerLimit: false };
    const c = ringCrossing(
      dip({ apparentOpacity: opacity }),
      { fKm: 1006, gKm: 0, station: 'S1' },
      ring,
      covariance,
    );
    const products = c.dip;
    if (products === undefined) throw new Error('products expected');
    const p = 0.4;
    const sp = 0.02;
    const tau = -Math.log(1 - p);
    const sTau = sp / (1 - p);
    const sinB = Math.sin(30 * DEG);
    const sSinB = Math.cos(30 * DEG) * 1.5 * DEG;
    const L = 12;
    const sL = 0.4;
    const rel = (...terms: number[]) => Math.hypot(...terms);
    expectClose(products.apparentOpacity.value, p, 1e-12);
    expectClose(products.apparentOpacity.sigma, sp, 1e-9);
    expectClose(products.apparentOpticalDepth?.value ?? NaN, 0.510826, 1e-6);
    expectClose(products.apparentOpticalDepth?.sigma ?? NaN, sTau, 1e-8);
    expectClose(products.normalOpticalDepth?.value ?? NaN, tau * sinB, 1e-9);
    expectClose(products.normalOpticalDepth?.sigma ?? NaN, tau * sinB * rel(sTau / tau, sSinB / sinB), 1e-7);
    expectClose(products.equivalentWidthKm.value, p * L, 1e-9);
    expectClose(products.equivalentWidthKm.sigma, p * L * rel(sp / p, sL / L), 1e-6);
    expectClose(products.normalEquivalentWidthKm.value, p * L * sinB, 1e-9);
    expectClose(
      products.normalEquivalentWidthKm.sigma,
      p * L * sinB * rel(sp / p, sL / L, sSinB / sinB),
      1e-6,
    );
    expectClose(products.equivalentDepthKm?.value ?? NaN, tau * L, 1e-9);
    expectClose(products.equivalentDepthKm?.sigma ?? NaN, tau * L * rel(sTau / tau, sL / L), 1e-6);
    expectClose(products.normalEquivalentDepthKm?.value ?? NaN, tau * sinB * L, 1e-9);
    expectClose(
      products.normalEquivalentDepthKm?.sigma ?? NaN,
      tau * sinB * L * rel(sTau / tau, sL / L, sSinB / sinB),
      1e-6,
    );
    expect(products.lowerLimit).toBe(false);
  });

  it('ringCrossing() leaves the optical depths of an opaque dip null and keeps its lower-limit flag', () => {
    const opacity = { value: 1, sigma: 0.05, lowerLimit: true };
    const c = ringCrossing(
      dip({ apparentOpacity: opacity }),
      { fKm: 1006, gKm: 0, station: 'S1' },
      ring,
      noRingError,
    );
    expect(c.dip?.apparentOpticalDepth).toBeNull();
    expect(c.dip?.normalOpticalDepth).toBeNull();
    expect(c.dip?.equivalentDepthKm).toBeNull();
    expect(c.dip?.lowerLimit).toBe(true);
    expectClose(c.dip?.normalEquivalentWidthKm.value ?? NaN, 12 * 0.5, 1e-9);
  });
});
