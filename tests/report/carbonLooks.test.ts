/**
 * Carbons drawn in their own neutral looks: in the daily-dose figure no carbon takes a compound's
 * colour, and two carbons differ in colour and dash. Demo project (invented data, a scenario only).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import { compoundStyles } from '../../src/output/compoundStyles.js';
import { CARBON_LOOKS } from '../../src/output/carbonLooks.js';
import { SERIES_COLOURS } from '../../src/output/palette.js';
import type { ReportModel, XYPlotSpec } from '../../src/output/reportModel.js';
import { sharedDemoPipeline } from '../helpers/sharedDemoPipeline.js';

let model: ReportModel;
let compoundIds: string[];

beforeAll(() => {
  const input = loadProject(join(__dirname, '../../fixtures/demo/project.json'), { demo: true });
  compoundIds = input.project.compounds.map((c) => c.id);
  model = buildReportModel(sharedDemoPipeline(), 'test'); // the worker's shared plain demo run (same input and date)
}, 60_000);

describe('carbon looks', () => {
  it('the daily-dose figure draws carbons in neutral looks of their own, not in compound colours', () => {
    const plot = model.sections.flatMap((s) => s.plots ?? []).find((p) => p.id === 'daily-dose') as XYPlotSpec;
    expect(plot.series.length).toBeGreaterThanOrEqual(2);
    const compoundColours = new Set([...compoundStyles(compoundIds).values()].map((l) => l.colour.toLowerCase()));
    const palette = new Set(SERIES_COLOURS.map((c) => c.toLowerCase()));
    for (const s of plot.series) {
      expect(s.colour).toBeDefined();
      expect(compoundColours.has(s.colour!.toLowerCase())).toBe(false);
      expect(palette.has(s.colour!.toLowerCase())).toBe(false);
      expect(s.band?.label ?? `${s.name} P10–P90`).toBe(`${s.name} P10–P90`);
    }
    const [a, b] = plot.series;
    expect(a!.colour).not.toBe(b!.colour);
    expect(a!.dash).not.toBe(b!.dash);
    expect(CARBON_LOOKS.every((l) => !palette.has(l.colour.toLowerCase()))).toBe(true);
  });
});

describe('daily dose table', () => {
  it('a whole-year series gives its totals once: no per-year column repeating them', () => {
    const t = model.sections.flatMap((s) => s.tables ?? []).find((x) => x.caption === 'Daily dose and carbon mass')!;
    expect(t.columns).not.toContain('per year (annualised)');
    expect(t.columns.at(-1)).toBe('carbon cost over the series');
    for (const row of t.rows) expect(row).toHaveLength(t.columns.length);
  });
});
