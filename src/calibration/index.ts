export * from './calibrate.js';
export * from './ebcComponent.js';
export * from './jarTestData.js';
export * from './jarTestModel.js';
export * from './leastSquares.js';
export * from './linearSystem.js';
export * from './nnls.js';
export * from './studentT.js';
