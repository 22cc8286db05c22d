export * from './gacEstimate.js';
