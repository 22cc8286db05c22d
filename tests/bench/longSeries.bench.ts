/**
 * `sorbshare run` on a 36,500-day DOC series without draws (issue 8 target: ≤ 1.5 s wall, start-up
 * included): the invented demo project with its year of DOC and flow repeated 100 times (dates
 * continued day by day from 2000-01-01) and no uncertainty block. Prints the wall time of the
 * whole command and the CPU time of each part in-process (reading, the run, the text outputs,
 * results.xlsx), so that a loaded machine does not hide where the time goes; and the wall time of
 * the same run without the GAC carbon (the PAC-only project issue 8's target was set on: the GAC
 * carbon's column fit and fixed bed, about a second of CPU, do not grow with the days). Demo data
 * invented.
 */
import { spawnSync } from 'node:child_process';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { pipelineOutputs } from '../../src/outputFiles/pipelineOutputs.js';
import { resultsWorkbook } from '../../src/report/resultsWorkbook.js';
import type { BenchFigure } from './run.js';
import { pacOnlyProject } from './pacOnlyProject.js';

/** A copy of the demo project in `dir` with the series repeated `years` times and no draws. */
export function longSeriesProject(dir: string, years: number): string {
  cpSync(join(process.cwd(), 'fixtures/demo'), dir, { recursive: true });
  const lines = readFileSync(join(dir, 'site_series.csv'), 'utf8').trim().split('\n');
  const head = lines.filter((l) => l.startsWith('#') || l.startsWith('date'));
  const data = lines.filter((l) => /^\d{4}-/.test(l)).map((l) => l.split(',').slice(1).join(','));
  const out = [...head];
  let day = Date.UTC(2000, 0, 1);
  for (let y = 0; y < years; y++) for (const rest of data) { out.push(`${new Date(day).toISOString().slice(0, 10)},${rest}`); day += 86_400_000; }
  writeFileSync(join(dir, 'site_series.csv'), out.join('\n') + '\n');
  const project = JSON.parse(readFileSync(join(dir, 'project.json'), 'utf8')) as Record<string, unknown>;
  delete project.uncertainty;
  writeFileSync(join(dir, 'project.json'), JSON.stringify(project, null, 2));
  return join(dir, 'project.json');
}

const cpuMs = async <T>(f: () => T | Promise<T>): Promise<[T, number]> => {
  const c = process.cpuUsage();
  const r = await f();
  const d = process.cpuUsage(c);
  return [r, (d.user + d.system) / 1000];
};

export async function bench(): Promise<BenchFigure[]> {
  const dir = mkdtempSync(join(tmpdir(), 'sorbshare-long-'));
  try {
    const project = longSeriesProject(join(dir, 'p'), 100);
    const t = performance.now();
    const r = spawnSync(process.execPath, [join(process.cwd(), 'dist/cli/bin.js'), 'run', project, '--out', join(dir, 'o')], { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(r.stderr);
    const wall = performance.now() - t;
    // the same without the GAC carbon (its column fit and fixed bed do not depend on the days)
    const pac = pacOnlyProject(project);
    const walls: number[] = [];
    for (let k = 0; k < 3; k++) {
      const t1 = performance.now();
      const r1 = spawnSync(process.execPath, [join(process.cwd(), 'dist/cli/bin.js'), 'run', pac, '--out', join(dir, `pac${k}`)], { encoding: 'utf8' });
      if (r1.status !== 0) throw new Error(r1.stderr);
      walls.push(performance.now() - t1);
    }
    walls.sort((a, b) => a - b);
    const [input, load] = await cpuMs(() => loadProject(project));
    const [result, run] = await cpuMs(() => runPipeline(input));
    const [texts, outputs] = await cpuMs(() => pipelineOutputs(result, { toolVersion: 'bench', nodeVersion: process.version }));
    const [, xlsx] = await cpuMs(() => resultsWorkbook(Object.fromEntries(Object.entries(texts).filter(([n]) => n.endsWith('.csv')))));
    return [
      { name: 'sorbshare run, 36,500-day DOC series, no draws (wall, start-up and results.xlsx included)', value: +(wall / 1000).toFixed(2), unit: 's', target: '≤ 1.5 s' },
      { name: 'the same without the GAC carbon (wall, median of 3)', value: +(walls[1]! / 1000).toFixed(2), unit: 's', target: '≤ 1.5 s (issue 8)' },
      { name: '  reading the project and the series (CPU)', value: Math.round(load), unit: 'ms' },
      { name: '  the run (CPU)', value: Math.round(run), unit: 'ms' },
      { name: '  the text outputs: CSV, report, run.json (CPU)', value: Math.round(outputs), unit: 'ms' },
      { name: '  results.xlsx (CPU)', value: Math.round(xlsx), unit: 'ms' },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
