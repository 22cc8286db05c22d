export * from './projectTypes.js';
export { validateProject } from './validateProject.js';
