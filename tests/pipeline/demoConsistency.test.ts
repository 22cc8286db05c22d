/**
 * The demo end to end (in-process), checked for internal consistency. The demo data are
 * invented, so nothing here compares with demo numbers; every check is a property the results
 * must have whatever the data.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { designDose } from '../../src/design/designDose.js';
import { indicatorCheckAt, indicatorDose } from '../../src/design/indicatorGoal.js';
import { designProblem, indicatorPlan } from '../../src/pipeline/runPipeline.js';
import { carbonModel } from '../../src/design/carbonModel.js';
import { prepareSystem } from '../../src/design/competitionSystem.js';
import { solveBatchPrepared } from '../../src/equilibrium/iastBatch.js';
import { backgroundComponents } from '../../src/fractionation/backgroundPrediction.js';
import { carbonsCsv, dailyDosesCsv } from '../../src/output/outputTables.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';
import { sharedDemoPipeline } from '../helpers/sharedDemoPipeline.js';

let r: PipelineResult;
/** The PAC carbons of the demo (the GAC candidate has no batch dose). */
const pac = () => r.carbons.filter((c) => c.carbon.type === 'PAC');
beforeAll(() => {
  r = sharedDemoPipeline(); // the worker's shared plain demo run (the demo project, { demo: true }, now 2026-01-01)
});

/** Dose and governing goal of a dose-table node (for a node that is not one of the days). */
function nodeAt(c: PipelineResult['carbons'][number], doc: number): { doseMgPerL: number | null; governedBy: string } {
  const problem = designProblem(r.project, c.carbon, r.project.compounds.map((x) => r.goals[x.id]!), r.background);
  const d = designDose(carbonModel(c.systems, doc), problem);
  return { doseMgPerL: d.doseMgPerL, governedBy: d.governedBy };
}

function removalAt(sys: Parameters<typeof prepareSystem>[0], docMgPerL: number, doseMgPerL: number): number {
  return 1 - solveBatchPrepared(prepareSystem(sys, docMgPerL), doseMgPerL / 1000).cMgPerL[0]! / sys.c0MgPerL;
}

describe('demo: doses', () => {
  it('runs two PAC carbons and one GAC carbon with nine compounds and a year of days', () => {
    expect(r.carbons.length).toBe(3);
    expect(pac().length).toBe(2);
    for (const c of pac()) {
      expect(c.required!.compounds.length).toBe(9);
      expect(c.daily!.rows.length).toBe(365);
    }
  });

  it('each reported compound dose, re-solved by batch IAST, gives its goal (to 1e-9)', () => {
    for (const c of pac()) {
      c.required!.compounds.forEach((d, i) => {
        expect(d.status).toBe('met');
        const goal = r.goals[d.compoundId]!.removalFraction;
        expect(Math.abs(removalAt(c.systems[i]!, r.project.site.docMgPerL, d.doseMgPerL!) - goal)).toBeLessThan(1e-9);
      });
    }
  });

  it('a limit goal is the removal 1 − limit/c0', () => {
    const mbt = r.project.compounds.find((c) => c.id === 'MBT')!;
    expect(r.goals.MBT!.removalFraction).toBeCloseTo(1 - 0.5e-3 / mbt.c0MgPerL, 14);
    const i = r.project.compounds.indexOf(mbt);
    const c = r.carbons[0]!;
    const cAt = c.systems[i]!.c0MgPerL * (1 - removalAt(c.systems[i]!, r.project.site.docMgPerL, c.required!.compounds[i]!.doseMgPerL!));
    expect(cAt * 1e6).toBeCloseTo(500, 5); // ng/L
  });

  it('the governing compound is the one needing the most carbon', () => {
    for (const c of pac()) {
      const req = c.required!;
      const max = Math.max(...req.compounds.map((d) => d.doseMgPerL!));
      expect(req.governing!.doseMgPerL).toBe(max);
      expect(req.compounds.find((d) => d.doseMgPerL === max)!.compoundId).toBe(req.governing!.compoundId);
      expect(req.doseMgPerL).toBe(Math.max(max, req.indicator!.doseMgPerL!));
    }
  });

  it('the indicator dose re-solved gives the mean-removal goal; the check at the design dose agrees', () => {
    for (const c of pac()) {
      const plan = indicatorPlan(r.project)!;
      const at = indicatorCheckAt(carbonModel(c.systems, r.project.site.docMgPerL), plan, c.required!.indicator!.doseMgPerL!);
      expect(at.set.admissible).toBe(true);
      expect(Math.abs(at.set.meanRemovalPercent - 80)).toBeLessThan(1e-7);
      // at the design dose the mean is the arithmetic mean of the listed removals
      const ind = c.indicator!;
      const mean = ind.values.reduce((s, v) => s + v.removalPercent, 0) / ind.values.length;
      expect(ind.set.meanRemovalPercent).toBeCloseTo(mean, 12);
      expect(ind.met).toBe(true);
      expect(ind.range!.best.meanRemovalPercent).toBeGreaterThanOrEqual(ind.set.meanRemovalPercent - 1e-12);
      expect(ind.range!.worst.meanRemovalPercent).toBeLessThanOrEqual(ind.set.meanRemovalPercent + 1e-12);
    }
  });

  it('reduced loading: q in site water from the batch balance, q single-solute from Freundlich at the same c', () => {
    const c = r.carbons[0]!;
    c.reducedLoadings!.forEach((rl, i) => {
      const sys = c.systems[i]!;
      expect(rl.qSiteMgPerG).toBeCloseTo((sys.c0MgPerL - rl.cMgPerL) / (rl.doseMgPerL / 1000), 10); // c0 = c + D·q
      expect(rl.qSingleMgPerG).toBeCloseTo(sys.single.K * Math.pow(rl.cMgPerL, sys.single.oneOverN), 10);
      expect(rl.ratio).toBeGreaterThan(0);
      expect(rl.ratio).toBeLessThan(1); // competition lowers the loading
    });
  });

  it('cost per m³ = dose (g/m³) / 1000 × price per kg', () => {
    for (const c of pac()) expect(c.costPerM3).toBeCloseTo((c.required!.doseMgPerL! / 1000) * c.carbon.pricePerKg, 15);
  });

  it('a carbon with K factor f and no own isotherm for a compound needs 1/f times the dose of the reference carbon', () => {
    // q = f·q_ref in the balance c0 = c + D·q, so D_B = D_A / f (exact for every compound except DCF, which has its own isotherm on carbon B)
    const [a, b] = r.carbons;
    const f = b!.carbon.kFactor;
    a!.required!.compounds.forEach((d, i) => {
      if (d.compoundId === 'DCF') return;
      expect(b!.required!.compounds[i]!.doseMgPerL!).toBeCloseTo(d.doseMgPerL! / f, 6);
    });
  });
});

describe('demo: the year of DOC', () => {
  it('yearly totals equal the sum of the days; kg/d = dose × flow / 1000', () => {
    for (const c of pac()) {
      const d = c.daily!;
      let kg = 0, cost = 0;
      for (const row of d.rows) {
        expect(row.carbonKgPerD!).toBeCloseTo((row.doseMgPerL! * row.flowM3PerD) / 1000, 9);
        kg += row.carbonKgPerD!;
        cost += row.cost!;
      }
      expect(d.totalCarbonKg).toBeCloseTo(kg, 6);
      expect(c.yearly!.carbonKg).toBeCloseTo(kg, 6);
      expect(c.yearly!.cost).toBeCloseTo(cost, 6);
      expect(c.yearly!.cost).toBeCloseTo(kg * c.carbon.pricePerKg, 6);
    }
  });

  it('the daily CSV sums to the yearly figure in carbons.csv (to the 8 digits written)', () => {
    const daily = dailyDosesCsv(r).trim().split('\n').slice(1).map((l) => l.match(/("[^"]*"|[^,]+|)(?=,|$)/g)!);
    const carbonsRows = carbonsCsv(r).trim().split('\n');
    expect(carbonsRows.length).toBe(4); // header, two PAC carbons, one GAC carbon
    const sumA = daily.filter((cells) => cells.join(',').includes('Carbon A (coal-based)')).reduce((s, cells) => s + Number(cells.filter((x) => x !== '')[6]), 0);
    expect(sumA / r.carbons[0]!.yearly!.carbonKg).toBeCloseTo(1, 6);
  });

  it('each dose-table node re-solved at its DOC gives its governing goal, and every other goal is met', () => {
    const c = r.carbons[0]!;
    const table = c.daily!.table;
    expect(table.midpointErrorRel).toBeLessThanOrEqual(table.toleranceRel);
    const rows = table.docMgPerL.map((doc) => c.daily!.rows.find((row) => row.docMgPerL === doc) ?? { docMgPerL: doc, ...nodeAt(c, doc) });
    for (const row of rows) {
      c.systems.forEach((sys, i) => {
        const removal = removalAt(sys, row.docMgPerL, row.doseMgPerL!);
        const goal = r.goals[sys.compoundId]!.removalFraction;
        expect(removal).toBeGreaterThanOrEqual(goal - 1e-9);
        if (row.governedBy === `compound ${sys.compoundId}`) expect(Math.abs(removal - goal)).toBeLessThan(1e-9);
        void i;
      });
    }
  });

  it('the daily doses between nodes are within the table\'s stated tolerance of the full design on sample days', () => {
    const c = r.carbons[1]!;
    const problem = designProblem(r.project, c.carbon, r.project.compounds.map((x) => r.goals[x.id]!), r.background);
    const model = carbonModel(c.systems, r.project.site.docMgPerL);
    for (const row of c.daily!.rows.filter((_, k) => k % 61 === 0)) {
      const full = designDose(model.atDoc(row.docMgPerL), problem);
      expect(Math.abs(row.doseMgPerL! / full.doseMgPerL! - 1)).toBeLessThanOrEqual(c.daily!.table.toleranceRel);
    }
  });

  it('the background scales with DOC: every fictive component proportional to the day\'s DOC', () => {
    const bg = r.background.background!;
    const a = backgroundComponents(bg, 6), b = backgroundComponents(bg, 9);
    a.forEach((comp, i) => expect(b[i]!.c0MgPerL).toBeCloseTo(comp.c0MgPerL * 1.5, 12));
  });

  it('higher DOC needs more carbon (monotone over the series)', () => {
    const rows = [...r.carbons[0]!.daily!.rows].sort((x, y) => x.docMgPerL - y.docMgPerL);
    for (let k = 1; k < rows.length; k++) expect(rows[k]!.doseMgPerL!).toBeGreaterThanOrEqual(rows[k - 1]!.doseMgPerL! * (1 - 1e-12));
  });

  it('median and P90 follow Hyndman & Fan definition 7 on the daily doses', () => {
    const d = r.carbons[0]!.daily!;
    const x = d.rows.map((row) => row.doseMgPerL!).sort((p, q) => p - q);
    expect(d.dose!.median).toBe(x[182]); // n = 365: h = 364·0.5 = 182 exactly
    const h = 364 * 0.9;
    expect(d.dose!.p90).toBeCloseTo(x[Math.floor(h)]! + (h - Math.floor(h)) * (x[Math.floor(h) + 1]! - x[Math.floor(h)]!), 12);
  });
});

describe('demo: calibration and unreachable goals', () => {
  it('the CBZ jar tests give a fictive-k factor that is used in the IAST', () => {
    const cal = r.calibrations.find((c) => c.compoundId === 'CBZ')!;
    expect(cal.model).toBe('fictive-k');
    expect(cal.result.fit.converged).toBe(true);
    const sys = r.carbons[0]!.systems[0]!;
    expect(sys.inMixture.K).toBeCloseTo(sys.single.K * cal.targetKFactor!, 12);
  });

  it('an unreachable goal is reported, left out of the required dose, and does not stop the run', () => {
    const input = loadProject(join(__dirname, '../../fixtures/project/ebc-background/project.json'));
    input.project.compounds.find((c) => c.id === 'SUC')!.limitMgPerL = 1e-6; // 1 ng/L from 10 µg/L
    const res = runPipeline(input);
    const pac = res.carbons[0]!;
    const suc = pac.required!.compounds.find((d) => d.compoundId === 'SUC')!;
    expect(suc.status).toBe('unreachable');
    expect(suc.message).toMatch(/not reached by any dose up to 5000 mg\/L/);
    expect(pac.required!.governing!.compoundId).not.toBe('SUC');
    expect(pac.warnings.join('\n')).toMatch(/SUC: .*left out of the required dose/);
    expect(res.carbons[1]!.required).toBeUndefined(); // GAC: no batch dose
  });

  it('the chosen indicator set is evaluated; a non-admissible choice is said so', () => {
    const input = loadProject(join(__dirname, '../../fixtures/project/ebc-background/project.json'));
    const res = runPipeline(input);
    expect(res.carbons[0]!.indicator!.selection).toBe('chosen set');
    expect(res.carbons[0]!.indicator!.set.ids.sort()).toEqual(['BTZ', 'CAN', 'CBZ', 'DCF', 'MET', 'VEN']);
    input.project.goals.indicator!.compounds = ['CBZ', 'DCF', 'MET', 'BTZ', 'CAN'];
    const bad = runPipeline(input);
    expect(bad.carbons[0]!.required!.indicator!.status).toBe('not admissible');
    expect(bad.carbons[0]!.indicator!.set.admissible).toBe(false);
    expect(bad.carbons[0]!.indicator!.set.reason).toMatch(/5 substances given/);
    expect(bad.warnings.join('\n')).toMatch(/indicator goal: the chosen indicator set is not admissible/);
    const plan = indicatorPlan(input.project)!;
    expect(indicatorDose(carbonModel(bad.carbons[0]!.systems, 6.5), plan).status).toBe('not admissible');
  });
});
