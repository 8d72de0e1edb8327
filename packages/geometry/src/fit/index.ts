// Public face of the fits: the limb ellipse, the rings, and the ellipse model the client's plot draws with.
export {
  ellipseOutline,
  ellipseRadiusKm,
  equivalentRadiusKm,
  normaliseEllipse,
  radialResidualKm,
} from './ellipse.js';
export { fitLimb, limbChi2, limbChi2Function } from './limb-fit.js';
export type { LimbFitInput, LimbFitResult, LimbPoint, NegativePath } from './limb-fit.js';
export { fitRing, ringPlaneRadiusKm } from './ring-fit.js';
export type { RingFitInput, RingFitResult, RingPoint } from './ring-fit.js';
export { mulberry32 } from './prng.js';
export { fitLimbAndRings } from './joint-limb-ring.js';
export type { JointLimbRingInput, JointLimbRingResult, JointRingResult } from './joint-limb-ring.js';
export { ringPolesWithUncertainty } from './pole-uncertainty.js';
export { normalMatrixCovariance, propagateCovariance, sampledCovariance, subMatrix } from './covariance.js';
export { CHI2_MAP_LEVELS, contourSegments } from './chi2-map.js';
export type { Chi2Level, ContourSegment } from './chi2-map.js';
export {
  CHI2_MAP_DEFAULT_HALF_WIDTH_SIGMA,
  CHI2_MAP_DEFAULT_STEPS,
  CHI2_MAP_MAX_STEPS,
  CHI2_MAP_MIN_STEPS,
  chi2MapOfFit,
  chi2MapParameters,
  chi2MapSteps,
  planChi2Map,
} from './chi2-map-of-fit.js';
export type {
  Chi2Map,
  Chi2MapAxis,
  Chi2MapParameter,
  Chi2MapRange,
  Chi2MapRequest,
  Chi2MapUnit,
} from './chi2-map-of-fit.js';
export { ACCEPTANCE_RANGE, MIN_EFFECTIVE_SAMPLES } from './sampler-diagnostics.js';
