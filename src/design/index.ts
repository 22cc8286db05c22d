export * from './removalModel.js';
export * from './equilibriumRemoval.js';
export * from './doseSearch.js';
export * from './removalExcess.js';
export * from './doseForRemoval.js';
