export * from './checkCase.js';
