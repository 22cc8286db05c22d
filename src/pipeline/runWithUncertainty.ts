/**
 * The whole job with the Monte Carlo step: `runPipeline` (synchronous, capabilities 8–12), then
 * the Monte Carlo over isotherm and background parameters (capability 13, asynchronous because it
 * may run on worker threads). The Monte Carlo settings come from the project's `uncertainty`
 * section, with `draws` / `seed` overriding it (the CLI's --draws, --seed); draws 0 switches it
 * off and the result is then exactly `runPipeline`'s. GAC carbons with a kinetic run length then get
 * draws of it (src/pipeline/gacUncertainty.ts, `uncertainty.gac_draws`), begun on a worker thread
 * beside the PAC draws (`startGacUncertainty`; the same figures as in one thread).
 *
 * @throws InputError on inconsistent inputs; ComputationError if a solver fails.
 */
import { runPipeline } from './runPipeline.js';
import { resolveUncertaintySettings, uncertaintyStep, withUncertainty } from './uncertaintyStep.js';
import { startGacUncertainty } from './gacUncertainty.js';
import type { PipelineInput, PipelineResult, UncertaintyRunOptions } from './pipelineTypes.js';

/** The whole job with the Monte Carlo step (see the file's opening comment); draws 0 gives exactly `runPipeline`'s result. */
export async function runPipelineWithUncertainty(input: PipelineInput, options: UncertaintyRunOptions = {}): Promise<PipelineResult> {
  const result = runPipeline(input, options);
  const overrides: { draws?: number; seed?: number } = {};
  if (options.draws !== undefined) overrides.draws = options.draws;
  if (options.seed !== undefined) overrides.seed = options.seed;
  const settings = resolveUncertaintySettings(input.project.uncertainty, overrides);
  if (!settings) return result;
  const o: Parameters<typeof uncertaintyStep>[3] = {};
  if (options.onMonteCarloProgress) o.onMonteCarloProgress = options.onMonteCarloProgress;
  if (options.workers !== undefined) o.workers = options.workers;
  if (options.kinetic !== undefined) o.kinetic = options.kinetic;
  // the GAC draws begin on a worker thread beside the PAC draws, then the two threads share what is left
  const gac = startGacUncertainty(result, settings, options.workers !== undefined ? { workers: options.workers } : {});
  let pac: Awaited<ReturnType<typeof uncertaintyStep>>;
  try {
    pac = await uncertaintyStep(result, input, settings, o);
  } catch (e) {
    await gac.cancel();
    throw e;
  }
  return gac.finish(withUncertainty(result, pac));
}
