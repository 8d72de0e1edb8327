// Public face of the prediction: the computation behind `limbus predict` and its document's shapes.
export { predictEvent } from './predict-event.js';
export { MAX_PATH_TIMES, MAX_STEP_SECONDS, MIN_STEP_SECONDS, predictionWindow } from './window.js';
export type { PredictionWindow } from './window.js';
export { PREDICTION_FORMAT } from './types.js';
export type {
  ClosestApproach,
  MasPair,
  PathLimits,
  PathPoint,
  Prediction,
  PredictionRing,
  PredictionSettings,
  RingPath,
  StationPrediction,
  StationRingWindow,
} from './types.js';
