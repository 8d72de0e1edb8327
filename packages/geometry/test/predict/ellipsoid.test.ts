import { AstroTime, Vector, VectorObserver } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { geodeticToEarthFixedKm } from '../../src/astro/station.js';
import { geodeticUp, starFacingSurfacePoint, surfaceGeodeticRad } from '../../src/predict/ellipsoid.js';
import { expectClose } from '../expect-close.js';

const DEG = Math.PI / 180;
// WGS84 (NIMA TR8350.2, Table 3.1): a = 6378137 m, 1/f = 298.257223563; its derived polar radius
// b = 6356752.3142 m (Table 3.3, from memory).
const A_KM = 6378.137;
const B_KM = 6356.7523142;
const F = 1 / 298.257223563;
const E2 = F * (2 - F);

describe('starFacingSurfacePoint()', () => {
  it('starFacingSurfacePoint() meets the equator at a and the pole at b (TR8350.2 Tables 3.1 and 3.3)', () => {
    const equator = starFacingSurfacePoint([0, 0, 0], [1, 0, 0]);
    expectClose(equator![0], A_KM, 1e-9);
    expectClose(equator![1], 0, 1e-12);
    const pole = starFacingSurfacePoint([0, 0, 0], [0, 0, -1]);
    // The star towards −z: its side of the Earth is the south pole.
    expectClose(pole![2], -B_KM, 1e-6);
  });

  it('starFacingSurfacePoint() takes the root on the star side and returns null off the limb', () => {
    // A line parallel to x at height z0 meets the meridian ellipse x²/a² + z²/b² = 1 at x = a√(1 − z0²/b²).
    const z0 = 3000;
    const p = starFacingSurfacePoint([-1e5, 0, z0], [1, 0, 0]);
    // b is quoted to 0.1 mm, so 1 mm here.
    expectClose(p![0], A_KM * Math.sqrt(1 - (z0 * z0) / (B_KM * B_KM)), 1e-6);
    const back = starFacingSurfacePoint([-1e5, 0, z0], [-1, 0, 0]);
    expectClose(back![0], -A_KM * Math.sqrt(1 - (z0 * z0) / (B_KM * B_KM)), 1e-6);
    expect(starFacingSurfacePoint([0, 0, B_KM + 0.001], [1, 0, 0])).toBeNull();
    expect(starFacingSurfacePoint([0, A_KM + 0.001, 0], [1, 0, 0])).toBeNull();
  });
});

describe('surfaceGeodeticRad()', () => {
  it('surfaceGeodeticRad() inverts the TR8350.2 eq. 4-14 vector at height 0', () => {
    for (const [lat, lon] of [
      [0, 0],
      [33.356111, -116.8625],
      [-47.5, 179.99],
      [71.3, 25.5],
      [-89.9, -45],
    ] as const) {
      const { latRad, lonRad } = surfaceGeodeticRad(geodeticToEarthFixedKm(lat, lon, 0));
      expectClose(latRad / DEG, lat, 1e-10);
      expectClose(lonRad / DEG, lon, 1e-10);
    }
  });

  it('surfaceGeodeticRad() follows tan φ = tan ψ/(1 − e²) for a surface point of geocentric latitude ψ', () => {
    // Geocentric and geodetic latitude on the ellipsoid, tan ψ = (1 − e²) tan φ, and the polar equation of
    // the meridian ellipse r(ψ) = ab/√(b² cos²ψ + a² sin²ψ) (both standard relations; from memory).
    for (const psiDeg of [-80, -35, 12.5, 45, 66]) {
      const psi = psiDeg * DEG;
      const r = (A_KM * B_KM) / Math.hypot(B_KM * Math.cos(psi), A_KM * Math.sin(psi));
      const lon = 1.1;
      const point = [
        r * Math.cos(psi) * Math.cos(lon),
        r * Math.cos(psi) * Math.sin(lon),
        r * Math.sin(psi),
      ] as const;
      const { latRad, lonRad } = surfaceGeodeticRad(point);
      expectClose(latRad, Math.atan(Math.tan(psi) / (1 - E2)), 1e-12);
      expectClose(lonRad, lon, 1e-12);
    }
  });

  it('surfaceGeodeticRad() agrees with astronomy-engine VectorObserver to 1e-6° (its IERS 2003 ellipsoid)', () => {
    // VectorObserver takes a J2000 vector in au and a time; at the Greenwich sidereal angle θ the Earth-fixed
    // point is the J2000 point turned by θ, so give it the point already in Earth-fixed axes at a time where
    // only the rotation matters: compare latitudes (longitude depends on astronomy-engine's sidereal time).
    const time = new AstroTime(10_000.25);
    for (const [lat, lon] of [
      [-24.6, -70.4],
      [64.1, 25.5],
      [-17.5, 179.6],
    ] as const) {
      const p = geodeticToEarthFixedKm(lat, lon, 0);
      const km = 149_597_870.7;
      const observer = VectorObserver(new Vector(p[0] / km, p[1] / km, p[2] / km, time), true);
      // The two ellipsoids differ by 0.4 m in a and 0.6 m in b: < 1e-5° of latitude, < 1 m of height.
      expectClose(observer.latitude, lat, 1e-5);
      expectClose(observer.height, 0, 1.0);
    }
  });

  it('geodeticUp() is the ellipsoid normal (x/a², y/a², z/b²) normalised', () => {
    const p = geodeticToEarthFixedKm(52.2, 4.4, 0);
    const n = [p[0] / (A_KM * A_KM), p[1] / (A_KM * A_KM), p[2] / (B_KM * B_KM)];
    const length = Math.hypot(n[0]!, n[1]!, n[2]!);
    const up = geodeticUp(52.2 * DEG, 4.4 * DEG);
    for (let i = 0; i < 3; i++) expectClose(up[i]!, n[i]! / length, 1e-9);
  });
});
