export * from './surrogateCurve.js';
export * from './uv254SetPoint.js';
export * from './siteCurveFit.js';
export * from './pilotCheck.js';
export * from './pilotCsv.js';
