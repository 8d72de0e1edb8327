// Observing stations: WGS84 geodetic coordinates → Earth-fixed vector → celestial (J2000) position and
// velocity at a given instant.
//   Geodetic → Earth-centred Earth-fixed: NIMA TR8350.2 (WGS84), eq. 4-14, with a = 6 378 137 m and
//   1/f = 298.257223563 (TR8350.2 Table 3.1).
import { DEG } from '../math.js';
import { ttSecondsToUt1Seconds } from '../time/scales.js';
import type { StationInput } from '../types.js';
import {
  SIDEREAL_RATE_RAD_PER_S,
  greenwichMeanSiderealTimeRad,
  equationOfEquinoxesRad,
  rotateBySiderealAngle,
  trueOfDateToJ2000,
} from './earth-rotation.js';
import { mulMatVec, type Mat3, type Vec3 } from './vec3.js';

export const WGS84_A_KM = 6378.137;
export const WGS84_INVERSE_FLATTENING = 298.257223563;
const F = 1 / WGS84_INVERSE_FLATTENING;
const E2 = F * (2 - F);

/** Earth-fixed (ITRS axes, polar motion neglected) vector of a geodetic position, km. */
export function geodeticToEarthFixedKm(latDeg: number, lonDeg: number, heightM: number): Vec3 {
  const phi = latDeg * DEG;
  const lambda = lonDeg * DEG;
  const sinPhi = Math.sin(phi);
  const cosPhi = Math.cos(phi);
  const n = WGS84_A_KM / Math.sqrt(1 - E2 * sinPhi * sinPhi);
  const h = heightM / 1000;
  return [
    (n + h) * cosPhi * Math.cos(lambda),
    (n + h) * cosPhi * Math.sin(lambda),
    (n * (1 - E2) + h) * sinPhi,
  ];
}

/**
 * ρ sin φ′ and ρ cos φ′ in Earth equatorial radii (Meeus, Astronomical Algorithms, 2nd ed., ch. 11),
 * the geocentric quantities occultation reductions use; here from the WGS84 vector.
 */
export function geocentricRhoComponents(
  latDeg: number,
  heightM: number,
): { rhoSinPhiPrime: number; rhoCosPhiPrime: number } {
  const r = geodeticToEarthFixedKm(latDeg, 0, heightM);
  return { rhoSinPhiPrime: r[2] / WGS84_A_KM, rhoCosPhiPrime: r[0] / WGS84_A_KM };
}

/**
 * Celestial frames for an event: the precession-nutation matrix and the equation of the equinoxes change
 * by < 0.001″ in ten minutes (< 3 cm at the Earth's surface), so they are computed once per 10-minute
 * bucket of TT instead of at every sampled instant.
 */
export class EarthOrientation {
  private readonly buckets = new Map<number, { matrix: Mat3; equationOfEquinoxesRad: number }>();

  constructor(private readonly dut1Seconds: number) {}

  private bucket(ttSeconds: number): { matrix: Mat3; equationOfEquinoxesRad: number } {
    const key = Math.round(ttSeconds / 600);
    let b = this.buckets.get(key);
    if (!b) {
      const tt = key * 600;
      b = { matrix: trueOfDateToJ2000(tt), equationOfEquinoxesRad: equationOfEquinoxesRad(tt) };
      this.buckets.set(key, b);
    }
    return b;
  }

  /** Geocentric position (km) and velocity (km/s) in J2000 axes of an Earth-fixed vector at a TT instant. */
  celestialState(earthFixedKm: Vec3, ttSeconds: number): { positionKm: Vec3; velocityKmPerS: Vec3 } {
    const b = this.bucket(ttSeconds);
    const theta =
      greenwichMeanSiderealTimeRad(ttSecondsToUt1Seconds(ttSeconds, this.dut1Seconds)) +
      b.equationOfEquinoxesRad;
    const tod = rotateBySiderealAngle(earthFixedKm, theta);
    // d/dt R3(−θ)·r = θ̇ · (−y, x, 0) in true-of-date axes; precession-nutation rates are ~1e-12 of that.
    const todVelocity: Vec3 = [-SIDEREAL_RATE_RAD_PER_S * tod[1], SIDEREAL_RATE_RAD_PER_S * tod[0], 0];
    return { positionKm: mulMatVec(b.matrix, tod), velocityKmPerS: mulMatVec(b.matrix, todVelocity) };
  }
}

export interface Station {
  id: string;
  earthFixedKm: Vec3;
}

export function stationFromInput(input: StationInput): Station {
  return { id: input.id, earthFixedKm: geodeticToEarthFixedKm(input.latDeg, input.lonDeg, input.heightM) };
}
