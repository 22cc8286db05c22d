/**
 * The column tests of a GAC carbon in a project file, `carbons[i].kinetics.column_tests`, beside
 * the carbon's other fixed-bed inputs (bed_depth, particle_radius, Ds, …):
 *
 *   "column_tests": { "Ds": { "CBZ": {
 *       "file": "breakthrough_cbz.csv", "ebct": "2 min", "bed_depth": "0.3 m",
 *       "particle_radius": "0.1 mm", "scale_up": "proportional", "porosity": 0.4 } } }
 *
 * Each entry names a breakthrough table of one target from a pilot or small column (CSV, or an
 * .xlsx sheet `file.xlsx#Sheet`, relative to the project file; columns bed volumes and c/c0, or c
 * with C0: src/calibration/breakthroughData.ts), the tested column's EBCT and bed depth, and
 * optionally its grain radius and porosity (default: the carbon's). Its fit (`sorbshare calibrate
 * --model column`) replaces the target's Ds in the carbon's fixed-bed inputs; a test with smaller
 * grains than the full-size bed needs "scale_up": "constant" or "proportional" diffusivity
 * (src/kinetics/smallColumnScaling.ts). src/io/loadProject.ts reads the tables,
 * src/pipeline/columnCalibrationStep.ts fits them.
 * Units: EBCT s inside (any time unit in the file), lengths m.
 * @throws InputError naming the JSON path and what was expected
 */
import { InputError } from '../core/errors.js';
import type { DiffusivityScaling } from '../kinetics/smallColumnScaling.js';
import { parseQuantity } from '../units/parseQuantity.js';
import { at, describeValue, expectNumber, expectObject, join, onlyKeys } from '../scenario/jsonChecks.js';

/** One column test of one target (internal units). */
export interface ColumnTestSpec {
  /** The table as the project names it (relative to the project file). */
  file: string;
  ebctS: number;
  bedDepthM: number;
  /** Grain radius of the tested carbon, m (absent: the carbon's particle_radius). */
  particleRadiusM?: number;
  /** Bed porosity of the tested column (absent: the carbon's). */
  porosity?: number;
  /** Diffusivity scaling from the test's grains to the carbon's (absent when the grains are the same). */
  scaleUp?: DiffusivityScaling;
}

/** Column tests of a GAC carbon by compound id. */
export interface ColumnTestsSpec {
  ds: Record<string, ColumnTestSpec>;
}

function positive(v: unknown, path: string, kind: 'time' | 'length', example: string): number {
  const x = at(path, () => parseQuantity(v, kind, { allowZero: false }));
  if (!(x > 0) || !Number.isFinite(x)) throw new InputError(`expected a positive value such as "${example}", got ${describeValue(v)}`, { path });
  return x;
}

function readTest(raw: unknown, path: string): ColumnTestSpec {
  const o = expectObject(raw, path, 'a column test { "file": "breakthrough.csv", "ebct": "2 min", "bed_depth": "0.3 m" }');
  onlyKeys(o, ['file', 'ebct', 'bed_depth', 'particle_radius', 'porosity', 'scale_up', 'note'], path);
  if (typeof o.file !== 'string' || o.file.trim() === '') throw new InputError(`expected the file name of a breakthrough table such as "breakthrough.csv" (or "column.xlsx#Sheet1"), got ${describeValue(o.file)}`, { path: join(path, 'file') });
  if (o.ebct === undefined) throw new InputError('missing "ebct": the tested column\'s empty-bed contact time, e.g. "2 min"', { path: join(path, 'ebct') });
  if (o.bed_depth === undefined) throw new InputError('missing "bed_depth": the tested column\'s bed depth, e.g. "0.3 m"', { path: join(path, 'bed_depth') });
  const t: ColumnTestSpec = { file: o.file, ebctS: positive(o.ebct, join(path, 'ebct'), 'time', '2 min'), bedDepthM: positive(o.bed_depth, join(path, 'bed_depth'), 'length', '0.3 m') };
  if (o.particle_radius !== undefined) t.particleRadiusM = positive(o.particle_radius, join(path, 'particle_radius'), 'length', '0.1 mm');
  if (o.porosity !== undefined) t.porosity = expectNumber(o.porosity, join(path, 'porosity'), 'a bed porosity between 0 and 1', (x) => x > 0 && x < 1);
  if (o.scale_up !== undefined) {
    if (o.scale_up !== 'constant' && o.scale_up !== 'proportional') throw new InputError(`expected "constant" or "proportional" (diffusivity scaling from the test's grains to the carbon's), got ${describeValue(o.scale_up)}`, { path: join(path, 'scale_up') });
    t.scaleUp = o.scale_up;
  }
  return t;
}

/** Read `carbons[i].kinetics.column_tests`; `particleRadiusM` is the carbon's grain radius (for the scale-up check). */
export function readColumnTests(raw: unknown, path: string, compoundIds: readonly string[], particleRadiusM: number): ColumnTestsSpec {
  const o = expectObject(raw, path, 'the column tests { "Ds": { "<compound id>": { "file", "ebct", "bed_depth" } } }');
  onlyKeys(o, ['Ds', 'note'], path);
  const p = `${path}.Ds`;
  if (o.Ds === undefined) throw new InputError('expected the column tests by compound id under "Ds"; remove "column_tests" otherwise', { path: p });
  const ds = expectObject(o.Ds, p, `column tests by compound id, e.g. { "${compoundIds[0] ?? 'CBZ'}": { "file": "breakthrough.csv", "ebct": "2 min", "bed_depth": "0.3 m" } }`);
  const spec: ColumnTestsSpec = { ds: {} };
  for (const [id, v] of Object.entries(ds)) {
    if (!compoundIds.includes(id)) throw new InputError(`"${id}" is not a compound id; expected one of ${compoundIds.map((x) => `"${x}"`).join(', ')}`, { path: join(p, id) });
    const t = readTest(v, join(p, id));
    const r = t.particleRadiusM ?? particleRadiusM;
    if (Math.abs(r / particleRadiusM - 1) > 1e-9 && t.scaleUp === undefined) throw new InputError(`the test's grain radius ${r} m differs from the carbon's ${particleRadiusM} m; expected "scale_up": "constant" or "proportional" (diffusivity scaling of a small-column test)`, { path: join(join(p, id), 'scale_up') });
    spec.ds[id] = t;
  }
  if (Object.keys(spec.ds).length === 0) throw new InputError('expected at least one column test by compound id; remove "column_tests" otherwise', { path: p });
  return spec;
}
