/**
 * The demo project's plain run (`runPipeline(loadProject(fixtures/demo/project.json, { demo: true }),
 * { now: 2026-01-01 })`, no Monte Carlo) computed once per test worker and shared by the test files
 * that only read it: several report and consistency tests used to make the same run each. The
 * result is deep-frozen, so a test that tried to change it fails at once instead of changing what
 * another file sees; a test that needs a changed input or result makes its own run.
 */
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';

/** The project file of the shared run. */
export const DEMO_PROJECT = join(__dirname, '../../fixtures/demo/project.json');
/** The run date of the shared run. */
export const DEMO_NOW = new Date('2026-01-01T00:00:00Z');

let shared: PipelineResult | undefined;

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
