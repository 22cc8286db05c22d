export * from './calibrate.js';
export * from './ebcComponent.js';
export * from './jarTestData.js';
export * from './jarTestModel.js';
