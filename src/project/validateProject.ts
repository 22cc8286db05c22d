/**
 * Validate a project object (the parsed project JSON) and convert every quantity to internal
 * units. Hand-written so that each message names the JSON path and what was expected; the same
 * rules are published as a JSON Schema in schema/project.schema.json (kept in step; a test
 * checks both on every fixture project).
 *
 * @throws InputError with the JSON path (e.g. `compounds[2].one_over_n`) and what was expected.
 */
import { InputError } from '../core/errors.js';
import { readComponent } from '../scenario/readMixture.js';
import { parseQuantity } from '../units/parseQuantity.js';
import { at, describeValue, expectArray, expectObject, expectString, onlyKeys, required } from '../scenario/jsonChecks.js';
import type { CalibrationModelName, CompoundSpec, ProjectCover, ProjectSpec, SiteSpec } from './projectTypes.js';
import { positive, readAbsorbance, readLimit } from './quantities.js';
import { readBackground } from './readBackgroundSpec.js';
import { readCarbons } from './readCarbons.js';
import { resolveCarbonBackgrounds } from './readCarbonBackground.js';
import { readGoals } from './readGoals.js';
import { readPilot } from './readPilotSpec.js';
import { readPacContact } from './readPacContact.js';
import { checkKineticInputs } from './checkKineticInputs.js';
import { readUncertainty } from './readUncertaintySpec.js';
import { readCalibrationTransfer } from './readCalibrationTransfer.js';
import { readReportOnly } from './readCompoundGoalKey.js';

const CALIBRATION_MODELS: readonly CalibrationModelName[] = ['ebc', 'sebc', 'fictive-k'];

/** Validate a parsed project file. */
export function validateProject(raw: unknown): ProjectSpec {
  const root = expectObject(raw, '$', 'a project');
  onlyKeys(root, ['$schema', 'name', 'note', ...COVER_KEYS.map((k) => k[0]), 'site', 'background', 'carbons', 'compounds', 'goals', 'pilot', 'uncertainty', 'calibration_transfer'], '');
  const name = expectString(required(root, 'name', '', 'the project name as text'), 'name', 'the project name as text');
  const site = readSite(required(root, 'site', '', 'the site object { name, flow, doc }'));
  const compounds = readCompounds(required(root, 'compounds', '', 'an array of compounds'));
  const transfer = root.calibration_transfer === undefined ? undefined : readCalibrationTransfer(root.calibration_transfer, compounds);
  const background = readBackground(required(root, 'background', '', 'the background: { "isotherm": CSV }, { "file": JSON } or { "ebc": {…} }'), compounds, site, transfer);
  const carbons = readCarbons(required(root, 'carbons', '', 'an array of candidate carbons'), compounds);
  resolveCarbonBackgrounds(background, carbons);
  const goals = readGoals(root.goals, compounds);
  checkKineticInputs(site.pacContact, carbons, compounds);
  const out: ProjectSpec = { name, site, background, carbons, compounds, goals };
  if (root.note !== undefined) out.note = expectString(root.note, 'note', 'a note as text');
  const cover = readCover(root);
  if (cover) out.cover = cover;
  if (root.pilot !== undefined) out.pilot = readPilot(root.pilot, carbons);
  if (root.uncertainty !== undefined) out.uncertainty = readUncertainty(root.uncertainty);
  if (transfer) out.calibrationTransfer = transfer;
  return out;
}

/** Optional cover keys of the project file and their ProjectCover fields. */
const COVER_KEYS = [['client', 'client'], ['project_number', 'projectNumber'], ['author', 'author'], ['checker', 'checker'], ['revision', 'revision'], ['date', 'date']] as const;

function readCover(root: Record<string, unknown>): ProjectCover | undefined {
  const cover: ProjectCover = {};
  for (const [key, field] of COVER_KEYS) {
    if (root[key] === undefined) continue;
    const v = expectString(root[key], key, key === 'date' ? 'the issue date as YYYY-MM-DD' : `the ${key.replace('_', ' ')} as text`);
    if (key === 'date' && (!/^\d{4}-\d{2}-\d{2}$/.test(v) || Number.isNaN(Date.parse(`${v}T00:00:00Z`)) || new Date(`${v}T00:00:00Z`).toISOString().slice(0, 10) !== v)) {
      throw new InputError(`expected the issue date as YYYY-MM-DD, got "${v}"`, { path: 'date' });
    }
    cover[field] = v;
  }
  return Object.keys(cover).length ? cover : undefined;
}

function readSite(raw: unknown): SiteSpec {
  const p = 'site';
  const o = expectObject(raw, p, 'the site { name, flow, doc }');
  onlyKeys(o, ['name', 'note', 'flow', 'doc', 'uv254', 'series', 'pac_contact'], p);
  const site: SiteSpec = {
    name: expectString(required(o, 'name', p, 'the site name as text'), `${p}.name`, 'the site name as text'),
    flowM3PerD: positive(at(`${p}.flow`, () => parseQuantity(required(o, 'flow', p, 'the design flow such as "12000 m3/d"'), 'flow')), `${p}.flow`, 'a positive flow such as "12000 m3/d"'),
    docMgPerL: positive(at(`${p}.doc`, () => parseQuantity(required(o, 'doc', p, 'the effluent DOC such as "8 mg/L"'), 'massConcentration')), `${p}.doc`, 'a positive DOC such as "8 mg/L"'),
  };
  if (o.uv254 !== undefined) site.uv254PerM = readAbsorbance(o.uv254, `${p}.uv254`);
  const contact = readPacContact(o.pac_contact ?? 'equilibrium');
  if (contact) site.pacContact = contact;
  if (o.series !== undefined) site.seriesFile = expectString(o.series, `${p}.series`, 'the path of a CSV file (date, DOC, flow) relative to the project file');
  return site;
}

function readCompounds(raw: unknown): CompoundSpec[] {
  const arr = expectArray(raw, 'compounds', 'an array of compounds', 1);
  const ids = new Set<string>();
  return arr.map((c, i) => {
    const p = `compounds[${i}]`;
    const o = expectObject(c, p, 'a compound { id, name, K, one_over_n, c0 }');
    onlyKeys(o, ['id', 'name', 'note', 'K', 'one_over_n', 'K_unit', 'molar_mass', 'c0', 'jar_tests', 'limit', 'indicator_category', 'goal'], p);
    required(o, 'id', p, 'a short text id such as "CBZ"');
    required(o, 'K', p, 'the single-solute Freundlich K as a number');
    const comp = readComponent(o, p, true);
    if (!(comp.K > 0)) throw new InputError('expected K > 0 for a target compound (a non-adsorbable compound cannot be removed by carbon)', { path: `${p}.K` });
    if (ids.has(comp.id)) throw new InputError(`duplicate compound id "${comp.id}"; every compound needs its own id`, { path: `${p}.id` });
    ids.add(comp.id);
    if (!(comp.c0MgPerL > 0)) throw new InputError('expected a positive concentration in the site water such as "400 ng/L"', { path: `${p}.c0` });
    const spec: CompoundSpec = {
      id: comp.id,
      name: o.name === undefined ? comp.id : expectString(o.name, `${p}.name`, 'the compound name as text'),
      K: comp.K,
      oneOverN: comp.oneOverN,
      c0MgPerL: comp.c0MgPerL,
    };
    if (typeof o.molar_mass === 'number') spec.molarMassGPerMol = o.molar_mass;
    if (o.jar_tests !== undefined) {
      const jp = `${p}.jar_tests`;
      const j = expectObject(o.jar_tests, jp, 'jar tests { "file": CSV, "model": "ebc" | "sebc" | "fictive-k" }');
      onlyKeys(j, ['file', 'model', 'note'], jp);
      const file = expectString(required(j, 'file', jp, 'the jar-test CSV path relative to the project file'), `${jp}.file`, 'a CSV path relative to the project file');
      const model = required(j, 'model', jp, 'the calibration model "ebc", "sebc" or "fictive-k"');
      if (typeof model !== 'string' || !CALIBRATION_MODELS.includes(model as CalibrationModelName)) {
        throw new InputError(`expected the calibration model "ebc", "sebc" or "fictive-k", got ${describeValue(model)}`, { path: `${jp}.model` });
      }
      spec.jarTests = { file, model: model as CalibrationModelName };
    }
    if (readReportOnly(o, p)) spec.reportOnly = true;
    if (o.limit !== undefined) spec.limitMgPerL = readLimit(o.limit, `${p}.limit`);
    if (o.indicator_category !== undefined) {
      if (o.indicator_category !== 1 && o.indicator_category !== 2) throw new InputError(`expected indicator category 1 or 2 (SR 814.201.231), got ${describeValue(o.indicator_category)}`, { path: `${p}.indicator_category` });
      spec.indicatorCategory = o.indicator_category;
    }
    return spec;
  });
}

