/**
 * A synthetic pilot data set for the surrogates-gac-mc fixture (invented): the model's own relation
 * between UV254 reduction and removal at a few doses, every compound exactly on it except the
 * shifts given (percentage points). Used by the tests, and once to write the fixture's pilot.csv
 * (`npx tsx tests/pipeline/syntheticPilot.ts`).
 */
import { writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { surrogatesAtDose } from '../../src/pipeline/surrogateStep.js';
import { prepareSystem } from '../../src/design/competitionSystem.js';
import { solveBatchPrepared } from '../../src/equilibrium/iastBatch.js';

export const FIXTURE = join(dirname(fileURLToPath(import.meta.url)), '../../fixtures/project/surrogates-gac-mc');
export const PILOT_DOSES = [5, 10, 15, 20, 30];

export function syntheticPilotCsv(shiftPoints: Record<string, number>): string {
  const input = loadProject(join(FIXTURE, 'project.json'));
  delete input.project.pilot; // the relation does not depend on the pilot file
  delete input.pilot;
  const r = runPipeline(input);
  const cr = r.carbons[0]!;
  const doc = r.project.site.docMgPerL;
  const ids = r.project.compounds.map((c) => c.id);
  const lines = ['# INVENTED synthetic pilot pairs: on the model relation except the stated shifts', `sample,dose (mg/L),UV254 reduction (%),${ids.map((id) => `removal ${id} (%)`).join(',')}`];
  PILOT_DOSES.forEach((dose, k) => {
    const uv = surrogatesAtDose(cr.surrogates!.model, dose).uv254Reduction! * 100;
    const rem = cr.systems.map((sys) => 100 * (1 - solveBatchPrepared(prepareSystem(sys, doc), dose / 1000).cMgPerL[0]! / sys.c0MgPerL) + (shiftPoints[sys.compoundId] ?? 0));
    lines.push(`S${k + 1},${dose},${uv.toFixed(6)},${rem.map((v) => v.toFixed(6)).join(',')}`);
  });
  return lines.join('\n') + '\n';
}

if (process.argv[1]?.endsWith('syntheticPilot.ts')) {
  writeFileSync(join(FIXTURE, 'pilot.csv'), syntheticPilotCsv({ BTZ: -20 }));
  console.log('wrote pilot.csv');
}
