export * from './brent.js';
export * from './leastSquares.js';
export * from './linearSystem.js';
export * from './nnls.js';
export * from './studentT.js';
export * from './percentile.js';
export * from './logSpace.js';
