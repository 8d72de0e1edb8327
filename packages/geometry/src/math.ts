// Shared numerical constants and guarded elementary functions (one place, as in d3-shape's src/math.js).

export const PI = Math.PI;
export const TAU = 2 * Math.PI;
export const DEG = Math.PI / 180;
export const RAD = 180 / Math.PI;
/** Milliarcseconds per radian. */
export const MAS_PER_RAD = (180 / Math.PI) * 3600 * 1000;
export const SECONDS_PER_DAY = 86_400;
/** Julian date of J2000.0 (2000 January 1, 12h TT). */
export const JD_J2000 = 2_451_545.0;
export const DAYS_PER_JULIAN_YEAR = 365.25;
/** IAU 2012 astronomical unit, km. */
export const AU_KM = 149_597_870.7;

/** acos clamped to its domain so that rounding just past ±1 does not produce NaN. */
export function acos(x: number): number {
  return x > 1 ? 0 : x < -1 ? PI : Math.acos(x);
}

/** asin clamped to its domain so that rounding just past ±1 does not produce NaN. */
export function asin(x: number): number {
  return x >= 1 ? PI / 2 : x <= -1 ? -PI / 2 : Math.asin(x);
}

/** x reduced to [0, period). */
export function wrap(x: number, period: number): number {
  const r = x % period;
  return r < 0 ? r + period : r;
}

export function clamp(x: number, lo: number, hi: number): number {
  return x < lo ? lo : x > hi ? hi : x;
}
