import { describe, expect, it } from 'vitest';

import { boxMean, buildEdgeProfile, fresnelScaleKm, profileAt } from '../../src/lightcurve/edge-profile.js';
import { straightEdgeIntensity } from '../../src/lightcurve/fresnel.js';
import { starDiameterKmFromMas } from '../../src/lightcurve/star.js';
import { GeometryInputError } from '../../src/types.js';
import { expectClose } from '../expect-close.js';
import { syntheticEdge } from './synthetic.js';

describe('fresnelScaleKm()', () => {
  // F = √(λD/2) (Roques, Moncuquet & Sicardy 1987, AJ 93, 1549, "Stellar occultations by small bodies:
  // diffraction effects"; citation from memory). By hand: 0.65 µm = 6.5e-10 km; 6.5e-10 × 6e9 / 2 = 1.95 km².
  it('fresnelScaleKm() is √(λD/2): 0.65 µm at 6e9 km gives √1.95 km', () => {
    expectClose(fresnelScaleKm(0.65, 6e9), Math.sqrt(1.95), 1e-12);
    expectClose(fresnelScaleKm(0.65, 6e9), 1.396424, 1e-6);
    // Quadrupling the distance doubles the scale.
    expectClose(fresnelScaleKm(0.5, 4e9) / fresnelScaleKm(0.5, 1e9), 2, 1e-12);
  });
});

describe('starDiameterKmFromMas()', () => {
  // Small-angle: 1 mas = 4.8481368e-9 rad (π/(180·3600·1000)); 0.1 mas at 6e9 km is 2.9089 km.
  it('starDiameterKmFromMas() converts 0.1 mas at 6e9 km to 2.9089 km', () => {
    expectClose(starDiameterKmFromMas(0.1, 6e9), 2.908882, 1e-6);
  });
});

describe('buildEdgeProfile()', () => {
  it('buildEdgeProfile() for a point source in one wavelength reproduces the straight-edge pattern', () => {
    const profile = buildEdgeProfile({
      distanceKm: 6e9,
      wavelengthUm: 0.65,
      bandwidthUm: 0,
      starDiameterKm: 0,
    });
    const f = profile.fresnelScaleKm;
    expect(profile.bandSlices).toBe(1);
    // Exactly the pattern at the grid nodes; between nodes the linear interpolant's error is ~(Δx)²·I''/8,
    // about 1e-3 at u = 3 with 40 nodes per Fresnel scale.
    expectClose(profileAt(profile, 0), 0.25, 1e-3);
    for (let u = -3; u <= 3; u += 0.0173) {
      expectClose(profileAt(profile, u * f), straightEdgeIntensity(u), 1.5e-3);
    }
  });

  it('buildEdgeProfile() over a band and a disc matches direct integration of the diffraction pattern', () => {
    // The reference averages a directly integrated pattern over 64 band slices and 48 disc strips
    // (test/lightcurve/synthetic.ts); the table uses its own slice count, strips and interpolation.
    const setup = { distanceKm: 6e9, wavelengthUm: 0.65, bandwidthUm: 0.3, starDiameterKm: 0.8 };
    const profile = buildEdgeProfile(setup);
    let worst = 0;
    for (let x = -15; x <= 15; x += 0.0371) {
      worst = Math.max(
        worst,
        Math.abs(profileAt(profile, x) - syntheticEdge({ ...setup, speedKmPerS: 1, exposureSeconds: 0 }, x)),
      );
    }
    expect(worst).toBeLessThan(1e-3);
  });

  it('buildEdgeProfile() for a star much larger than the Fresnel scale approaches the uncovered disc fraction', () => {
    // Uniform disc of radius R behind a straight edge at distance x from its centre: uncovered fraction
    // ½ + (q√(1 − q²) + asin q)/π with q = x/R (area of a circular segment). Diffraction smooths it by ~F/R.
    const radiusKm = 40;
    const profile = buildEdgeProfile({
      distanceKm: 6e9,
      wavelengthUm: 0.65,
      bandwidthUm: 0.3,
      starDiameterKm: 2 * radiusKm,
    });
    for (let x = -35; x <= 35; x += 2.5) {
      const q = x / radiusKm;
      const geometric = 0.5 + (q * Math.sqrt(1 - q * q) + Math.asin(q)) / Math.PI;
      expectClose(profileAt(profile, x), geometric, 0.01);
    }
  });

  it('buildEdgeProfile() is exactly the geometric step outside its table', () => {
    const profile = buildEdgeProfile({
      distanceKm: 6e9,
      wavelengthUm: 0.65,
      bandwidthUm: 0.3,
      starDiameterKm: 1,
    });
    expect(profileAt(profile, profile.halfWidthKm + 1e-9)).toBe(1);
    expect(profileAt(profile, -profile.halfWidthKm - 1e-9)).toBe(0);
    expect(boxMean(profile, profile.halfWidthKm + 5, 4)).toBe(1);
    expect(boxMean(profile, -profile.halfWidthKm - 5, 4)).toBe(0);
  });

  it('buildEdgeProfile() rejects a band wider than twice its central wavelength', () => {
    expect(() =>
      buildEdgeProfile({ distanceKm: 6e9, wavelengthUm: 0.5, bandwidthUm: 1, starDiameterKm: 0 }),
    ).toThrow(GeometryInputError);
  });
});

describe('boxMean()', () => {
  it('boxMean() equals a fine midpoint average of the interpolated profile', () => {
    const profile = buildEdgeProfile({
      distanceKm: 3e9,
      wavelengthUm: 0.6,
      bandwidthUm: 0.2,
      starDiameterKm: 0.3,
    });
    for (const [x, h] of [
      [0.3, 0.05],
      [-1.2, 2.5],
      [4.0, 0.8],
      [profile.halfWidthKm - 0.5, 1.5],
    ] as const) {
      const n = 20000;
      let sum = 0;
      for (let k = 0; k < n; k++) sum += profileAt(profile, x - h + ((k + 0.5) * 2 * h) / n);
      expectClose(boxMean(profile, x, h), sum / n, 1e-7);
    }
  });
});
