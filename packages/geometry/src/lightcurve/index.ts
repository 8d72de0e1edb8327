export { fresnel, straightEdgeIntensity, type FresnelPair } from './fresnel.js';
export {
  buildEdgeProfile,
  fresnelScaleKm,
  profileAt,
  boxMean,
  type EdgeProfile,
  type EdgeProfileOptions,
} from './edge-profile.js';
export {
  fitTiming,
  fitMainEvent,
  edgeSpeedsOf,
  type EdgeOutside,
  searchDips,
  type MainEventFit,
  DEFAULT_DETECTION_SIGMA,
  MAX_DIP_SECONDS,
  type TimingInput,
  type TimingResult,
  type TimedEdge,
  type DipResult,
} from './timing.js';
export { starAngularDiameterMasFromVK, starDiameterKmFromMas } from './star.js';
export {
  dipProducts,
  type DipProducts,
  type DipLowerLimits,
  type DipResolution,
  type OpeningAngle,
} from './dip-products.js';
export { limbCrossing, predictedLimb, type LimbCrossing } from './edge-speed.js';
export type { EdgeSpeeds } from './well-model.js';
