/**
 * Shared by `run` and `demo`: run the pipeline on a loaded project, write every output whole or
 * not at all, report progress on stderr for steps that take more than a second, and print a
 * short summary (or JSON) on stdout.
 */
import type { CommandContext } from '../commandSpec.js';
import { runPipelineWithUncertainty } from '../../pipeline/runWithUncertainty.js';
import { createProgressBar, type ProgressBar } from '../progressBar.js';
import { pipelineOutputs, pipelineTables } from '../../outputFiles/pipelineOutputs.js';
import type { PipelineInput, PipelineResult, ProgressEvent } from '../../pipeline/pipelineTypes.js';
import { writeOutputDir } from '../../io/writeOutputs.js';
import { reportPdf, requireChromium } from '../../io/reportPdf.js';
import { resultsWorkbookThreaded, startWorkbookThread, workbookThreadAhead } from '../workbookThread.js';
import { checkOutputFolder } from '../../io/outputChecks.js';
import { assertFiniteResult } from '../../scenario/finiteResult.js';
import { VERSION } from '../../version.js';
import { fmt, fmtCount, table } from '../format.js';
import { contactSummary, type ContactSummaryJson } from '../../output/contactRecord.js';
import { snakeCaseJsonText } from '../../output/snakeCaseJson.js';
import { gacSummaryJson, gacSummaryLine, type GacSummaryJson } from '../../output/gacRunJson.js';

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
    /** UV254 reduction at the required dose (the operator's set-point), percent. */
    uv254_setpoint_percent: number | null;
    /** Monte Carlo percentiles of the governing dose (mg/L) and yearly cost. */
    monte_carlo: { draws: number; seed: number; governing_dose_mg_per_L: { p10: number; p50: number; p90: number }; yearly_cost: { p10: number; p50: number; p90: number } | null } | null;
    /** GAC: the kinetic run length with the equilibrium bound beside it, or the equilibrium estimate alone (src/output/gacRunJson.ts). */
    gac: GacSummaryJson | null;
  } & Partial<ContactSummaryJson>>;
  pilot_outliers: string[] | null;
  warnings: string[];
}

export function summaryJson(r: PipelineResult, outDir: string, files: string[]): RunSummaryJson {
  return {
    out_dir: outDir,
    files,
    carbons: r.carbons.map((c) => ({
      carbon: c.carbon.name, type: c.carbon.type,
      required_dose_mg_per_L: c.required?.doseMgPerL ?? null, governed_by: c.required?.governedBy ?? c.gacKinetic?.run.governedBy ?? null,
      governing_compound: c.required?.governing?.compoundId ?? null, governing_dose_mg_per_L: c.required?.governing?.doseMgPerL ?? null,
      indicator_dose_mg_per_L: c.required?.indicator?.doseMgPerL ?? null,
      cost_per_m3: c.costPerM3 ?? null, currency: c.carbon.currency,
      yearly_carbon_kg: c.yearly?.carbonKg ?? null, yearly_cost: c.yearly?.cost ?? null,
      indicator_mean_percent: c.indicator?.set.meanRemovalPercent ?? null,
      uv254_setpoint_percent: c.surrogates?.atRequiredDose?.uv254Reduction != null ? c.surrogates.atRequiredDose.uv254Reduction * 100 : null,
      monte_carlo: c.uncertainty ? (() => {
        const q = (k: string) => c.uncertainty!.result.quantities.find((x) => x.key === k);
        const g = q('governing_dose')!;
        const y = q('yearly_cost');
        return { draws: c.uncertainty.result.draws, seed: c.uncertainty.result.seed, governing_dose_mg_per_L: { p10: g.p10, p50: g.p50, p90: g.p90 }, yearly_cost: y ? { p10: y.p10, p50: y.p50, p90: y.p90 } : null };
      })() : null,
      gac: gacSummaryJson(c),
      ...contactSummary(c),
    })),
    pilot_outliers: r.pilot ? r.pilot.check.outlierCompounds : null,
    warnings: r.warnings,
  };
}

/**
 * A Monte Carlo progress bar on stderr that appears only on long runs: once the draws have taken
 * `thresholdMs` (default 1 s, as for the other steps), so short runs keep stderr quiet.
 */
export function monteCarloProgress(ctx: CommandContext, thresholdMs = 1000, now: () => number = () => performance.now()): { update: (done: number, total: number) => void; finish: () => void } {
  let start: number | undefined;
  let bar: ProgressBar | undefined;
  return {
    update(done, total) {
      const t = now();
      start ??= t;
      if (!bar && t - start >= thresholdMs && done < total) bar = createProgressBar({ total, label: 'sorbshare: Monte Carlo', write: ctx.err, isTTY: ctx.isTTY });
      bar?.update(done);
    },
    finish() { bar?.finish(); },
  };
}

/** Run, write and print. */
export async function runAndWrite(input: PipelineInput, outDir: string, json: boolean, ctx: CommandContext, mc: { draws?: number; seed?: number } = {}, formats: { pdf?: boolean } = {}): Promise<void> {
  checkOutputFolder(outDir, input.provenance.files.map((f) => f.resolved));
  if (formats.pdf) requireChromium(); // before the run: a missing browser fails at once
  // a long run's workbook worker boots beside the pipeline; it is ended if the run fails
  const started = workbookThreadAhead(input) ? startWorkbookThread() : undefined;
  let files: Record<string, string | Uint8Array>;
  let result: PipelineResult;
  try {
    const progress = progressPrinter(ctx);
    const bar = monteCarloProgress(ctx);
    result = await runPipelineWithUncertainty(input, { ...mc, onProgress: progress.onProgress, onMonteCarloProgress: (d, t) => bar.update(d, t) });
    bar.finish();
    progress.done();
    assertFiniteResult(result, result.project.carbons.map((c) => c.name));
    // every output is made before anything is written (whole or nothing); results.xlsx is made
    // (a large one on a worker thread, its parts compressed on the thread pool) while the report
    // and run.json are made
    const tables = pipelineTables(result);
    const workbook = resultsWorkbookThreaded(tables, new Date(result.generatedAt), started);
    workbook.catch(() => undefined); // awaited below; a failure of the texts first must not leave it unhandled
    const texts = pipelineOutputs(result, { toolVersion: VERSION, nodeVersion: process.version, platform: `${process.platform}-${process.arch}` }, tables);
    files = { ...texts, 'results.xlsx': await workbook };
    if (formats.pdf) files['report.pdf'] = await reportPdf(texts['report.html']);
  } finally {
    await started?.release();
  }
  writeOutputDir(outDir, files);
  const names = Object.keys(files);
  const s = summaryJson(result, outDir, names);
  if (json) { ctx.out(snakeCaseJsonText(s)); return; }
  const rows = s.carbons.map((c) => [
    c.carbon, c.required_dose_mg_per_L === null ? '—' : fmt(c.required_dose_mg_per_L, 3),
    c.required_dose_mg_per_L === null ? '—' : fmt(c.required_dose_mg_per_L / result.project.site.docMgPerL, 3),
    c.governed_by ?? (c.gac ? 'GAC: bed life below' : '—'),
    c.cost_per_m3 === null ? '—' : `${fmt(c.cost_per_m3, 3)} ${c.currency}`, c.yearly_carbon_kg === null ? '—' : fmt(c.yearly_carbon_kg / 1000, 3),
    c.yearly_cost === null ? '—' : `${Math.round(c.yearly_cost).toLocaleString('en-US')} ${c.currency}`,
    c.indicator_mean_percent === null ? '—' : fmt(c.indicator_mean_percent, 3),
  ]);
  const extra: string[] = [];
  for (const c of s.carbons) {
    if (c.uv254_setpoint_percent !== null) extra.push(`${c.carbon}: UV254-reduction set-point ${fmt(c.uv254_setpoint_percent, 3)} % at the required dose`);
    if (c.monte_carlo) extra.push(`${c.carbon}: governing dose P10–P50–P90 ${fmt(c.monte_carlo.governing_dose_mg_per_L.p10, 3)}–${fmt(c.monte_carlo.governing_dose_mg_per_L.p50, 3)}–${fmt(c.monte_carlo.governing_dose_mg_per_L.p90, 3)} mg/L (${c.monte_carlo.draws} draws, seed ${c.monte_carlo.seed})`);
    if (c.gac) extra.push(gacSummaryLine(c.carbon, c.gac));
  }
  if (s.pilot_outliers) extra.push(`Pilot check: ${s.pilot_outliers.length ? `measured removal outside the band of the prediction for ${s.pilot_outliers.join(', ')}` : 'every compound within the band'}`);
  ctx.out([
    `${result.project.name}`,
    '',
    table(['carbon', 'dose mg/L', 'mg/mg DOC', 'governed by', 'cost per m³', 't/year', 'cost per year', 'indicator mean %'], rows),
    '',
    ...(extra.length ? [...extra, ''] : []),
    ...(result.warnings.length ? ['Warnings:', ...result.warnings.map((w) => `  - ${w}`), ''] : []),
    `Wrote ${names.join(', ')} to ${outDir}`,
    'Planning estimates from adsorption models: confirm with jar and pilot tests (see the cautions in summary.md).',
  ].join('\n'));
}
