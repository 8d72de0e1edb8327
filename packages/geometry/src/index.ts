export * from './types.js';
export * from './dynamics/index.js';
export * from './lightcurve/index.js';
export * from './joint/index.js';
export * from './shape/index.js';
export * from './fit/index.js';
export * from './placement/index.js';
export * from './predict/index.js';
export { projectEvent } from './project.js';
export { shadowMotionAt } from './shadow-motion.js';
export type { ShadowMotion } from './shadow-motion.js';
export type { ProjectedEvent, ProjectOptions, RingDip, SkyPlaneBasis } from './project.js';
export { solveEvent, DEFAULT_SEED } from './solve.js';
export { ENGINE_VERSION } from './version.js';
export { ringPoles, ringPoleVector, ringAnglesFromPole } from './astro/ring-pole.js';
export type { RaDecDeg } from './astro/ring-pole.js';
export { starDirection, skyPlaneBasis } from './astro/star.js';
export { buildEphemeris } from './astro/ephemeris.js';
export type { Ephemeris } from './astro/ephemeris.js';
export { geodeticToEarthFixedKm, EarthOrientation } from './astro/station.js';
export { greenwichMeanSiderealTimeRad, greenwichApparentSiderealTimeRad } from './astro/earth-rotation.js';
export {
  utcIsoToTtSeconds,
  isoToTtSeconds,
  ttSecondsToUtcIso,
  ttSecondsToUt1Seconds,
  ttToTdbSeconds,
  tdbToTtSeconds,
  taiMinusUtcSeconds,
  julianDateFromJ2000Seconds,
  TT_MINUS_TAI_SECONDS,
} from './time/scales.js';
