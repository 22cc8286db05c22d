export * from './indicatorRule.js';
