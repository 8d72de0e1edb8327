import { AstroTime, Observer, ObserverVector, SiderealTime, KM_PER_AU } from 'astronomy-engine';
import { describe, it } from 'vitest';
import {
  greenwichApparentSiderealTimeRad,
  greenwichMeanSiderealTimeRad,
} from '../../src/astro/earth-rotation.js';
import {
  EarthOrientation,
  geocentricRhoComponents,
  geodeticToEarthFixedKm,
  WGS84_A_KM,
} from '../../src/astro/station.js';
import { isoToTtSeconds, ttSecondsToUt1Seconds, utcIsoToTtSeconds } from '../../src/time/scales.js';
import { DEG, TAU } from '../../src/math.js';
import { expectClose } from '../expect-close.js';

const SECONDS_OF_TIME_PER_RAD = 86_400 / TAU;

/** UT1 seconds since J2000 of a calendar time read as UT1. */
function ut1(text: string): number {
  return isoToTtSeconds(text, 'TT');
}

describe('Earth rotation', () => {
  it('greenwichMeanSiderealTimeRad() gives Meeus Example 12.a', () => {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 12.a: 1987 April 10, 0h UT → 13h10m46.3668s.
    const expectedSeconds = 13 * 3600 + 10 * 60 + 46.3668;
    expectClose(
      greenwichMeanSiderealTimeRad(ut1('1987-04-10T00:00:00')) * SECONDS_OF_TIME_PER_RAD,
      expectedSeconds,
      1e-4,
    );
  });

  it('greenwichMeanSiderealTimeRad() gives Meeus Example 12.b', () => {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 12.b: 1987 April 10, 19h21m00s UT → 8h34m57.0896s.
    const expectedSeconds = 8 * 3600 + 34 * 60 + 57.0896;
    expectClose(
      greenwichMeanSiderealTimeRad(ut1('1987-04-10T19:21:00')) * SECONDS_OF_TIME_PER_RAD,
      expectedSeconds,
      1e-4,
    );
  });

  it('greenwichApparentSiderealTimeRad() gives the apparent time of Meeus Example 12.a', () => {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 12.a, apparent sidereal time 13h10m46.1351s with the
    // nutation of Example 22.a (value from memory). Meeus uses the IAU 1980 nutation (Δψ = −3.788″ there);
    // astronomy-engine's IAU 2000B gives −3.716″, the known ~70 mas offset between the two models then,
    // i.e. 4.4 ms of time.
    const t = ut1('1987-04-10T00:00:00');
    const expectedSeconds = 13 * 3600 + 10 * 60 + 46.1351;
    expectClose(greenwichApparentSiderealTimeRad(t, t + 55) * SECONDS_OF_TIME_PER_RAD, expectedSeconds, 6e-3);
  });

  it('greenwichApparentSiderealTimeRad() agrees with astronomy-engine SiderealTime() within 8 ms over 1990–2040', () => {
    // astronomy-engine 2.1.19 uses the IAU 2006 Earth-rotation-angle formulation (IERS Conventions 2010,
    // eq. 5.32), independent of Meeus eq. 12.4 (IAU 1982). The two drift apart by the IAU 2000 precession-rate
    // correction, −0.30″ per century in longitude ≈ 0.18 ms of time per year from J2000, i.e. ≤ 7.5 ms here.
    for (let year = 1990; year <= 2040; year += 5) {
      const ut = ut1(`${year}-06-15T07:30:00`);
      const ours = greenwichApparentSiderealTimeRad(ut, ut + 69) * SECONDS_OF_TIME_PER_RAD;
      const theirs = SiderealTime(new AstroTime(ut / 86_400)) * 3600;
      const diff = ((ours - theirs + 43_200) % 86_400) - 43_200;
      expectClose(diff, 0, 1.8e-4 * Math.abs(year - 2000) + 1e-3);
    }
  });
});

describe('stations', () => {
  it('geocentricRhoComponents() gives Meeus Example 11.a', () => {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 11.a: φ = +33°21′22″, H = 1706 m →
    // ρ sin φ′ = 0.546861, ρ cos φ′ = 0.836339 (IAU 1976 ellipsoid; WGS84 differs by < 1e-7 here).
    const lat = 33 + 21 / 60 + 22 / 3600;
    const { rhoSinPhiPrime, rhoCosPhiPrime } = geocentricRhoComponents(lat, 1706);
    expectClose(rhoSinPhiPrime, 0.546861, 1.5e-6);
    expectClose(rhoCosPhiPrime, 0.836339, 1.5e-6);
  });

  it('geodeticToEarthFixedKm() puts the poles at the WGS84 semi-minor axis', () => {
    // NIMA TR8350.2: a = 6378137 m, 1/f = 298.257223563 → b = a(1 − f) = 6356752.3142 m.
    expectClose(geodeticToEarthFixedKm(90, 0, 0)[2], 6356.7523142, 1e-7);
    expectClose(geodeticToEarthFixedKm(0, 90, 1000)[1], WGS84_A_KM + 1, 1e-9);
  });

  it('EarthOrientation.celestialState() agrees with astronomy-engine ObserverVector() within 5 m', () => {
    // Independent check: astronomy-engine's own sidereal time and ellipsoid (a = 6378.1366 km, IERS 2003)
    // and its J2000 rotation. Its ellipsoid alone differs from WGS84 by 0.4 m; the sidereal-time formulations
    // by ≤ 6 ms of time in 2031 (see above), ≤ 2.8 m at the equator.
    const dut1 = -0.3;
    const orientation = new EarthOrientation(dut1);
    const sites: Array<[number, number, number]> = [
      [-23.5, -46.6, 800],
      [41.2, 2.1, 120],
      [-70.1, 165.3, 2900],
      [5.0, -120.0, 0],
    ];
    for (const text of ['2028-03-14T02:10:00Z', '2031-11-02T17:45:31.5Z']) {
      const tt = utcIsoToTtSeconds(text);
      const time = new AstroTime(ttSecondsToUt1Seconds(tt, dut1) / 86_400);
      for (const [lat, lon, h] of sites) {
        const ours = orientation.celestialState(geodeticToEarthFixedKm(lat, lon, h), tt).positionKm;
        const theirs = ObserverVector(time, new Observer(lat, lon, h), false);
        expectClose(ours[0], theirs.x * KM_PER_AU, 0.005);
        expectClose(ours[1], theirs.y * KM_PER_AU, 0.005);
        expectClose(ours[2], theirs.z * KM_PER_AU, 0.005);
      }
    }
  });

  it('EarthOrientation.celestialState() velocity matches the finite difference of positions', () => {
    const orientation = new EarthOrientation(0.1);
    const r = geodeticToEarthFixedKm(-31.2, 18.4, 1500);
    const tt = utcIsoToTtSeconds('2028-03-14T02:10:00Z');
    const dt = 0.5;
    const v = orientation.celestialState(r, tt).velocityKmPerS;
    const ahead = orientation.celestialState(r, tt + dt).positionKm;
    const behind = orientation.celestialState(r, tt - dt).positionKm;
    // Central difference error ≈ ω²|v|dt²/6 ≈ 1e-9 km/s at dt = 0.5 s.
    for (let i = 0; i < 3; i++)
      expectClose(v[i] as number, ((ahead[i] as number) - (behind[i] as number)) / (2 * dt), 1e-7);
    // A station at latitude φ moves at ω·(N + h)·cos φ ≈ 0.397 km/s here (common practice, no source).
    expectClose(Math.hypot(...v), 7.2921159e-5 * 6378.137 * Math.cos(-31.2 * DEG), 2e-3);
  });
});
