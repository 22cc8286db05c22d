/**
 * The demo project's runs that several test files only read, computed once per test worker:
 * the plain run (`runPipeline(loadProject(fixtures/demo/project.json, { demo: true }),
 * { now: 2026-01-01 })`, no Monte Carlo) and the run with 40 Monte Carlo draws (seed 3, the
 * project's other uncertainty settings). Several report and consistency tests used to make the
 * same run each. The results are deep-frozen, so a test that tried to change one fails at once
 * instead of changing what another file sees; a test that needs a changed input or result makes
 * its own run.
 */
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { runPipelineWithUncertainty } from '../../src/pipeline/runWithUncertainty.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';

/** The project file of the shared run. */
export const DEMO_PROJECT = join(__dirname, '../../fixtures/demo/project.json');
/** The run date of the shared run. */
export const DEMO_NOW = new Date('2026-01-01T00:00:00Z');

let shared: PipelineResult | undefined;
let sharedWithDraws: Promise<PipelineResult> | undefined;

function deepFreeze<T>(value: T, seen = new Set<unknown>()): T {
  if (value === null || typeof value !== 'object' || seen.has(value) || ArrayBuffer.isView(value)) return value;
  seen.add(value);
  for (const v of Object.values(value as object)) deepFreeze(v, seen);
  if (value instanceof Map) for (const [k, v] of value) { deepFreeze(k, seen); deepFreeze(v, seen); }
  if (value instanceof Set) for (const v of value) deepFreeze(v, seen);
  return Object.freeze(value);
}

/** The worker's one plain demo run (deep-frozen: read only). */
export function sharedDemoPipeline(): PipelineResult {
  shared ??= deepFreeze(runPipeline(loadProject(DEMO_PROJECT, { demo: true }), { now: DEMO_NOW }));
  return shared;
}

/** The Monte Carlo settings of the shared run with draws. */
export const DEMO_DRAWS = { draws: 40, seed: 3 } as const;

/** The worker's one demo run with `DEMO_DRAWS` Monte Carlo draws (deep-frozen: read only). */
export function sharedDemoPipelineWithDraws(): Promise<PipelineResult> {
  sharedWithDraws ??= runPipelineWithUncertainty(loadProject(DEMO_PROJECT, { demo: true }), { now: DEMO_NOW, ...DEMO_DRAWS }).then((r) => deepFreeze(r));
  return sharedWithDraws;
}
