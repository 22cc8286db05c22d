/**
 * Shared by `run` and `demo`: run the pipeline on a loaded project, write every output whole or
 * not at all, report progress on stderr for steps that take more than a second, and print a
 * short summary (or JSON) on stdout.
 */
import type { CommandContext } from '../commandSpec.js';
import { runPipeline } from '../../pipeline/runPipeline.js';
import { pipelineOutputs } from '../../pipeline/pipelineOutputs.js';
import type { PipelineInput, PipelineResult, ProgressEvent } from '../../pipeline/pipelineTypes.js';
import { writeOutputDir } from '../../io/writeOutputs.js';
import { VERSION } from '../../version.js';
import { fmt, table } from '../format.js';

/** A progress callback that prints a line once a step has run for more than a second. */
export function progressPrinter(ctx: CommandContext, thresholdMs = 1000): { onProgress: (e: ProgressEvent) => void; done: () => void } {
  let step = '';
  let stepStart = 0;
  let lastPrint = 0;
  let redrawn = false;
  const onProgress = (e: ProgressEvent) => {
    const now = Date.now();
    if (e.step !== step) {
      if (redrawn) { ctx.err('\n'); redrawn = false; }
      step = e.step; stepStart = now; lastPrint = 0;
      return;
    }
    if (now - stepStart < thresholdMs || now - lastPrint < 500) return;
    lastPrint = now;
    const text = `sorbshare: ${e.step} … ${e.done}/${e.total}`;
    if (ctx.isTTY) { ctx.err(`\r${text}`); redrawn = true; } else ctx.err(`${text}\n`);
  };
  return { onProgress, done: () => { if (redrawn) ctx.err('\n'); } };
}

export interface RunSummaryJson {
  out_dir: string;
  files: string[];
  carbons: Array<{
    carbon: string; type: string; required_dose_mg_per_L: number | null; governed_by: string | null; governing_compound: string | null;
    governing_dose_mg_per_L: number | null; indicator_dose_mg_per_L: number | null; cost_per_m3: number | null; currency: string;
    yearly_carbon_kg: number | null; yearly_cost: number | null; indicator_mean_percent: number | null;
  }>;
  warnings: string[];
}

export function summaryJson(r: PipelineResult, outDir: string, files: string[]): RunSummaryJson {
  return {
    out_dir: outDir,
    files,
    carbons: r.carbons.map((c) => ({
      carbon: c.carbon.name, type: c.carbon.type,
      required_dose_mg_per_L: c.required?.doseMgPerL ?? null, governed_by: c.required?.governedBy ?? null,
      governing_compound: c.required?.governing?.compoundId ?? null, governing_dose_mg_per_L: c.required?.governing?.doseMgPerL ?? null,
      indicator_dose_mg_per_L: c.required?.indicator?.doseMgPerL ?? null,
      cost_per_m3: c.costPerM3 ?? null, currency: c.carbon.currency,
      yearly_carbon_kg: c.yearly?.carbonKg ?? null, yearly_cost: c.yearly?.cost ?? null,
      indicator_mean_percent: c.indicator?.set.meanRemovalPercent ?? null,
    })),
    warnings: r.warnings,
  };
}

/** Run, write and print. */
export function runAndWrite(input: PipelineInput, outDir: string, json: boolean, ctx: CommandContext): void {
  const progress = progressPrinter(ctx);
  const result = runPipeline(input, { onProgress: progress.onProgress });
  progress.done();
  const files = pipelineOutputs(result, { toolVersion: VERSION, nodeVersion: process.version, platform: `${process.platform}-${process.arch}` });
  writeOutputDir(outDir, files);
  const names = Object.keys(files);
  const s = summaryJson(result, outDir, names);
  if (json) { ctx.out(JSON.stringify(s, null, 2)); return; }
  const rows = s.carbons.map((c) => [
    c.carbon, c.required_dose_mg_per_L === null ? '—' : fmt(c.required_dose_mg_per_L, 3), c.governed_by ?? '—',
    c.cost_per_m3 === null ? '—' : `${fmt(c.cost_per_m3, 3)} ${c.currency}`, c.yearly_carbon_kg === null ? '—' : fmt(c.yearly_carbon_kg / 1000, 3),
    c.yearly_cost === null ? '—' : `${Math.round(c.yearly_cost).toLocaleString('en-US')} ${c.currency}`,
    c.indicator_mean_percent === null ? '—' : fmt(c.indicator_mean_percent, 3),
  ]);
  ctx.out([
    `${result.project.name}`,
    '',
    table(['carbon', 'dose mg/L', 'governed by', 'cost per m³', 't/year', 'cost per year', 'indicator mean %'], rows),
    '',
    ...(result.warnings.length ? ['Warnings:', ...result.warnings.map((w) => `  - ${w}`), ''] : []),
    `Wrote ${names.join(', ')} to ${outDir}`,
    'Planning estimates from equilibrium models: confirm with jar and pilot tests (see the cautions in summary.md).',
  ].join('\n'));
}
