import { describe, it } from 'vitest';
import { trueOfDateToJ2000 } from '../../src/astro/earth-rotation.js';
import { fromRaDec, mulMatVec, toRaDec } from '../../src/astro/vec3.js';
import { DEG, RAD } from '../../src/math.js';
import { pointingAt, starAltAzDeg, subsolarPoint, substellarPoint } from '../../src/placement/pointing.js';
import { sunDirection } from '../../src/predict/altitudes.js';
import { PredictionSky } from '../../src/predict/sky-frame.js';
import { utcIsoToTtSeconds } from '../../src/time/scales.js';
import type { EventInput, StarInput } from '../../src/types.js';
import { expectClose } from '../expect-close.js';

/** A star at the J2000 place of an of-date (true equator and equinox) direction at a TT instant. */
function starFromOfDate(raDeg: number, decDeg: number, tt: number): StarInput {
  const j2000 = toRaDec(mulMatVec(trueOfDateToJ2000(tt), fromRaDec(raDeg * DEG, decDeg * DEG)));
  return {
    raDeg: j2000.raRad * RAD,
    decDeg: j2000.decRad * RAD,
    // The catalogue epoch at the instant itself, with no motion: the direction is then exactly this.
    catalogEpochJyear: 2000 + tt / (365.25 * 86_400),
    pmRaCosDecMasPerYear: 0,
    pmDecMasPerYear: 0,
    parallaxMas: 0,
  };
}

/** A sky frame around an instant; the body's rows only have to exist (pointing never reads them). */
function skyAt(star: StarInput, isoUtc: string): PredictionSky {
  const t = Date.parse(isoUtc);
  const row = (minutes: number) => ({
    time: new Date(t + minutes * 60_000).toISOString().slice(0, 19),
    raDeg: 10 + minutes * 1e-5,
    decDeg: 5,
    distanceKm: 6e9,
  });
  const event: Pick<EventInput, 'star' | 'ephemeris' | 'earthRotation'> = {
    star,
    ephemeris: { timeScale: 'UTC', rows: [-30, -10, 10, 30].map(row) },
    earthRotation: { dut1Seconds: 0 },
  };
  return new PredictionSky(event, { raCosDec: 0, dec: 0 });
}

describe('placement: pointing', () => {
  it('starAltAzDeg() gives Meeus Example 13.b: Venus from the USNO, 1987-04-10 19:21 UT, h = 15.1249°, A = 68.0337° west of south', () => {
    // Meeus, Astronomical Algorithms, 2nd ed., Example 13.b: apparent α = 23h09m16.641s, δ = −6°43′11.61″,
    // φ = +38°55′17″, L = 77°03′56″ W; A is measured from the south, westwards (248.0337° from north).
    // UT is taken as UTC with DUT1 = 0: in 1987 |UT1 − UTC| < 0.9 s, < 0.004° of rotation.
    const utc = '1987-04-10T19:21:00Z';
    const tt = utcIsoToTtSeconds(utc);
    const raDeg = (23 + 9 / 60 + 16.641 / 3600) * 15;
    const decDeg = -(6 + 43 / 60 + 11.61 / 3600);
    const sky = skyAt(starFromOfDate(raDeg, decDeg, tt), utc);
    const latDeg = 38 + 55 / 60 + 17 / 3600;
    const lonDeg = -(77 + 3 / 60 + 56 / 3600);
    const { altitudeDeg, azimuthDeg } = starAltAzDeg(sky, latDeg, lonDeg, tt);
    expectClose(altitudeDeg, 15.1249, 0.005);
    expectClose(azimuthDeg, 180 + 68.0337, 0.005);
    // The point under the star: latitude δ, longitude α − θ0 with θ0 = 8h34m56.853s (the example's apparent
    // sidereal time at Greenwich).
    const under = substellarPoint(sky, tt);
    expectClose(under.latDeg, decDeg, 1e-6);
    expectClose(under.lonDeg, raDeg - (8 + 34 / 60 + 56.853 / 3600) * 15 - 360, 0.005);
  });

  it('pointingAt() puts the Moon on the Sun at the greatest total eclipse of 2024-04-08, with the Sun at 69.8° and the Moon new', () => {
    // NASA (F. Espenak), Total Solar Eclipse of 2024 Apr 08: greatest eclipse at 18:17:21 UT (18:18:30 TD)
    // at 25°17′N 104°08′W, Sun altitude 70° (69.8° in the Besselian elements' table); from memory. The
    // "star" here is the Sun's own geocentric direction at that instant, so the separation measures the
    // Moon's topocentric place (a geocentric Moon would be ~0.3° off the Sun there).
    const utc = '2024-04-08T18:17:21Z';
    const tt = utcIsoToTtSeconds(utc);
    const site = { latDeg: 25 + 17 / 60, lonDeg: -(104 + 8 / 60), heightM: 0 };
    const sun = toRaDec(sunDirection(tt));
    const sunStar: StarInput = {
      ...starFromOfDate(0, 0, tt),
      raDeg: sun.raRad * RAD,
      decDeg: sun.decRad * RAD,
    };
    const pointing = pointingAt(skyAt(sunStar, utc), site, tt);
    expectClose(pointing.sunAltitudeDeg, 69.8, 0.2);
    expectClose(pointing.starAltitudeDeg, pointing.sunAltitudeDeg, 1e-6);
    expectClose(pointing.moonSeparationDeg, 0, 0.03);
    expectClose(pointing.moonIlluminatedFraction, 0, 0.002);
    expectClose(pointing.moonAltitudeDeg, 69.8, 0.2);
  });

  it('pointingAt() sees a full Moon lit on 2024-04-23 23:49 UTC', () => {
    // USNO phases of the Moon 2024: full Moon April 23, 23:49 UTC (from memory).
    const utc = '2024-04-23T23:49:00Z';
    const tt = utcIsoToTtSeconds(utc);
    const sky = skyAt(starFromOfDate(200, -10, tt), utc);
    const pointing = pointingAt(sky, { latDeg: -30, lonDeg: 20, heightM: 1000 }, tt);
    expectClose(pointing.moonIlluminatedFraction, 1, 0.002);
  });

  it('subsolarPoint() at the June solstice of 2024 (06-20 20:51 UTC) lies on the Tropic of Cancer', () => {
    // USNO, Earth's seasons 2024: June solstice 20 June 20:51 UTC; obliquity 23.436° (IAU 2006, for 2024;
    // from memory). Longitude: 12:00 local apparent time there; the equation of time (apparent − mean) is
    // then −1.7 min (sundial tables; from memory), so local mean time is 12:01.7 and
    // λ = (12.028 − 20.85) h · 15°/h ≈ −132.3°.
    const utc = '2024-06-20T20:51:00Z';
    const tt = utcIsoToTtSeconds(utc);
    const point = subsolarPoint(skyAt(starFromOfDate(0, 0, tt), utc), tt);
    expectClose(point.latDeg, 23.436, 0.01);
    expectClose(point.lonDeg, -132.3, 0.1);
  });
});
