/**
 * The library exports a documented public API: every runtime export of src/index.ts has a doc
 * comment (`/** … *\/`) right above its declaration or is named by its file's opening doc comment, and the internal steps and helpers that
 * used to leak (pipeline steps, CSV writers, random-number generators, least squares) are not
 * exported. The names the README and the tests import stay available.
 */
import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import * as api from '../../src/index.js';

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? sourceFiles(p) : p.endsWith('.ts') && !p.endsWith('index.ts') ? [p] : [];
  });
}

/** Export aliases of src/index.ts ("summarise as summariseSeries" → summariseSeries: summarise). */
function aliases(): Map<string, string> {
  const text = readFileSync('src/index.ts', 'utf8');
  return new Map([...text.matchAll(/\b(\w+) as (\w+)\b/g)].map((m) => [m[2]!, m[1]!] as const));
}

describe('public API', () => {
  it('gives every runtime export a doc comment at its declaration', () => {
    const files = sourceFiles('src').map((f) => ({ f, lines: readFileSync(f, 'utf8').split('\n') }));
    const alias = aliases();
    const undocumented: string[] = [];
    for (const name of Object.keys(api)) {
      const local = alias.get(name) ?? name;
      const decl = new RegExp(`^export (async )?(function\\*?|class|const|let) ${local}\\b`);
      const hit = files.flatMap(({ f, lines }) => lines.flatMap((l, i) => (decl.test(l) ? [{ f, before: lines.slice(0, i).reverse().find((x) => x.trim() !== '')?.trim() ?? '' }] : [])));
      if (hit.length === 0) { undocumented.push(`${name} (declaration not found)`); continue; }
      // documented: a doc comment right above, or the opening doc comment of a file that names it or is named after it (one concept per file)
      const header = (f: string) => /^\/\*\*[\s\S]*?\*\//.exec(readFileSync(f, 'utf8'))?.[0] ?? '';
      if (!hit.some((h) => h.before.endsWith('*/') || (header(h.f) !== '' && (h.f.endsWith(`/${local}.ts`) || new RegExp(`\\b${local}\\b`).test(header(h.f)))))) undocumented.push(`${name} (${hit[0]!.f})`);
    }
    expect(undocumented).toEqual([]);
  });

  it('keeps internal steps and helpers out', () => {
    const internal = ['surrogateStep', 'pilotStep', 'gacStep', 'uncertaintyStep', 'buildSystems', 'carbonModel', 'competitionSets', 'designProblem', 'indicatorPlan',
      'surrogatesCsv', 'setpointsCsv', 'uncertaintyCsv', 'runChunk', 'compileDrawModel', 'seededRng', 'Xoshiro128', 'cholesky', 'fitLeastSquares', 'nnls', 'studentTQuantile',
      'interpolateDose', 'seriesSegments', 'reportPlotIds', 'renderPlot'];
    expect(internal.filter((n) => n in api)).toEqual([]);
  });

  it('keeps what the README, the demo generator and the kinetic and fixed-bed blocks use', () => {
    const used = ['equilibrium', 'equilibriumCurve', 'doseFor', 'loadingsAt', 'fractionate', 'calibrate', 'loadProject', 'runPipeline', 'runPipelineWithUncertainty', 'pipelineOutputs', 'VERSION',
      'backgroundComponents', 'ISOTHERM_COLUMNS', 'prepareMixture', 'readCsvTable', 'solveBatchPrepared', 'parseQuantity', 'unitFactor', 'freundlichKToInternal', 'InputError', 'ComputationError',
      'simulateFixedBed', 'column', 'fitColumn', 'staggeredRun', 'pacBatch', 'stirredReactor', 'contactOverTime', 'contactSteadyState', 'contactDose', 'calibrateKinetics', 'integrateImplicit', 'denseLu'];
    expect(used.filter((n) => !(n in api))).toEqual([]);
  });
});
