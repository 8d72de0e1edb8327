export * from './types.js';
export * from './dynamics/index.js';
