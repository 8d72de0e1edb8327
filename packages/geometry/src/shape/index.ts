// Public API of the shape module; its small vector helpers (frames.ts) stay inside.
export { carlsonRD } from './carlson.js';
export {
  equilibriumDensityKgM3,
  indexSymbols,
  jacobiEllipsoid,
  maclaurinOmega2,
  type IndexSymbols,
} from './equilibrium.js';
export { bodyToEquatorial, skyBasis } from './frames.js';
export { conicAxes, projectEllipsoid, type ApparentEllipse, type SemiAxesKm } from './projection.js';
export * from './shape-fit.js';
