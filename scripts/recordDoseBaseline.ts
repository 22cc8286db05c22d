/**
 * Records the doses the dose searches gave before they were merged into one (src/design), so a
 * test can show the merged search returns the same doses within 1e-10 (relative):
 *   - the random problems of the dose-search property test (tests/design/doseSearch.test.ts: the
 *     same generators and seed 5, sampled with fast-check);
 *   - every project in fixtures (demo and test projects): each PAC carbon's compound doses, the
 *     indicator-mean dose and the required dose at the design DOC, and the daily doses.
 * Run once, before the change: `npx tsx scripts/recordDoseBaseline.ts` (writes
 * fixtures/design/dose-baseline.json). Kept for the record; rerunning it after the change
 * records the new search instead.
 */
import fc from 'fast-check';
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { prepareMixture, type FreundlichComponent } from '../src/equilibrium/preparedMixture.js';
import { doseForRemoval } from '../src/design/doseForRemoval.js';
import { loadProject } from '../src/io/loadProject.js';
import { runPipeline } from '../src/pipeline/runPipeline.js';

const logUniform = (lo: number, hi: number) => fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => Math.pow(10, e));
const arb = fc.tuple(
  fc.array(fc.record({ c0MgPerL: logUniform(0.05, 5), K: logUniform(0.5, 300), oneOverN: fc.double({ min: 0.1, max: 0.6, noNaN: true }) }), { minLength: 1, maxLength: 5 }),
  logUniform(1e-6, 1e-3), logUniform(5, 500), fc.double({ min: 0.15, max: 0.9, noNaN: true }), fc.double({ min: 0.05, max: 0.95, noNaN: true }),
);
const random = fc.sample(arb, { numRuns: 300, seed: 5 }).map(([bg, c0T, KT, bT, R]) => {
  const components: FreundlichComponent[] = [...bg.map((c, i) => ({ id: `B${i}`, ...c })), { id: 'T', c0MgPerL: c0T, K: KT, oneOverN: bT }];
  let doseGPerL: number | null;
  try { doseGPerL = doseForRemoval(prepareMixture(components), components.length - 1, R).doseGPerL; } catch { doseGPerL = null; }
  return { components, removalFraction: R, doseGPerL };
});

const root = fileURLToPath(new URL('..', import.meta.url));
const projects = ['fixtures/demo/project.json', 'fixtures/project/background-file/project.json', 'fixtures/project/ebc-background/project.json', 'fixtures/project/surrogates-gac-mc/project.json'];
const runs = projects.map((p) => {
  const res = runPipeline(loadProject(root + p, { demo: p.includes('demo') }), { now: new Date(0) });
  return {
    project: p,
    carbons: res.carbons.filter((c) => c.required).map((c) => ({
      carbon: c.carbon.name,
      compounds: c.required!.compounds.map((d) => ({ id: d.compoundId, status: d.status, doseMgPerL: d.doseMgPerL })),
      indicatorDoseMgPerL: c.required!.indicator?.doseMgPerL ?? null,
      requiredDoseMgPerL: c.required!.doseMgPerL,
      governedBy: c.required!.governedBy,
      daily: c.daily ? c.daily.rows.map((r) => [r.docMgPerL, r.doseMgPerL, r.governedBy]) : null,
    })),
  };
});
writeFileSync(root + 'fixtures/design/dose-baseline.json', JSON.stringify({ note: 'doses before the dose searches were merged (scripts/recordDoseBaseline.ts)', random, runs }) + '\n');
console.log(`stored ${random.length} random problems (${random.filter((r) => r.doseGPerL === null).length} unreachable) and ${runs.length} projects`);
