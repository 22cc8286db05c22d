/**
 * At least 150 bad or hostile inputs over every file type (mixture, compound, background and
 * project JSON; isotherm, jar-test, series and pilot CSV; .xlsx) and every option: each ends
 * with the expected exit code (2 bad input, 1 computation), names the place (file, row, column,
 * JSON path or option), prints nothing on stdout, no stack trace, and writes nothing.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { requireBuild } from '../helpers/cliHarness.js';
import { expectRefused, runCases, type BadCase, type CaseResult } from './harness.js';

const DEMO = join(process.cwd(), 'fixtures/demo');
const demoProject = JSON.parse(readFileSync(join(DEMO, 'project.json'), 'utf8')) as Record<string, any>;
const demoFile = (name: string) => readFileSync(join(DEMO, name), 'utf8');

const MIX = { dose: '15 mg/L', components: [{ id: 'DOC-n', c0: '1.2 mg/L', K: 0 }, { id: 'DOC-1', c0: '2 mg/L', K: 20, one_over_n: 0.2 }, { id: 'T', c0: '100 ng/L', K: 40, one_over_n: 0.3 }] };
const COMPOUND = { id: 'TARGET-A', K: 150, one_over_n: 0.3, K_unit: { q: 'mg/g', c: 'mg/L' } };
const ISO = 'dose (mg/L),DOC0 (mg/L),DOC (mg/L)\n0,8.2,8.2\n5,8.2,7.49\n10,8.2,7.16\n20,8.2,6.69\n50,8.2,5.69\n100,8.2,4.59\n300,8.2,3.55\n';
const JAR = 'C0 (ng/L),dose (mg/L),c (ng/L)\n2000,2,1140\n2000,4,719\n2000,8,434\n2000,15,207\n2000,30,60.5\n';
const clone = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;
const mutate = <T>(base: T, f: (x: any) => void): string => { const c = clone(base); f(c); return JSON.stringify(c, null, 1); };

/** equilibrium with a mixture file. */
function mix(name: string, text: string, place: RegExp[], extra: string[] = [], code = 2): BadCase {
  return { name: `mixture: ${name}`, files: { 'mix.json': text }, args: (p) => ['equilibrium', p('mix.json'), ...extra], code, place: [/mix\.json/, ...place] };
}
/** run with the demo project, one file replaced. */
function project(name: string, files: Record<string, string>, place: RegExp[], extra: string[] = [], code = 2): BadCase {
  return { name: `project: ${name}`, copy: DEMO, files, args: (p) => ['run', p('project.json'), '--out', p('out'), '--draws', '0', ...extra], code, place };
}
const proj = (f: (p: any) => void) => mutate(demoProject, f);
/** fractionate an isotherm. */
function iso(name: string, text: string, place: RegExp[], extra: string[] = []): BadCase {
  return { name: `isotherm: ${name}`, files: { 'iso.csv': text }, args: (p) => ['fractionate', p('iso.csv'), '--components', '2', '--out', p('bg.json'), ...extra], code: 2, place: [/iso\.csv/, ...place] };
}
/** calibrate jar tests. */
function jar(name: string, text: string, place: RegExp[], extra: string[] = [], compound: string = JSON.stringify(COMPOUND)): BadCase {
  return { name: `jar tests: ${name}`, files: { 'jar.csv': text, 'cmp.json': compound }, args: (p) => ['calibrate', p('jar.csv'), '--model', 'sebc', '--compound', p('cmp.json'), '--out', p('cal.json'), ...extra], code: 2, place };
}
function opt(name: string, args: string[], place: RegExp[], files: Record<string, string> = { 'mix.json': JSON.stringify(MIX), 'iso.csv': ISO, 'jar.csv': JAR, 'cmp.json': JSON.stringify(COMPOUND) }): BadCase {
  return { name: `option: ${name}`, files, args: (p) => args.map((a) => (a.startsWith('@') ? p(a.slice(1)) : a)), code: 2, place };
}

const path = (s: string) => new RegExp(`field ${s.replace(/[.[\]$]/g, (c) => `\\${c}`)}(?![\\w.[])`);

const CASES: BadCase[] = [
  // ── mixture JSON: malformed (line and column) ───────────────────────────────────────────────
  mix('empty file', '', [/the file is empty/]),
  mix('only spaces', '   \n  ', [/the file is empty/]),
  mix('trailing comma in object', '{"dose": "1 mg/L",}', [/line 1, column 19/]),
  mix('trailing comma in array', '{"components": [1,]}', [/line 1, column 19/]),
  mix('missing closing brace', '{"components": []', [/end of file inside an object/]),
  mix('single quotes', "{'dose': 1}", [/line 1, column 2/, /double quotes/]),
  mix('unquoted key', '{dose: 1}', [/line 1, column 2/]),
  mix('NaN', '{"dose": NaN}', [/NaN is not a JSON number/]),
  mix('Infinity', '{"dose": Infinity}', [/Infinity is not a JSON number/]),
  mix('leading zero', '{"dose": 015}', [/malformed number/]),
  mix('decimal comma number', '{"components": [{"id": "a", "K": 8,5}]}', [/decimal comma/]),
  mix('comment', '{"dose": 1 // note\n}', [/line 1, column 12/]),
  mix('two values', '{} {}', [/after the end of the JSON value/]),
  mix('line break in a text', '{"dose": "1\nmg/L"}', [/line 1, column 12/]),
  mix('bad escape', '{"dose": "\\x41"}', [/escape/]),
  mix('error on line 3', '{\n  "dose": "1 mg/L",\n  "components": [,]\n}', [/line 3, column 18/]),
  mix('not JSON at all (CSV given)', ISO, [/line 1, column 1/]),
  mix('binary bytes', '\u0000\u0001\u0002', [/control character U\+0000/]),
  // ── mixture JSON: duplicate keys, range, types ─────────────────────────────────────────────
  mix('duplicate key at the top', '{"dose": "1 mg/L", "dose": "2 mg/L", "components": []}', [path('dose'), /duplicate key "dose"/]),
  mix('duplicate key in a component', '{"components": [{"id": "a", "K": 1, "K": 2, "c0": 1, "one_over_n": 0.3}]}', [path('components[0].K'), /duplicate key/]),
  mix('duplicate key in K_unit', '{"components": [{"id": "a", "K": 1, "c0": 1, "one_over_n": 0.3, "K_unit": {"q": "mg/g", "q": "ug/g"}}]}', [path('components[0].K_unit.q')]),
  mix('K beyond the double range', '{"components": [{"id": "a", "K": 1e400, "c0": 1, "one_over_n": 0.3}]}', [path('components[0].K'), /outside the double range/]),
  mix('negative number beyond the double range', '{"dose": -1e309, "components": []}', [path('dose'), /outside the double range/]),
  mix('top level is an array', '[1, 2]', [path('$')]),
  mix('top level is a string', '"mixture"', [path('$')]),
  mix('components not an array', mutate(MIX, (m) => { m.components = {}; }), [path('components')]),
  mix('components empty', mutate(MIX, (m) => { m.components = []; }), [path('components'), /empty/]),
  mix('component is a number', mutate(MIX, (m) => { m.components[1] = 5; }), [path('components[1]')]),
  mix('id missing', mutate(MIX, (m) => { delete m.components[1].id; }), [path('components[1].id')]),
  mix('id only direction controls', mutate(MIX, (m) => { m.components[1].id = '\u202e\u2066'; }), [path('components[1].id')]),
  mix('duplicate ids', mutate(MIX, (m) => { m.components[2].id = 'DOC-1'; }), [path('components[2].id'), /duplicate id/]),
  mix('K as text', mutate(MIX, (m) => { m.components[1].K = '20'; }), [path('components[1].K')]),
  mix('K negative', mutate(MIX, (m) => { m.components[1].K = -1; }), [path('components[1].K')]),
  mix('K missing', mutate(MIX, (m) => { delete m.components[1].K; }), [path('components[1].K')]),
  mix('exponent zero', mutate(MIX, (m) => { m.components[1].one_over_n = 0; }), [path('components[1].one_over_n')]),
  mix('exponent missing', mutate(MIX, (m) => { delete m.components[1].one_over_n; }), [path('components[1].one_over_n')]),
  mix('exponent null', mutate(MIX, (m) => { m.components[1].one_over_n = null; }), [path('components[1].one_over_n')]),
  mix('c0 missing', mutate(MIX, (m) => { delete m.components[2].c0; }), [path('components[2].c0')]),
  mix('c0 negative', mutate(MIX, (m) => { m.components[2].c0 = '-5 ng/L'; }), [path('components[2].c0')]),
  mix('c0 unknown unit', mutate(MIX, (m) => { m.components[2].c0 = '5 furlongs'; }), [path('components[2].c0')]),
  mix('c0 with a decimal comma', mutate(MIX, (m) => { m.components[2].c0 = '8,5 mg/L'; }), [path('components[2].c0'), /decimal comma/, /8\.5 mg\/L/]),
  mix('molar c0 without molar mass', mutate(MIX, (m) => { m.components[2].c0 = '1 umol/L'; }), [path('components[2].c0'), /molar_mass/]),
  mix('molar mass negative', mutate(MIX, (m) => { m.components[2].molar_mass = -3; }), [path('components[2].molar_mass')]),
  mix('K_unit not an object', mutate(MIX, (m) => { m.components[1].K_unit = 'mg/g'; }), [path('components[1].K_unit')]),
  mix('K_unit q not a unit', mutate(MIX, (m) => { m.components[1].K_unit = { q: 'bananas', c: 'mg/L' }; }), [path('components[1].K_unit')]),
  mix('dose unknown unit', mutate(MIX, (m) => { m.dose = '15 mg/m'; }), [path('dose')]),
  mix('dose decimal comma', mutate(MIX, (m) => { m.dose = '15,5 mg/L'; }), [path('dose'), /decimal comma/]),
  // ── mixture JSON: unknown keys with the nearest valid key ──────────────────────────────────
  mix('K_units (misspelt K_unit)', mutate(MIX, (m) => { m.components[1].K_units = { q: 'ug/g', c: 'ug/L' }; }), [path('components[1].K_units'), /unknown key "K_units"/, /did you mean "K_unit"/]),
  mix('k_unit (lower case)', mutate(MIX, (m) => { m.components[1].k_unit = { q: 'ug/g', c: 'ug/L' }; }), [path('components[1].k_unit'), /did you mean "K_unit"/]),
  mix('oneovern', mutate(MIX, (m) => { m.components[1].oneovern = 0.2; }), [/did you mean "one_over_n"/]),
  mix('C0 (capital)', mutate(MIX, (m) => { m.components[1].C0 = '1 mg/L'; }), [path('components[1].C0'), /did you mean "c0"/]),
  mix('molarmass', mutate(MIX, (m) => { m.components[1].molarmass = 200; }), [/did you mean "molar_mass"/]),
  mix('unknown top-level key', mutate(MIX, (m) => { m.doze = '1 mg/L'; }), [path('doze'), /did you mean "dose"/]),
  mix('unknown key in K_unit', mutate(MIX, (m) => { m.components[1].K_unit = { q: 'mg/g', conc: 'mg/L' }; }), [path('components[1].K_unit.conc'), /did you mean "c"/]),
  mix('unknown key in carbon', mutate(MIX, (m) => { m.carbon = { particle_radios: 1e-5 }; }), [path('carbon.particle_radios'), /did you mean "particle_radius"/]),
  mix('carbon not an object', mutate(MIX, (m) => { m.carbon = 3; }), [path('carbon')]),
  mix('__proto__ key', '{"__proto__": {"dose": "1 mg/L"}, "components": []}', [path('__proto__'), /unknown key/]),
  mix('constructor key', mutate(MIX, (m) => { m.constructor = 1; }), [path('constructor'), /unknown key/]),
  // ── mixture: options of equilibrium and dose ───────────────────────────────────────────────
  opt('--dose not a quantity', ['equilibrium', '@mix.json', '--dose', 'lots'], [/option --dose/]),
  opt('--dose decimal comma', ['equilibrium', '@mix.json', '--dose', '8,5 mg/L'], [/option --dose/, /decimal comma/]),
  opt('--dose negative', ['equilibrium', '@mix.json', '--dose', '-5 mg/L'], [/option --dose/]),
  opt('--dose wrong kind of unit', ['equilibrium', '@mix.json', '--dose', '5 m3/d'], [/option --dose/]),
  opt('--dose and --from together', ['equilibrium', '@mix.json', '--dose', '5 mg/L', '--from', '1 mg/L', '--to', '9 mg/L'], [/option --dose/]),
  opt('--from without --to', ['equilibrium', '@mix.json', '--from', '1 mg/L'], [/option --to/]),
  opt('--from above --to', ['equilibrium', '@mix.json', '--from', '10 mg/L', '--to', '1 mg/L'], [/option --from/]),
  opt('--points 1', ['equilibrium', '@mix.json', '--from', '1 mg/L', '--to', '9 mg/L', '--points', '1'], [/--points/]),
  opt('--points not whole', ['equilibrium', '@mix.json', '--from', '1 mg/L', '--to', '9 mg/L', '--points', '2.5'], [/--points/]),
  opt('calibrate: compound file missing', ['calibrate', '@jar.csv', '--model', 'sebc', '--compound', '@nope.json'], [/nope\.json/, /not found/]),
  opt('mixture file missing', ['equilibrium', '@nothing.json'], [/nothing\.json/, /not found/]),
  opt('mixture path is a folder', ['equilibrium', '.'], [/is not a file/]),
  opt('dose: --target missing', ['dose', '@mix.json', '--removal', '80'], [/--target/]),
  opt('dose: unknown target', ['dose', '@mix.json', '--target', 'XYZ', '--removal', '80'], [/--target|XYZ/]),
  opt('dose: --removal 150', ['dose', '@mix.json', '--target', 'T', '--removal', '150'], [/--removal/]),
  opt('dose: --removal text', ['dose', '@mix.json', '--target', 'T', '--removal', 'most'], [/--removal/]),
  opt('dose: --limit decimal comma', ['dose', '@mix.json', '--target', 'T', '--limit', '2,5 ng/L'], [/--limit/, /decimal comma/]),
  opt('dose: --limit above c0', ['dose', '@mix.json', '--target', 'T', '--limit', '1 mg/L'], [/--limit/]),
  opt('dose: neither --removal nor --limit', ['dose', '@mix.json', '--target', 'T'], [/--removal|--limit/]),
  opt('unknown option', ['equilibrium', '@mix.json', '--dosage', '5 mg/L'], [/--dosage/]),
  opt('unknown command', ['equilibrate', '@mix.json'], [/equilibrate/]),
  // ── compound JSON (calibrate --compound) ──────────────────────────────────────────────────
  jar('compound: unknown key', JAR, [/cmp\.json/, path('K_units'), /did you mean "K_unit"/], [], mutate(COMPOUND, (c) => { c.K_units = c.K_unit; delete c.K_unit; })),
  jar('compound: duplicate key', JAR, [/cmp\.json/, path('id'), /duplicate key/], [], '{"id": "A", "id": "B", "K": 1, "one_over_n": 0.3}'),
  jar('compound: malformed', JAR, [/cmp\.json/, /line 1, column 12/], [], '{"id": "A" "K": 1}'),
  jar('compound: K zero', JAR, [/cmp\.json/, path('K')], [], mutate(COMPOUND, (c) => { c.K = 0; })),
  jar('compound: K beyond the double range', JAR, [/cmp\.json/, path('K'), /double range/], [], '{"id": "A", "K": 2e308, "one_over_n": 0.3}'),
  jar('compound: array', JAR, [/cmp\.json/, path('$')], [], '[]'),
  jar('compound: unknown K_unit key', JAR, [/cmp\.json/, path('K_unit.qq')], [], mutate(COMPOUND, (c) => { c.K_unit.qq = 'mg/g'; })),
  // ── jar-test CSV ─────────────────────────────────────────────────────────────────────────
  jar('empty file', '', [/jar\.csv/, /empty table/]),
  jar('header only', 'C0 (ng/L),dose (mg/L),c (ng/L)\n', [/jar\.csv/, /no data rows/]),
  jar('missing c column', 'C0 (ng/L),dose (mg/L)\n2000,2\n', [/jar\.csv/, /missing column/]),
  jar('header without unit', 'C0,dose (mg/L),c (ng/L)\n2000,2,1140\n', [/jar\.csv, row 1, column "C0"/, /without a unit/]),
  jar('unknown unit', 'C0 (ng/m),dose (mg/L),c (ng/L)\n2000,2,1140\n', [/jar\.csv, row 1, column "C0 \(ng\/m\)"/]),
  jar('text in a number cell', JAR.replace('2000,4,719', '2000,four,719'), [/jar\.csv, row 3, column "dose \(mg\/L\)"/, /"four" is not a number/]),
  jar('gap n.a. in a jar test', JAR.replace('2000,4,719', '2000,4,n.a.'), [/jar\.csv, row 3, column "c \(ng\/L\)"/, /marks a gap/, /leave the row out/]),
  jar('gap - in a jar test', JAR.replace('2000,4,719', '2000,-,719'), [/jar\.csv, row 3, column "dose \(mg\/L\)"/, /marks a gap/]),
  jar('empty cell', JAR.replace('2000,4,719', '2000,4,'), [/jar\.csv, row 3, column "c \(ng\/L\)"/, /empty cell/]),
  jar('negative c', JAR.replace('2000,4,719', '2000,4,-719'), [/jar\.csv, row 3, column "c \(ng\/L\)"/]),
  jar('c above C0', JAR.replace('2000,4,719', '2000,4,2500'), [/jar\.csv, row 3, column "c \(ng\/L\)"/, /exceeds C0/]),
  jar('c zero at a dose', JAR.replace('2000,4,719', '2000,4,0'), [/jar\.csv, row 3, column "c \(ng\/L\)"/]),
  jar('C0 zero', JAR.replace('2000,4,719', '0,4,0'), [/jar\.csv, row 3, column "C0 \(ng\/L\)"/]),
  jar('c rises with dose', JAR.replace('2000,15,207', '2000,15,600'), [/jar\.csv, row 5, column "c \(ng\/L\)"/, /higher than c .* at the smaller dose 8 mg\/L \(row 4\)/]),
  jar('c rises with dose in small steps', 'C0 (ng/L),dose (mg/L),c (ng/L)\n2000,2,500\n2000,4,560\n2000,8,620\n2000,15,690\n2000,30,760\n', [/jar\.csv, row 5, column "c \(ng\/L\)"/, /row 2/]),
  jar('decimal point in a decimal-comma table', 'C0 (ng/L);dose (mg/L);c (ng/L)\n2000;2;1140,5\n2000;4;719.5\n2000;8;434,2\n', [/jar\.csv, row 3, column "c \(ng\/L\)"/, /decimal point but the table uses decimal commas/]),
  jar('decimal comma in a comma-separated file', 'C0 (ng/L),dose (mg/L),c (ng/L)\n2000,2,1140,5\n2000,4,719\n', [/jar\.csv/, /decimal commas/]),
  jar('decimal comma forced to point', 'C0 (ng/L);dose (mg/L);c (ng/L)\n2000;2;1140,5\n2000;4;719,2\n', [/jar\.csv, row 2, column "c \(ng\/L\)"/, /decimal comma/], ['--decimal', '.']),
  jar('thousands separators', 'C0 (ng/L);dose (mg/L);c (ng/L)\n2.000,5;2;1140,5\n2000;4;719\n', [/jar\.csv, row 2, column "C0 \(ng\/L\)"/, /not a number/]),
  jar('unbalanced quote', 'C0 (ng/L),dose (mg/L),c (ng/L)\n"2000,2,1140\n', [/jar\.csv/, /malformed CSV/]),
  jar('column twice', 'C0 (ng/L),dose (mg/L),c (ng/L),c (ng/L)\n2000,2,1140,1140\n', [/jar\.csv, row 1, column "c \(ng\/L\)"/, /twice/]),
  jar('DOC zero', 'C0 (ng/L),DOC (mg/L),dose (mg/L),c (ng/L)\n2000,0,2,1140\n', [/jar\.csv, row 2, column "DOC \(mg\/L\)"/]),
  jar('value beyond the double range', JAR.replace('2000,4,719', '2000,4,1e999'), [/jar\.csv, row 3, column "c \(ng\/L\)"/, /double range/]),
  // ── calibrate options and background JSON ─────────────────────────────────────────────────
  opt('calibrate: --model missing', ['calibrate', '@jar.csv', '--compound', '@cmp.json'], [/--model/]),
  opt('calibrate: --model unknown', ['calibrate', '@jar.csv', '--model', 'langmuir', '--compound', '@cmp.json'], [/--model/]),
  opt('calibrate: --compound missing', ['calibrate', '@jar.csv', '--model', 'sebc'], [/--compound/]),
  opt('calibrate: fictive-k without --background', ['calibrate', '@jar.csv', '--model', 'fictive-k', '--compound', '@cmp.json'], [/--background/]),
  opt('calibrate: --doc zero', ['calibrate', '@jar.csv', '--model', 'sebc', '--compound', '@cmp.json', '--doc', '0 mg/L'], [/--doc/]),
  opt('calibrate: --doc decimal comma', ['calibrate', '@jar.csv', '--model', 'sebc', '--compound', '@cmp.json', '--doc', '7,5 mg/L'], [/--doc/, /decimal comma/]),
  opt('calibrate: --separator bad', ['calibrate', '@jar.csv', '--model', 'sebc', '--compound', '@cmp.json', '--separator', '|'], [/--separator/]),
  opt('calibrate: --out is the jar-test file', ['calibrate', '@jar.csv', '--model', 'sebc', '--compound', '@cmp.json', '--out', '@jar.csv'], [/option --out/, /input/]),
  opt('calibrate: --out is the compound file', ['calibrate', '@jar.csv', '--model', 'sebc', '--compound', '@cmp.json', '--out', '@cmp.json'], [/option --out/, /input/]),
  ...backgroundCases(),
  // ── isotherm CSV (fractionate) ────────────────────────────────────────────────────────────
  iso('empty file', '', [/empty table/]),
  iso('only a comment', '# nothing here\n', [/empty table/]),
  iso('missing DOC column', 'dose (mg/L),DOC0 (mg/L)\n0,8\n', [/missing column/]),
  iso('DOC rises with dose', ISO.replace('20,8.2,6.69', '20,8.2,8.1'), [/row 5, column "DOC \(mg\/L\)"/, /higher than/]),
  iso('DOC rises with dose in small steps', 'dose (mg/L),DOC0 (mg/L),DOC (mg/L)\n0,8,8\n5,8,6.0\n10,8,6.3\n20,8,6.6\n40,8,6.9\n80,8,7.2\n', [/row 6, column "DOC \(mg\/L\)"/, /higher than 6 mg\/L at dose 5 mg\/L \(row 3\)/]),
  iso('DOC above DOC0', 'dose (mg/L),DOC0 (mg/L),DOC (mg/L)\n5,8,9.5\n10,8,7\n20,8,6\n40,8,5\n', [/row 2, column "DOC \(mg\/L\)"/, /DOC0/]),
  iso('UV254 rises with dose', 'dose (mg/L),DOC0 (mg/L),DOC (mg/L),UV254 (1/m),UV254_0 (1/m)\n0,8,8,18,18\n10,8,7,15,18\n20,8,6.5,17.5,18\n40,8,6,12,18\n80,8,5.5,10,18\n', [/row 4, column "UV254 \(1\/m\)"/, /higher than/]),
  iso('gap in an isotherm row', ISO.replace('10,8.2,7.16', '10,8.2,n.a.'), [/row 4, column "DOC \(mg\/L\)"/, /"n\.a\." marks a gap/]),
  iso('dash in an isotherm row', ISO.replace('10,8.2,7.16', '10,-,7.16'), [/row 4, column "DOC0 \(mg\/L\)"/, /marks a gap/]),
  iso('dose-0 row disagrees with DOC0', ISO.replace('0,8.2,8.2', '0,8.2,7'), [/row 2, column "DOC \(mg\/L\)"/]),
  iso('no DOC0 and no dose-0 row', 'dose (mg/L),DOC (mg/L)\n10,6\n20,5\n40,4\n', [/no initial DOC/]),
  iso('negative dose', ISO.replace('5,8.2,7.49', '-5,8.2,7.49'), [/row 3, column "dose \(mg\/L\)"/]),
  iso('equilibrium DOC zero', ISO.replace('300,8.2,3.55', '300,8.2,0'), [/row 8, column "DOC \(mg\/L\)"/]),
  iso('a unit of the wrong kind', ISO.replace('DOC (mg/L)\n', 'DOC (m3/d)\n'), [/row 1, column "DOC \(m3\/d\)"/]),
  iso('ragged rows', ISO.replace('5,8.2,7.49', '5,8.2'), [/malformed CSV/]),
  iso('text in a number cell', ISO.replace('5,8.2,7.49', '5,8.2,seven'), [/row 3, column "DOC \(mg\/L\)"/, /"seven" is not a number/]),
  iso('mixed decimal marks', 'dose (mg/L);DOC0 (mg/L);DOC (mg/L)\n0;8,2;8,2\n5;8,2;7.49\n10;8,2;7,16\n20;8,2;6,69\n', [/row 3, column "DOC \(mg\/L\)"/, /decimal point but the table uses decimal commas/]),
  iso('too few rows for the components', 'dose (mg/L),DOC0 (mg/L),DOC (mg/L)\n0,8,8\n10,8,6\n', [/only 1 row/]),
  iso('formula in a number cell', ISO.replace('5,8.2,7.49', '5,8.2,=1+1'), [/row 3, column "DOC \(mg\/L\)"/, /not a number/]),
  iso('direction override in a header is removed', ISO.replace('DOC (mg/L)\n', 'DOC\u202e (mg/L)\n').replace('5,8.2,7.49', '5,8.2,seven'), [/row 3, column "DOC \(mg\/L\)"/, /^[^\u202e]*$/]),
  opt('fractionate: --exponent text', ['fractionate', '@iso.csv', '--exponent', 'small'], [/--exponent/]),
  opt('fractionate: --exponent zero', ['fractionate', '@iso.csv', '--exponent', '0'], [/--exponent/]),
  opt('fractionate: --components 9', ['fractionate', '@iso.csv', '--components', '9'], [/--components/]),
  opt('fractionate: --components many', ['fractionate', '@iso.csv', '--components', 'many'], [/--components/]),
  opt('fractionate: --k-grid negative', ['fractionate', '@iso.csv', '--k-grid', '10,-3'], [/--k-grid/]),
  opt('fractionate: --k-grid wrong length', ['fractionate', '@iso.csv', '--k-grid', '10,30', '--components', '3'], [/--k-grid|--components/]),
  opt('fractionate: --decimal bad', ['fractionate', '@iso.csv', '--decimal', ':'], [/--decimal/]),
  opt('fractionate: --out is the input', ['fractionate', '@iso.csv', '--out', '@iso.csv'], [/option --out/, /input of this command/]),
  opt('fractionate: --out is a folder', ['fractionate', '@iso.csv', '--out', '.'], [/option --out/, /is a folder/]),
  opt('fractionate: --out below a file', ['fractionate', '@iso.csv', '--out', '@mix.json/bg.json'], [/option --out/, /is a file/]),
  opt('fractionate: --out empty', ['fractionate', '@iso.csv', '--out', ''], [/--out/]),
  opt('fractionate: isotherm missing', ['fractionate', '@none.csv'], [/none\.csv/, /not found/]),
  opt('fractionate: .xlsx missing', ['fractionate', '@none.xlsx#Sheet1'], [/none\.xlsx/, /not found/]),
  opt('fractionate: .xlsx that is not a workbook', ['fractionate', '@fake.xlsx'], [/fake\.xlsx/, /cannot read the workbook/], { 'fake.xlsx': ISO }),
  // ── project JSON (run) ────────────────────────────────────────────────────────────────────
  project('malformed', { 'project.json': '{\n  "name": "x",\n  "site": {\n}' }, [/project\.json/, /line 4, column 2/]),
  project('duplicate key', { 'project.json': JSON.stringify(demoProject).replace('"name":', '"name": "a", "name":') }, [/project\.json/, path('name'), /duplicate key/]),
  project('number beyond the double range', { 'project.json': JSON.stringify(demoProject).replace('"price_per_kg":2.4', '"price_per_kg":1e500') }, [path('carbons[0].price_per_kg'), /double range/]),
  project('unknown top-level key', { 'project.json': proj((p) => { p.goal = {}; }) }, [path('goal'), /did you mean "goals"/]),
  project('unknown site key', { 'project.json': proj((p) => { p.site.flwo = 1; }) }, [path('site.flwo'), /did you mean "flow"/]),
  project('unknown compound key', { 'project.json': proj((p) => { p.compounds[1].K_units = p.compounds[1].K_unit; }) }, [path('compounds[1].K_units'), /did you mean "K_unit"/]),
  project('unknown carbon key', { 'project.json': proj((p) => { p.carbons[0].pricePerKg = 2; }) }, [path('carbons[0].pricePerKg'), /did you mean "price_per_kg"/]),
  project('unknown goals key', { 'project.json': proj((p) => { p.goals.removal = 80; }) }, [path('goals.removal'), /did you mean/]),
  project('unknown K_unit key in a compound', { 'project.json': proj((p) => { p.compounds[1].K_unit.cc = 'ug/L'; }) }, [path('compounds[1].K_unit.cc'), /did you mean "c"/]),
  project('unknown jar_tests key', { 'project.json': proj((p) => { p.compounds[0].jar_tests.modle = 'sebc'; }) }, [path('compounds[0].jar_tests.modle'), /did you mean "model"/]),
  project('unknown pilot key', { 'project.json': proj((p) => { p.pilot.band = 5; }) }, [path('pilot.band'), /did you mean "band_percent"/]),
  project('unknown uncertainty key', { 'project.json': proj((p) => { p.uncertainty.drawz = 5; }) }, [path('uncertainty.drawz'), /did you mean "draws"/]),
  project('unknown fractionation key', { 'project.json': proj((p) => { p.background.fractionation.exponant = 0.2; }) }, [path('background.fractionation.exponant'), /did you mean "exponent"/]),
  project('site doc with a decimal comma', { 'project.json': proj((p) => { p.site.doc = '8,5 mg/L'; }) }, [path('site.doc'), /decimal comma/]),
  project('site flow zero', { 'project.json': proj((p) => { p.site.flow = '0 m3/d'; }) }, [path('site.flow')]),
  project('compounds empty', { 'project.json': proj((p) => { p.compounds = []; }) }, [path('compounds')]),
  project('duplicate compound ids', { 'project.json': proj((p) => { p.compounds[1].id = 'CBZ'; }) }, [path('compounds[1].id')]),
  project('jar-test model unknown', { 'project.json': proj((p) => { p.compounds[0].jar_tests.model = 'ebx'; }) }, [path('compounds[0].jar_tests.model')]),
  project('isotherm file missing', { 'project.json': proj((p) => { p.background.isotherm = 'none.csv'; }) }, [/none\.csv/, /background\.isotherm/]),
  project('series file missing', { 'project.json': proj((p) => { p.site.series = 'none.csv'; }) }, [/none\.csv/, /site\.series/]),
  project('jar-test file missing', { 'project.json': proj((p) => { p.compounds[0].jar_tests.file = 'none.csv'; }) }, [/none\.csv/, /compounds\[0\]\.jar_tests\.file/]),
  project('pilot file missing', { 'project.json': proj((p) => { p.pilot.file = 'none.csv'; }) }, [/none\.csv/, /pilot\.file/]),
  project('xlsx sheet missing', { 'project.json': proj((p) => { p.background.isotherm = 'none.xlsx#Iso'; }) }, [/none\.xlsx/, /background\.isotherm/]),
  project('project is an array', { 'project.json': '[]' }, [/project\.json/, path('$')]),
  project('project is empty', { 'project.json': '' }, [/project\.json/, /empty/]),
  project('series: bad date', { 'site_series.csv': demoFile('site_series.csv').replace('2025-01-03', '2025-02-30') }, [/site_series\.csv, row 5, column "date"/, /not a date/]),
  project('series: US date', { 'site_series.csv': demoFile('site_series.csv').replace('2025-01-03', '1/3/2025') }, [/site_series\.csv, row 5, column "date"/]),
  project('series: dates out of order', { 'site_series.csv': demoFile('site_series.csv').replace('2025-01-03', '2024-12-31') }, [/site_series\.csv, row 5, column "date"/, /does not follow/]),
  project('series: every DOC a gap', { 'site_series.csv': 'date,DOC (mg/L)\n2025-01-01,n.a.\n2025-01-02,-\n' }, [/site_series\.csv/, /every day of the series is a gap/]),
  project('series: DOC zero', { 'site_series.csv': demoFile('site_series.csv').replace(/2025-01-03,[\d.]+,/, '2025-01-03,0,') }, [/site_series\.csv, row 5, column "DOC \(mg\/L\)"/]),
  project('series: no date column', { 'site_series.csv': 'day0,DOC (mg/L)\nx,1\n' }, [/site_series\.csv/, /date/]),
  project('isotherm: DOC rises', { 'doc_isotherm.csv': demoFile('doc_isotherm.csv').replace('40,8.00,6.19', '40,8.00,7.6') }, [/doc_isotherm\.csv, row 7, column "DOC \(mg\/L\)"/]),
  project('jar tests: c rises', { 'jar_tests_cbz.csv': demoFile('jar_tests_cbz.csv').replace('500,8.00,40,15.7', '500,8.00,40,150') }, [/jar_tests_cbz\.csv, row 6, column "c \(ng\/L\)"/]),
  project('pilot: unknown compound', { 'pilot_pairs.csv': demoFile('pilot_pairs.csv').replace('removal CBZ (%)', 'removal XYZ (%)') }, [/pilot_pairs\.csv/, /XYZ/]),
  project('pilot: gap in a required cell', { 'pilot_pairs.csv': demoFile('pilot_pairs.csv').replace(/\nP1,([\d.]+),/, '\nP1,n.a.,') }, [/pilot_pairs\.csv, row \d+, column "dose \(mg\/L\)"/, /gap/]),
  project('--out is the project folder', {}, [/option --out/, /holds the input/], ['--out', '.']),
  project('--out is an existing file', { 'afile.txt': 'keep me' }, [/option --out/, /existing file/], ['--out', 'afile.txt']),
  project('--out is a folder of other files', { 'docs/keep.txt': 'keep me' }, [/option --out/, /not sorbshare results/], ['--out', 'docs']),
  project('--out inside a file', {}, [/option --out/, /is a file/], ['--out', 'project.json/out']),
  project('--out equals the isotherm', {}, [/option --out/, /doc_isotherm\.csv/], ['--out', 'doc_isotherm.csv']),
  project('--draws negative', {}, [/--draws/], ['--draws', '-1']),
  project('--draws too many', {}, [/--draws/], ['--draws', '99999999']),
  project('--seed text', {}, [/--seed/], ['--seed', 'abc']),
  project('--separator word', {}, [/--separator/], ['--separator', 'tab']),
  project('--decimal forced wrong for the demo', {}, [/doc_isotherm\.csv|site_series\.csv|jar_tests_cbz\.csv/, /decimal point but the table uses decimal commas/], ['--decimal', ',']),
  project('project file missing', {}, [/nothing\.json/, /not found/], []),
  project('a flow so large the yearly carbon overflows', { 'project.json': proj((p) => { p.site.flow = '1e308 m3/d'; delete p.site.series; }) }, [/computation failed/, /carbons\[0\]\.carbonKgPerDAtDesign would be infinite/, /site\.flow/], [], 1),
  project('a price so large the yearly cost overflows', { 'project.json': proj((p) => { p.carbons[0].price_per_kg = 1e306; }) }, [/computation failed/, /carbons\[0\] \("Carbon A \(coal-based\)"\)\.price_per_kg/], [], 1),
];

function backgroundCases(): BadCase[] {
  const bg = readFileSync(join(process.cwd(), 'fixtures/project/background-file/background.json'), 'utf8');
  const bgObj = JSON.parse(bg) as Record<string, any>;
  const c = (name: string, text: string, place: RegExp[]): BadCase => ({
    name: `background: ${name}`, files: { 'jar.csv': JAR, 'cmp.json': JSON.stringify(COMPOUND), 'bg.json': text },
    args: (p) => ['calibrate', p('jar.csv'), '--model', 'fictive-k', '--compound', p('cmp.json'), '--background', p('bg.json'), '--out', p('cal.json')], code: 2, place: [/bg\.json/, ...place],
  });
  return [
    c('malformed', bg.slice(0, 40), [/end of file/]),
    c('duplicate key', bg.replace('"doc0_mg_per_L":', '"doc0_mg_per_L": 1, "doc0_mg_per_L":'), [path('doc0_mg_per_L'), /duplicate key/]),
    c('unknown top-level key', mutate(bgObj, (b) => { b.doc0 = 8; }), [path('doc0'), /did you mean "doc0_mg_per_L"/]),
    c('unknown component key', mutate(bgObj, (b) => { b.components[1].fractoin = 0.1; }), [path('components[1].fractoin'), /did you mean "fraction"/]),
    c('unknown fit key', mutate(bgObj, (b) => { b.fit.rmse = 1; }), [path('fit.rmse'), /did you mean/]),
    c('fractions do not sum to 1', mutate(bgObj, (b) => { b.components[1].fraction += 0.2; }), [path('components'), /sum to/]),
    c('negative K', mutate(bgObj, (b) => { b.components[1].K = -2; }), [path('components[1].K')]),
    c('doc0 beyond the double range', bg.replace(/"doc0_mg_per_L":\s*[\d.]+/, '"doc0_mg_per_L": 1e999'), [path('doc0_mg_per_L'), /double range/]),
    c('components empty', mutate(bgObj, (b) => { b.components = []; }), [path('components')]),
    c('not an object', '42', [path('$')]),
  ];
}

let root: string;
let results: Map<string, CaseResult>;

beforeAll(async () => {
  requireBuild();
  root = mkdtempSync(join(tmpdir(), 'sorbshare-robustness-'));
  results = await runCases(root, CASES.map((c) => (c.name === 'project: project file missing' ? { ...c, args: (p) => ['run', p('nothing.json'), '--out', p('out')] } : c)));
}, 600_000);

afterAll(() => { if (root) rmSync(root, { recursive: true, force: true }); });

describe('bad and hostile inputs (CLI: the first case of each kind and command spawned, the others through runCli in-process)', () => {
  it('covers at least 150 cases', () => {
    expect(CASES.length).toBeGreaterThanOrEqual(150);
    expect(new Set(CASES.map((c) => c.name)).size).toBe(CASES.length);
  });
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
