/**
 * The removal models by name, for callers that receive plain data (the Monte Carlo problem sent
 * to worker threads names its model). Register a new model here beside `equilibrium`.
 */
import { equilibriumRemoval } from './equilibriumRemoval.js';
import type { RemovalModelFactory } from './removalModel.js';

export const REMOVAL_MODELS: Readonly<Record<string, RemovalModelFactory>> = {
  equilibrium: equilibriumRemoval,
};

export type RemovalModelName = keyof typeof REMOVAL_MODELS & string;
