export * from './siteSeries.js';
export * from './seriesStats.js';
