export * from './prng.js';
export * from './distributions.js';
export * from './monteCarloProblem.js';
export { compileDrawModel, sampleParameters, evaluateDraw, runChunk, drawModel, type DrawModel, type DrawnParameters, type QuantityDef, type ChunkResult } from './monteCarloDraw.js';
export * from './monteCarlo.js';
export * from './parallelMonteCarlo.js';
