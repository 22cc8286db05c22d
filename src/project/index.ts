export * from './projectTypes.js';
export { validateProject } from './validateProject.js';
export { loadProject } from './loadProject.js';
