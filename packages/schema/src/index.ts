export {
  EVENT_FORMAT,
  POSITIVE_CHORD_NEEDS_AN_EDGE,
  eventFileSchema,
  utcTimeSchema,
  validateEventFile,
  validatePredictionEventFile,
  predictionSpanProblems,
  type EventFile,
  type EventValidation,
  type PredictionEventValidation,
} from './event-file.js';
export {
  SOLUTION_FORMAT,
  solutionFileSchema,
  validateSolutionFile,
  type SolutionValidation,
} from './solution-file.js';
export { formatPath, type Problem } from './problems.js';
export { parseUtcTime, parseZonelessTime } from './iso-time.js';
export * from './context-input.js';
export * from './api.js';
export * from './light-curve-csv.js';
export * from './text.js';
export * from './team.js';
export * from './bodies.js';
export * from './angles.js';
export * from './views.js';
export * from './prediction.js';
export * from './planning.js';
export * from './chi2-map.js';
export * from './timing.js';
