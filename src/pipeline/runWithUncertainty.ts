/**
 * The whole job with the Monte Carlo step: `runPipeline` (synchronous, capabilities 8–12), then
 * the Monte Carlo over isotherm and background parameters (capability 13, asynchronous because it
 * may run on worker threads). The Monte Carlo settings come from the project's `uncertainty`
 * section, with `draws` / `seed` overriding it (the CLI's --draws, --seed); draws 0 switches it
 * off and the result is then exactly `runPipeline`'s. GAC carbons with a kinetic run length then get
 * draws of it (src/pipeline/gacUncertainty.ts, `uncertainty.gac_draws`), begun on a worker thread
 * beside the PAC draws (`startGacUncertainty`; the same figures as in one thread). When the
 * project's GAC draws will be shared with a worker and a core is free (`spareCore`), the worker is
 * started before `runPipeline`, so that its start-up runs beside the pipeline
 * (`startTraceOutletWorker`).
 *
 * @throws InputError on inconsistent inputs; ComputationError if a solver fails.
 */
import { runPipeline } from './runPipeline.js';
import { resolveUncertaintySettings, uncertaintyStep, withUncertainty } from './uncertaintyStep.js';
import { gacDrawCount, startGacUncertainty } from './gacUncertainty.js';
import { SHARED_MIN_TARGETS_STARTED, spareCore, startTraceOutletWorker } from '../uncertainty/sharedTraceOutlets.js';
import type { PipelineInput, PipelineResult, UncertaintyRunOptions } from './pipelineTypes.js';

/** The whole job with the Monte Carlo step (see the file's opening comment); draws 0 gives exactly `runPipeline`'s result. */
export async function runPipelineWithUncertainty(input: PipelineInput, options: UncertaintyRunOptions = {}): Promise<PipelineResult> {
  const overrides: { draws?: number; seed?: number } = {};
  if (options.draws !== undefined) overrides.draws = options.draws;
  if (options.seed !== undefined) overrides.seed = options.seed;
  const settings = resolveUncertaintySettings(input.project.uncertainty, overrides);
  // a GAC carbon whose draws will go to a worker: start it now (it boots beside the pipeline)
  const gacOutlets = settings ? gacDrawCount(settings) * input.project.compounds.length : 0;
  const started = options.workers !== 0 && gacOutlets >= SHARED_MIN_TARGETS_STARTED && input.project.carbons.some((c) => c.type === 'GAC' && c.bedKinetics) && spareCore() ? startTraceOutletWorker() : undefined;
  let result: PipelineResult;
  try {
    result = runPipeline(input, options);
  } catch (e) {
    await started?.release();
    throw e;
  }
  if (!settings) { await started?.release(); return result; }
  const o: Parameters<typeof uncertaintyStep>[3] = {};
  if (options.onMonteCarloProgress) o.onMonteCarloProgress = options.onMonteCarloProgress;
  if (options.workers !== undefined) o.workers = options.workers;
  if (options.kinetic !== undefined) o.kinetic = options.kinetic;
  // the GAC draws begin on a worker thread beside the PAC draws, then the two threads share what is left
  const gac = startGacUncertainty(result, settings, { ...(options.workers !== undefined ? { workers: options.workers } : {}), ...(started ? { started } : {}) });
  await started?.release(); // not taken by the GAC draws (e.g. the GAC run was skipped)
  let pac: Awaited<ReturnType<typeof uncertaintyStep>>;
  try {
    pac = await uncertaintyStep(result, input, settings, o);
  } catch (e) {
    await gac.cancel();
    throw e;
  }
  return gac.finish(withUncertainty(result, pac));
}
