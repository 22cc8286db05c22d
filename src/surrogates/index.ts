export * from './surrogateCurve.js';
export * from './siteCurveFit.js';
export * from './pilotCheck.js';
export * from './pilotCsv.js';
