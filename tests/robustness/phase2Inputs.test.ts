/**
 * Bad and hostile inputs for the keys and tables added in phase 2 of issue 11: the project keys
 * "calibration_transfer" and a compound's "goal", the retired "uncertainty.doc_levels", and the
 * kinetic and breakthrough tables of `calibrate` (now read like the jar tests: separators,
 * decimal marks, gaps, .xlsx sheets). Each case asserts the exit code, the named place, empty
 * stdout, no stack trace and that nothing was written (the harness of badInputs.test.ts).
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { requireBuild } from '../helpers/cliHarness.js';
import { expectRefused, runCases, type BadCase, type CaseResult } from './harness.js';

const DEMO = join(process.cwd(), 'fixtures/demo');
const demoProject = JSON.parse(readFileSync(join(DEMO, 'project.json'), 'utf8')) as Record<string, any>;
const clone = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;
const proj = (f: (p: any) => void): string => { const c = clone(demoProject); f(c); return JSON.stringify(c, null, 1); };
const path = (s: string) => new RegExp(`field ${s.replace(/[.[\]$]/g, (c) => `\\${c}`)}(?![\\w.[])`);

function project(name: string, f: (p: any) => void, place: RegExp[]): BadCase {
  return { name: `project: ${name}`, copy: DEMO, files: { 'project.json': proj(f) }, args: (p) => ['run', p('project.json'), '--out', p('out'), '--draws', '0'], code: 2, place };
}

const BG = readFileSync(join(process.cwd(), 'fixtures/kinetics/background.json'), 'utf8');
const TARGET = readFileSync(join(process.cwd(), 'fixtures/kinetics/target.json'), 'utf8');
const KIN = ['--particle-radius', '12 um', '--particle-density', '700 kg/m3', '--dl', '5e-10 m2/s'];
const DOC_KIN = 'time (min),dose (mg/L),DOC (mg/L)\n5,20,4.96\n15,20,4.93\n30,20,4.90\n60,20,4.86\n';
const TGT_KIN = 'time (min),dose (mg/L),C0 (ng/L),c (ng/L)\n5,10,500,482\n15,10,500,462\n30,10,500,443\n60,10,500,420\n';
/** calibrate --model surface-diffusion-doc on a DOC kinetic table. */
function docKin(name: string, file: string, content: string | undefined, place: RegExp[], extra: string[] = []): BadCase {
  return { name: `DOC kinetic tests: ${name}`, files: { 'bg.json': BG, ...(content !== undefined ? { [file.replace(/#.*$/, '')]: content } : {}) }, args: (p) => ['calibrate', p(file), '--model', 'surface-diffusion-doc', '--background', p('bg.json'), ...KIN, '--out', p('cal.json'), ...extra], code: 2, place };
}
/** calibrate --model surface-diffusion on a target kinetic table. */
function tgtKin(name: string, content: string, place: RegExp[], extra: string[] = []): BadCase {
  return { name: `target kinetic tests: ${name}`, files: { 'bg.json': BG, 'tgt.json': TARGET, 'kin.csv': content }, args: (p) => ['calibrate', p('kin.csv'), '--model', 'surface-diffusion', '--compound', p('tgt.json'), '--background', p('bg.json'), ...KIN, '--doc-ds', '3e-17 m2/s', '--out', p('cal.json'), ...extra], code: 2, place };
}
const COLUMN_COMPOUND = readFileSync(join(process.cwd(), 'fixtures/column/target-compound.json'), 'utf8');
const BED = ['--ebct', '1 min', '--bed-depth', '0.1 m', '--grain-radius', '0.1 mm', '--grain-density', '800 kg/m3'];
const BT = 'bed volumes (-),c/c0 (-)\n1000,0.01\n2000,0.05\n3000,0.2\n4000,0.5\n';
/** calibrate --model column on breakthrough data. */
function column(name: string, file: string, content: string | undefined, place: RegExp[], extra: string[] = []): BadCase {
  return { name: `breakthrough data: ${name}`, files: { 'cmp.json': COLUMN_COMPOUND, ...(content !== undefined ? { [file.replace(/#.*$/, '')]: content } : {}) }, args: (p) => ['calibrate', p(file), '--model', 'column', '--compound', p('cmp.json'), ...BED, '--out', p('cal.json'), ...extra], code: 2, place };
}
const at = (file: string, row: number, column: string) => new RegExp(`${file.replace('.', '\\.')}, row ${row}, column "${column.replace(/[()/]/g, (c) => `\\${c}`)}"`);

const CASES: BadCase[] = [
  // ── project: calibration_transfer ───────────────────────────────────────────────────────────
  project('calibration_transfer a number', (p) => { p.calibration_transfer = 2; }, [path('calibration_transfer'), /expected "none", "mean" or the id of a compound with jar tests/]),
  project('calibration_transfer empty', (p) => { p.calibration_transfer = ''; }, [path('calibration_transfer')]),
  project('calibration_transfer an array', (p) => { p.calibration_transfer = ['CBZ']; }, [path('calibration_transfer')]),
  project('calibration_transfer unknown id', (p) => { p.calibration_transfer = 'CBX'; }, [path('calibration_transfer'), /"CBX" is not "none", "mean" or a compound id/]),
  project('calibration_transfer from an untested compound', (p) => { p.calibration_transfer = 'MET'; }, [path('calibration_transfer'), /compound "MET" has no jar tests/]),
  project('calibration_transfer mean without jar tests', (p) => { p.calibration_transfer = 'mean'; delete p.compounds[0].jar_tests; }, [path('calibration_transfer'), /needs at least one compound with "jar_tests"/]),
  project('calibration_transfer mean over factor and EBC', (p) => { p.calibration_transfer = 'mean'; p.compounds[2].jar_tests = { file: 'jar_tests_cbz.csv', model: 'sebc' }; }, [path('calibration_transfer'), /cannot be averaged/]),
  project('calibration_transfer misspelt key', (p) => { p.calibration_transfers = 'mean'; }, [path('calibration_transfers'), /calibration_transfer/]),
  // ── project: compound goal ──────────────────────────────────────────────────────────────────
  project('goal other text', (p) => { p.compounds[1].goal = 'report only'; }, [path('compounds[1].goal'), /expected "none"/]),
  project('goal a number', (p) => { p.compounds[1].goal = 80; }, [path('compounds[1].goal'), /expected "none"/]),
  project('goal false', (p) => { p.compounds[1].goal = false; }, [path('compounds[1].goal'), /expected "none"/]),
  project('goal none beside a limit', (p) => { p.compounds[8].goal = 'none'; }, [path('compounds[8].limit'), /cannot also have an effluent limit/]),
  project('goal none with goals.limits', (p) => { p.compounds[2].goal = 'none'; p.goals.limits = { MET: '10 ng/L' }; }, [path('goals.limits.MET'), /report-only compound/]),
  project('goal misspelt key', (p) => { p.compounds[1].goals = 'none'; }, [path('compounds[1].goals'), /goal/]),
  // ── project: retired uncertainty.doc_levels ─────────────────────────────────────────────────
  project('retired doc_levels', (p) => { p.uncertainty.doc_levels = 4; }, [path('uncertainty.doc_levels'), /retired/, /DOC nodes/]),
  project('retired doc_levels (invalid value too)', (p) => { p.uncertainty.doc_levels = 'many'; }, [path('uncertainty.doc_levels'), /retired/]),
  // ── DOC kinetic tests through the table reader ──────────────────────────────────────────────
  docKin('gap (empty) in DOC', 'kin.csv', DOC_KIN.replace('15,20,4.93', '15,20,'), [at('kin.csv', 3, 'DOC (mg/L)')]),
  docKin('gap n.a. in DOC', 'kin.csv', DOC_KIN.replace('15,20,4.93', '15,20,n.a.'), [at('kin.csv', 3, 'DOC (mg/L)')]),
  docKin('gap - in time', 'kin.csv', DOC_KIN.replace('30,20,4.90', '-,20,4.90'), [at('kin.csv', 4, 'time (min)')]),
  docKin('decimal comma in a comma-separated file', 'kin.csv', DOC_KIN.replace('4.93', '4,93'), [/kin\.csv/, /decimal comma/]),
  docKin('decimal point in a decimal-comma table', 'kin.csv', 'time (min);dose (mg/L);DOC (mg/L)\n5;20;4,96\n15;20;4.93\n30;20;4,90\n', [at('kin.csv', 3, 'DOC (mg/L)'), /decimal point/]),
  docKin('decimal comma forced to point', 'kin.csv', 'time (min);dose (mg/L);DOC (mg/L)\n5;20;4,96\n15;20;4,93\n', [at('kin.csv', 2, 'DOC (mg/L)'), /decimal comma/], ['--decimal', '.']),
  docKin('time without a unit', 'kin.csv', DOC_KIN.replace('time (min)', 'time'), [/kin\.csv/, /time/]),
  docKin('time in an unknown unit', 'kin.csv', DOC_KIN.replace('time (min)', 'time (fortnights)'), [/kin\.csv/, /fortnights/]),
  docKin('file missing', 'none.csv', undefined, [/none\.csv/, /not found/]),
  docKin('.xlsx missing', 'none.xlsx#Data', undefined, [/none\.xlsx/, /not found/]),
  docKin('.xlsx that is not a workbook', 'fake.xlsx#Data', DOC_KIN, [/fake\.xlsx/, /cannot read the workbook/]),
  docKin('unknown separator option', 'kin.csv', DOC_KIN, [/--separator/], ['--separator', '|']),
  docKin('times not increasing', 'kin.csv', DOC_KIN.replace('30,20,4.90', '10,20,4.90'), [at('kin.csv', 4, 'time (min)'), /increase/]),
  // ── target kinetic tests ────────────────────────────────────────────────────────────────────
  tgtKin('gap in c', TGT_KIN.replace('15,10,500,462', '15,10,500,n.a.'), [at('kin.csv', 3, 'c (ng/L)')]),
  tgtKin('gap in C0', TGT_KIN.replace('30,10,500,443', '30,10,,443'), [at('kin.csv', 4, 'C0 (ng/L)')]),
  tgtKin('semicolon file with a forced comma separator', TGT_KIN.replace(/,/g, ';'), [/kin\.csv/], ['--separator', ',']),
  tgtKin('c far above C0', TGT_KIN.replace('15,10,500,462', '15,10,500,900'), [at('kin.csv', 3, 'c (ng/L)'), /far above/]),
  tgtKin('"8,5 ng/L" style quantity cell', TGT_KIN.replace('15,10,500,462', '15,10,500,"462,5 ng/L"'), [/kin\.csv/, /row 3/]),
  // ── breakthrough data ───────────────────────────────────────────────────────────────────────
  column('gap in bed volumes', 'bt.csv', BT.replace('2000,0.05', ',0.05'), [at('bt.csv', 3, 'bed volumes (-)')]),
  column('gap n.a. in c/c0', 'bt.csv', BT.replace('2000,0.05', '2000,n.a.'), [at('bt.csv', 3, 'c/c0 (-)')]),
  column('decimal comma in a comma-separated file', 'bt.csv', BT.replace('0.05', '0,05'), [/bt\.csv/, /decimal comma/]),
  column('semicolon table, bed volumes falling', 'bt.csv', 'bed volumes (-);c/c0 (-)\n1000;0,01\n3000;0,05\n2000;0,2\n', [at('bt.csv', 4, 'bed volumes (-)'), /not increasing/]),
  column('c/c0 in an unknown unit', 'bt.csv', BT.replace('c/c0 (-)', 'c/c0 (ppm)'), [/bt\.csv/, /ppm/]),
  column('.xlsx missing', 'none.xlsx#Data', undefined, [/none\.xlsx/, /not found/]),
  column('.xlsx that is not a workbook', 'fake.xlsx', BT, [/fake\.xlsx/, /cannot read the workbook/]),
  column('decimal comma forced to point', 'bt.csv', 'bed volumes (-);c/c0 (-)\n1000;0,01\n2000;0,05\n', [at('bt.csv', 2, 'c/c0 (-)'), /decimal comma/], ['--decimal', '.']),
];

let root: string;
let results: Map<string, CaseResult>;

beforeAll(async () => {
  requireBuild();
  root = mkdtempSync(join(tmpdir(), 'sorbshare-robustness-p2-'));
  results = await runCases(root, CASES);
}, 600_000);

afterAll(() => { if (root) rmSync(root, { recursive: true, force: true }); });

describe('bad and hostile inputs for the phase-2 keys and tables (CLI: the first case of each kind and command spawned, the others through runCli in-process)', () => {
  it('case names are unique', () => expect(new Set(CASES.map((c) => c.name)).size).toBe(CASES.length));
  it('runs the first case of each kind and of each command through the spawned binary', () => {
    const kinds = new Set(CASES.map((c) => c.name.split(':')[0]));
    const spawned = CASES.filter((c) => results.get(c.name)!.spawned);
    expect(new Set(spawned.map((c) => c.name.split(':')[0]))).toEqual(kinds);
  });
  it.each(CASES.map((c) => [c.name, c] as const))('%s', (_name, c) => {
    const r = results.get(c.name)!;
    expectRefused(r, c);
  });
});
