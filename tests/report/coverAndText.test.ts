/**
 * Client-ready text: the cover block from the project file's optional keys, the References
 * section (every inline author–year cited has its full entry, and no "from memory" reaches the
 * client text), specific doses beside doses, unmet goals in the headline, no exponent or negative
 * zero in client tables, the Monte Carlo note and annualised yearly figures.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { readFileSync } from 'node:fs';
import { validateProject } from '../../src/project/validateProject.js';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { buildReportModel } from '../../src/output/buildReportModel.js';
import { headlineFigures, yearlyBasisText } from '../../src/output/headlineFigures.js';
import { modelText, citedReferences } from '../../src/output/referencesSection.js';
import { REFERENCES } from '../../src/output/referenceList.js';
import type { PipelineResult } from '../../src/pipeline/pipelineTypes.js';
import type { ReportModel } from '../../src/output/reportModel.js';
import { fmtFixed, fmtNumber } from '../../src/output/formatting.js';
import { sharedDemoPipeline } from '../helpers/sharedDemoPipeline.js';

const demoPath = join(__dirname, '../../fixtures/demo/project.json');
let r: PipelineResult;
let model: ReportModel;

beforeAll(() => {
  r = sharedDemoPipeline(); // the worker's shared plain demo run: runPipeline(loadProject(demoPath, { demo: true }), { now: 2026-01-01 })
  model = buildReportModel(r, 'test');
}, 60_000);

describe('cover block from the project file', () => {
  const raw = () => JSON.parse(readFileSync(demoPath, 'utf8')) as Record<string, unknown>;
  it('reads client, project number, author, checker, revision and date, in that order on the cover', () => {
    const p = validateProject(raw());
    expect(p.cover).toEqual({ client: 'Lindqvarn water board (invented)', projectNumber: 'DEMO-0042', author: 'A. Example (invented)', checker: 'B. Example (invented)', revision: 'A', date: '2026-01-15' });
    expect(model.cover!.map((c) => c.label)).toEqual(['Client', 'Project number', 'Author', 'Checked by', 'Revision', 'Date']);
  });
  it('is optional, and rejects a date that is not YYYY-MM-DD or not a calendar day, naming the key', () => {
    const o = raw();
    for (const k of ['client', 'project_number', 'author', 'checker', 'revision', 'date']) delete o[k];
    expect(validateProject(o).cover).toBeUndefined();
    expect(() => validateProject({ ...raw(), date: '15.01.2026' })).toThrow(/date.*YYYY-MM-DD/);
    expect(() => validateProject({ ...raw(), date: '2026-02-30' })).toThrow(/YYYY-MM-DD/);
    expect(() => validateProject({ ...raw(), author: 7 })).toThrow(/author/);
    expect(() => validateProject({ ...raw(), reviewer: 'x' })).toThrow(/reviewer/);
  });
});

describe('references and client text', () => {
  it('every inline author–year of the text has its full entry in the References section, and nothing says "from memory"', () => {
    const refs = model.sections.find((s) => s.id === 'references')!;
    const text = modelText(model);
    expect(text).not.toMatch(/from memory/i);
    const cited = citedReferences(text);
    expect(cited.map((c) => c.inline)).toEqual(expect.arrayContaining(['Najm et al. 1991', 'Qi et al. 2007', 'Zietzschmann et al. 2016', 'Radke & Prausnitz 1972', 'SR 814.201.231']));
    expect(refs.paragraphs).toEqual(cited.map((c) => c.full));
    // method notes carry how firm the details are, outside the client sentences
    expect(refs.notes?.join(' ')).toMatch(/confirm/);
    for (const ref of REFERENCES) expect(ref.full).toMatch(/\(\d{4}\)/);
  });

  it('headline: dose with mg carbon per mg DOC, goals met or not, yearly basis, cheapest named within one currency', () => {
    const figs = headlineFigures(r);
    const dose = figs.find((f) => f.label === 'Carbon A (coal-based): dose')!;
    expect(dose.note).toMatch(/^\d\.\d+ mg carbon per mg DOC/);
    expect(figs.find((f) => f.label === 'Carbon A (coal-based): goals')!.value).toBe('all goals met');
    expect(figs.find((f) => f.label.startsWith('Lowest yearly carbon cost'))!.label).toBe('Lowest yearly carbon cost (EUR)');
    // an unreachable compound goal is stated in the headline
    const broken: PipelineResult = { ...r, carbons: r.carbons.map((c) => (c.required ? { ...c, required: { ...c.required, compounds: c.required.compounds.map((d, i) => (i === 0 ? { ...d, status: 'unreachable' as const, doseMgPerL: null } : d)) } } : c)) };
    const g = headlineFigures(broken).find((f) => f.label === 'Carbon A (coal-based): goals')!;
    expect(g.value).toBe('1 goal not met');
    expect(g.note).toMatch(new RegExp(`^${r.project.compounds[0]!.id}: .* not reachable`));
  });

  it('a part-year DOC series is said to be annualised', () => {
    const a = r.carbons[0]!;
    expect(yearlyBasisText(a)).toBe('DOC series, 365 days');
    const part = { ...a, daily: { ...a.daily!, rows: a.daily!.rows.slice(0, 200) } };
    expect(yearlyBasisText(part)).toBe('annualised: 200-day DOC series scaled to 365 days');
  });

  it('client tables hold no exponent and no negative zero', () => {
    const cells = model.sections.flatMap((s) => (s.tables ?? []).flatMap((t) => t.rows.flat().map(String)));
    expect(cells.filter((c) => /\d(\.\d+)?e[-+]\d/.test(c))).toEqual([]);
    expect(cells.filter((c) => /^-0(\.0*)?$/.test(c))).toEqual([]);
    expect(fmtNumber(9.12e-4, 3)).toBe('0.000912');
    expect(fmtFixed(-0.008, 1)).toBe('0.0');
    expect(fmtFixed(-21.23, 1)).toBe('-21.2');
  });
});

describe('Monte Carlo note', () => {
  it('explains a governing-dose median above the point estimate with the numbers, and says nothing when it is not above', async () => {
    const { monteCarloNote } = await import('../../src/output/monteCarloNote.js');
    const q = (key: string, point: number, p50: number) => ({ key, label: key, unit: 'mg/L', pointEstimate: point, p10: p50 * 0.8, p50, p90: p50 * 1.3, unreachableDraws: 0 });
    const cr = { carbon: { name: 'C1' }, uncertainty: { result: { quantities: [q('governing_dose', 20, 22.6), q('dose:A', 20, 20.1), q('dose:B', 18, 18.2), q('dose:C', 5, 5)] } } } as never;
    const [note] = monteCarloNote(cr);
    expect(note).toMatch(/^C1: the median governing dose \(22\.6 mg\/L\) is 13 % above the point estimate \(20\.0 mg\/L\)/);
    expect(note).toMatch(/2 compounds need within 30 % of the governing dose/);
    expect(note).toMatch(/largest of the compound doses/);
    expect(note).toMatch(/\(A\) has a median of 20\.1 mg\/L/);
    const flat = { carbon: { name: 'C1' }, uncertainty: { result: { quantities: [q('governing_dose', 20, 19.5)] } } } as never;
    expect(monteCarloNote(flat)).toEqual([]);
  });
});
