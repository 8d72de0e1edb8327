// Public API of the dynamics context. The first-order propagation helpers (quantity.ts) stay inside.
export { G_SI, GM_SUN_SI, ROCHE_FLUID_COEFFICIENT, ROCHE_RIGID_COEFFICIENT } from './constants.js';
export {
  bulkDensityKgM3,
  massFromOrbitKg,
  orbitalPeriodSeconds,
  semiMajorAxisKm,
  sphereVolumeKm3,
} from './kepler.js';
export { rocheFluidKm, rocheLimitKm, rocheRigidKm } from './roche.js';
export {
  contextResonanceRatios,
  K_TO_ONE_MAX,
  meanMotionRatios,
  meanMotionResonanceKm,
  spinOrbitResonanceKm,
  type MeanMotionRatio,
} from './resonances.js';
export { hillRadiusKm } from './hill.js';
export * from './context.js';
