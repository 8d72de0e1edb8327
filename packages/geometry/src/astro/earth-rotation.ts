// Earth rotation: terrestrial (ITRS, polar motion neglected) → celestial (J2000 mean equator ≈ GCRS)
// axes, r_cel = N·P-into-J2000 · R3(−GAST) · r_ter, the equinox-based chain of Meeus, Astronomical
// Algorithms, 2nd ed., ch. 12 and 21–22.
//   GMST: Meeus eq. 12.4 (IAU 1982), from UT1 — implemented here.
//   GAST = GMST + equation of the equinoxes (Δψ cos ε); precession-nutation matrix of date → J2000:
//   astronomy-engine (IAU 2006 precession, IAU 2000B nutation), taken from TT.
// The frame bias between J2000 and ICRS (≈ 23 mas, ≈ 0.7 m at the Earth's surface) is neglected.
import { AstroTime, Rotation_EQD_EQJ, e_tilt } from 'astronomy-engine';
import { DEG, SECONDS_PER_DAY, TAU, wrap } from '../math.js';
import type { Mat3, Vec3 } from './vec3.js';

/** Rate of GMST in radians per UT1 second: 360.98564736629° per day (Meeus eq. 12.4). */
export const SIDEREAL_RATE_RAD_PER_S = (360.98564736629 * DEG) / SECONDS_PER_DAY;

/** Greenwich mean sidereal time in radians [0, 2π) for UT1 seconds since J2000 (Meeus eq. 12.4). */
export function greenwichMeanSiderealTimeRad(ut1Seconds: number): number {
  const d = ut1Seconds / SECONDS_PER_DAY;
  const t = d / 36_525;
  // 360.98564736629° d split as 360°·frac(d) + 0.98564736629°·d keeps precision over decades.
  const fraction = d - Math.floor(d);
  const deg =
    280.46061837 + 360 * fraction + 0.98564736629 * d + 0.000387933 * t * t - (t * t * t) / 38_710_000;
  return wrap(deg * DEG, TAU);
}

function astroTimeFromTt(ttSeconds: number): AstroTime {
  return AstroTime.FromTerrestrialTime(ttSeconds / SECONDS_PER_DAY);
}

/** Equation of the equinoxes Δψ cos ε in radians (nutation from astronomy-engine, from TT). */
export function equationOfEquinoxesRad(ttSeconds: number): number {
  // e_tilt(...).ee is in seconds of time.
  return (e_tilt(astroTimeFromTt(ttSeconds)).ee * 15 * DEG) / 3600;
}

export function greenwichApparentSiderealTimeRad(ut1Seconds: number, ttSeconds: number): number {
  return wrap(greenwichMeanSiderealTimeRad(ut1Seconds) + equationOfEquinoxesRad(ttSeconds), TAU);
}

/** Rotation from the true equator and equinox of date into J2000 mean equator axes. */
export function trueOfDateToJ2000(ttSeconds: number): Mat3 {
  // astronomy-engine stores rot[column][row]: RotateVector takes x' = rot[0][0]x + rot[1][0]y + rot[2][0]z.
  const r = Rotation_EQD_EQJ(astroTimeFromTt(ttSeconds)).rot;
  const at = (i: number, j: number): number => (r[j] as number[])[i] as number;
  return [
    [at(0, 0), at(0, 1), at(0, 2)],
    [at(1, 0), at(1, 1), at(1, 2)],
    [at(2, 0), at(2, 1), at(2, 2)],
  ];
}

/** Terrestrial vector turned to the true equator of date by the sidereal angle θ: R3(−θ)·r. */
export function rotateBySiderealAngle(r: Vec3, thetaRad: number): Vec3 {
  const c = Math.cos(thetaRad);
  const s = Math.sin(thetaRad);
  return [c * r[0] - s * r[1], s * r[0] + c * r[1], r[2]];
}
