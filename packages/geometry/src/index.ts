export * from './types.js';
export * from './dynamics/index.js';
export * from './lightcurve/index.js';
export * from './joint/index.js';
export * from './shape/index.js';
