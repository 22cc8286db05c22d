export * from './unitFactor.js';
export * from './parseQuantity.js';
export * from './freundlichK.js';
