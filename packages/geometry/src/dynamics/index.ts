export * from './constants.js';
export * from './quantity.js';
export * from './kepler.js';
export * from './roche.js';
export * from './resonances.js';
export * from './hill.js';
export * from './context.js';
