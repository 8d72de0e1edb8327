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
