import { describe, expect, it } from 'vitest';
import { fileURLToPath } from 'node:url';
import { surrogateCurve } from '../../src/surrogates/surrogateCurve.js';
import { checkPilotPairs, relationsFromCurve, removalAtUv254Reduction } from '../../src/surrogates/pilotCheck.js';
import { parsePilotCsv } from '../../src/surrogates/pilotCsv.js';
import { readPilotCsv } from '../../src/io/readPilotCsv.js';
import { fitSiteCurve, siteCurveRemoval } from '../../src/surrogates/siteCurveFit.js';
import type { FreundlichComponent } from '../../src/equilibrium/preparedMixture.js';
import { InputError } from '../../src/core/errors.js';

const fx = (name: string) => fileURLToPath(new URL(`../../fixtures/surrogates/${name}`, import.meta.url));

/** Invented background and targets (as in surrogates.test.ts). */
const background: FreundlichComponent[] = [
  { id: 'NA', K: 0, oneOverN: 1, c0MgPerL: 2.0 },
  { id: 'F1', K: 3, oneOverN: 0.2, c0MgPerL: 2.8 },
  { id: 'F2', K: 20, oneOverN: 0.2, c0MgPerL: 2.0 },
  { id: 'F3', K: 70, oneOverN: 0.2, c0MgPerL: 1.2 },
];
const model = { background, uv254AbsorbancePerM: [1.2, 2.0, 3.0, 4.5] };
const targets: FreundlichComponent[] = [
  { id: 'CBZ', K: 60, oneOverN: 0.3, c0MgPerL: 1e-4 },
  { id: 'DCF', K: 40, oneOverN: 0.3, c0MgPerL: 2e-4 },
  { id: 'BTA', K: 20, oneOverN: 0.35, c0MgPerL: 5e-3 },
];
const doses = Array.from({ length: 41 }, (_, i) => (i === 0 ? 0 : Math.pow(10, -0.5 + (i * 3) / 40)));
const relations = relationsFromCurve(surrogateCurve(model, targets, doses));

/** Synthetic pilot CSV: model removals at pilot doses ±3 pp deterministic noise; DCF shifted by −20 pp. */
function syntheticPilot(): string {
  const pilotDoses = [5, 8, 12, 16, 20, 25, 30];
  const curve = surrogateCurve(model, targets, pilotDoses);
  const lines = ['sample,dose (mg/L),UV254 reduction (%),removal CBZ (%),removal DCF (%),removal BTA (%)'];
  curve.points.forEach((p, i) => {
    const noise = 3 * Math.sin(1.7 * i + 0.3); // within ±3 percentage points
    const r = (id: string, shift = 0) => (100 * p.removal[id]! + noise + shift).toFixed(2);
    lines.push(`S${i + 1},${p.doseMgPerL},${(100 * p.uv254Reduction!).toFixed(3)},${r('CBZ')},${r('DCF', -20)},${r('BTA')}`);
  });
  return lines.join('\n') + '\n';
}

describe('pilot pairs against the prediction', () => {
  it('flag the shifted compound with its samples and not the others', () => {
    const data = parsePilotCsv(syntheticPilot(), 'synthetic.csv', targets.map((t) => t.id));
    expect(data.compounds).toEqual(['CBZ', 'DCF', 'BTA']);
    const res = checkPilotPairs(data.pairs, relations);
    expect(res.bandPercentagePoints).toBe(10);
    expect(res.outlierCompounds).toEqual(['DCF']);
    const dcf = res.compounds.find((c) => c.compound === 'DCF')!;
    expect(dcf.outliers.map((o) => o.sample)).toEqual(['S1', 'S2', 'S3', 'S4', 'S5', 'S6', 'S7']);
    expect(dcf.outliers[0]!.row).toBe(2);
    expect(dcf.meanResidual).toBeLessThan(-0.15);
    for (const id of ['CBZ', 'BTA']) {
      const c = res.compounds.find((x) => x.compound === id)!;
      expect(c.outliers).toEqual([]);
      expect(c.rmse).toBeLessThan(0.035); // the ±3 pp noise plus rounding of the CSV
      // the fitted site curve is close to the same form fitted to the model (data follow the model)
      expect(Math.abs(c.siteCurve.k / c.modelCurve.k - 1)).toBeLessThan(0.15);
    }
    // DCF measured lower than predicted → a smaller site k than the model's
    expect(dcf.siteCurve.k).toBeLessThan(dcf.modelCurve.k);
    expect(res.overall.points).toBe(21);
    // a wider band (25 pp) accepts the shifted compound too
    expect(checkPilotPairs(data.pairs, relations, 25).outlierCompounds).toEqual([]);
  });

  it('interpolates the model relation linearly and says when it extrapolates', () => {
    const rel = { compound: 'X', uv254Reduction: [0, 0.2, 0.5], removal: [0, 0.4, 0.8] };
    expect(removalAtUv254Reduction(rel, 0.35).removal).toBeCloseTo(0.6, 12);
    expect(removalAtUv254Reduction(rel, 0.7)).toEqual({ removal: 0.8, extrapolated: true });
  });

  it('site curve: recovers k from exact data (least squares in k)', () => {
    const x = [0.1, 0.2, 0.3, 0.45, 0.6];
    const fit = fitSiteCurve(x, x.map((v) => siteCurveRemoval(2.5, v)));
    expect(fit.k).toBeCloseTo(2.5, 7);
    expect(fit.rmse).toBeLessThan(1e-9);
    expect(fit.r2).toBeCloseTo(1, 12);
    expect(fit.atBound).toBe(false);
  });

  it('rejects pilot data naming a compound without a prediction, and a bad band', () => {
    const pairs = [{ sample: 'P', uv254Reduction: 0.3, removals: { ZZZ: 0.5 } }];
    expect(() => checkPilotPairs(pairs, relations)).toThrow(/"ZZZ", which has no prediction/);
    expect(() => checkPilotPairs([{ sample: 'P', uv254Reduction: 0.3, removals: { CBZ: 0.5 } }], relations, 0)).toThrow(/band/);
  });
});

describe('pilot CSV', () => {
  it('reads the fixture: percent to fractions, blank = not measured, rows as in a spreadsheet', () => {
    const d = readPilotCsv(fx('pilot-valid.csv'), ['CBZ', 'BTA', 'DCF']);
    expect(d.compounds).toEqual(['CBZ', 'BTA']);
    expect(d.pairs.map((p) => p.sample)).toEqual(['P1', 'P2', 'P3']);
    expect(d.pairs.map((p) => p.row)).toEqual([3, 4, 6]);
    expect(d.pairs[0]!.uv254Reduction).toBeCloseTo(0.185, 12);
    expect(d.pairs[1]!.removals).toEqual({ CBZ: 0.68, BTA: 0.52 });
    expect(d.pairs[2]!.removals).toEqual({ CBZ: 0.88 });
    expect(d.pairs[2]!.doseMgPerL).toBe(20);
  });

  it('accepts fractions and other dose units', () => {
    const d = parsePilotCsv('sample,dose (g/m3),UV254 reduction (fraction),removal CBZ (fraction)\nA,10,0.3,0.7\n', 'f.csv');
    expect(d.pairs[0]).toMatchObject({ doseMgPerL: 10, uv254Reduction: 0.3, removals: { CBZ: 0.7 } });
  });

  const bad: Array<[string, RegExp]> = [
    ['pilot-missing-uv.csv', /pilot-missing-uv\.csv, row 1, column "UV254 reduction": missing column/],
    ['pilot-non-numeric.csv', /pilot-non-numeric\.csv, row 3, column "UV254 reduction \(%\)": "abc" is not a number/],
    ['pilot-reduction-out-of-range.csv', /pilot-reduction-out-of-range\.csv, row 4, column "UV254 reduction \(%\)": UV254 reduction 120 is outside 0–100 %/],
    ['pilot-unknown-compound.csv', /pilot-unknown-compound\.csv, row 1, column "removal XYZ \(%\)": unknown compound id "XYZ"/],
    ['pilot-dose-no-unit.csv', /row 1, column "dose": header without a unit/],
  ];
  for (const [file, re] of bad) {
    it(`rejects ${file} with an InputError naming file, row and column`, () => {
      let err: unknown;
      try { readPilotCsv(fx(file), ['CBZ', 'DCF']); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(InputError);
      expect((err as Error).message).toMatch(re);
    });
  }

  it('rejects other bad cells and headers', () => {
    const h = 'sample,dose (mg/L),UV254 reduction (%),removal CBZ (%)\n';
    expect(() => parsePilotCsv(h + 'A,5,30,130\n', 'x.csv')).toThrow(/x\.csv, row 2, column "removal CBZ \(%\)": removal of CBZ 130 is outside -100 … 100 %/);
    expect(() => parsePilotCsv(h + 'A,5,,60\n', 'x.csv')).toThrow(/row 2, column "UV254 reduction \(%\)": empty cell/);
    expect(() => parsePilotCsv(h + 'A,5,30,60\nA,6,31,61\n', 'x.csv')).toThrow(/row 3, column "sample": duplicate sample "A"/);
    expect(() => parsePilotCsv('sample,dose (mg/L),UV254 reduction (ppm),removal CBZ (%)\nA,5,30,60\n', 'x.csv')).toThrow(/unknown unit "ppm"/);
    expect(() => parsePilotCsv('sample,dose (mg/L),UV254 reduction (%)\nA,5,30\n', 'x.csv')).toThrow(/no removal columns/);
    expect(() => parsePilotCsv(h, 'x.csv')).toThrow(/no data rows/);
    expect(() => readPilotCsv(fx('does-not-exist.csv'))).toThrow(/not found/);
  });
});
