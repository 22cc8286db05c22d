export * from './backgroundFile.js';
export * from './backgroundPrediction.js';
export * from './defaultKGrid.js';
export * from './isothermData.js';
export * from './isothermModel.js';
export * from './fitBackground.js';
export * from './uv254Fit.js';
export * from './fractionate.js';
