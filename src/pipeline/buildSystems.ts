/**
 * Step 3 of the job: one adsorption system per (carbon, compound) from the project, the
 * background step and the calibrations (see src/design/competitionSystem.ts for the carbon rules).
 *
 * Competitor of each compound, in order of precedence:
 *   1. an EBC calibrated from its jar tests (models "ebc", "sebc"; for "sebc" the EBC takes the
 *      target's own isotherm on each carbon, Qi et al. 2007, from memory);
 *   2. for a compound without jar tests, an EBC transferred from the calibrated compounds
 *      (calibrationTransferStep.ts; simplified-EBC rule: the compound's own isotherm);
 *   3. the EBC given for it in the project's background (EBC background);
 *   4. the fractionated DOC (fictive components: the carbon's own, carbonBackgroundStep.ts, or the
 *      project's with the carbon's K factor), with the target's K times the calibrated
 *      factor of model "fictive-k" (Schideman et al. 2006; Worch 2010; both from memory), or,
 *      without jar tests, the factor transferred from the calibrated compounds.
 * EBC concentrations scale with DOC: c0_EBC(DOC) = c0_EBC,ref · DOC / DOC_ref (Zietzschmann et
 * al. 2016 found the EBC concentration correlated with DOC).
 */
import { backgroundComponents } from '../fractionation/backgroundPrediction.js';
import { InputError } from '../core/errors.js';
import type { CarbonSpec, ProjectSpec } from '../project/projectTypes.js';
import type { BackgroundStep } from './backgroundStep.js';
import type { CompoundCalibration } from './calibrationStep.js';
import { scaleK, type CompoundSystem } from '../design/competitionSystem.js';
import type { TransferredCalibration } from './calibrationTransferStep.js';
import type { CarbonBackground } from './carbonBackgroundStep.js';

function fmtK(K: number): string {
  return Number(K.toPrecision(4)).toString();
}

/** Systems of every compound (project order) on one carbon. */
/**
 * @param bg the carbon's background (carbonBackgroundStep.ts: its own fictive components, or the
 *   project's with the carbon's K factor); a project-level background step means the latter
 */
export function buildSystems(project: ProjectSpec, carbon: CarbonSpec, bg: Pick<BackgroundStep, 'background'> | CarbonBackground, calibrations: ReadonlyMap<string, CompoundCalibration>, transfer?: TransferredCalibration): CompoundSystem[] {
  const f = carbon.kFactor;
  const ownBackground = 'source' in bg && (bg.source === 'own isotherm' || bg.source === 'own file');
  const bf = 'backgroundKFactor' in bg ? bg.backgroundKFactor : f;
  return project.compounds.map((comp) => {
    const own = carbon.isotherms[comp.id];
    const single = own ? { K: own.K, oneOverN: own.oneOverN } : { K: comp.K * f, oneOverN: comp.oneOverN };
    const cal = calibrations.get(comp.id);
    const t = cal ? undefined : transfer;
    const calibration = cal ? `jar tests (model ${cal.model})` : t?.label;
    const base = { compoundId: comp.id, carbonName: carbon.name, c0MgPerL: comp.c0MgPerL, single, ...(calibration ? { calibration } : {}) };
    if (cal?.ebc) {
      const e = cal.ebc;
      const ebcIso = cal.model === 'sebc' ? single : { K: e.K * f, oneOverN: e.oneOverN };
      return {
        ...base,
        inMixture: single,
        competition: 'ebc',
        background: (doc: number) => [{ id: `EBC ${comp.id}`, c0MgPerL: (e.c0MgPerL * doc) / e.docMgPerL, K: ebcIso.K, oneOverN: ebcIso.oneOverN }],
        description: `EBC calibrated from jar tests (model ${cal.model}): K = ${fmtK(ebcIso.K)} (mg/g)/(mg/L)^${ebcIso.oneOverN}, c0 = ${fmtK(e.c0MgPerL)} mg/L at DOC ${fmtK(e.docMgPerL)} mg/L`,
      } satisfies CompoundSystem;
    }
    if (t?.ebcC0PerDoc !== undefined) {
      const ratio = t.ebcC0PerDoc;
      return {
        ...base,
        inMixture: single,
        competition: 'ebc',
        background: (doc: number) => [{ id: `EBC ${comp.id}`, c0MgPerL: ratio * doc, K: single.K, oneOverN: single.oneOverN }],
        description: `EBC ${t.label} (simplified-EBC rule, the compound's own isotherm): c0 = ${fmtK(ratio)} mg/L per mg/L DOC`,
      } satisfies CompoundSystem;
    }
    if (project.background.kind === 'ebc') {
      const spec = project.background;
      const e = spec.ebc[comp.id];
      if (!e) throw new InputError(`missing the EBC of compound "${comp.id}"`, { path: `background.ebc.${comp.id}` });
      return {
        ...base,
        inMixture: single,
        competition: 'ebc',
        background: (doc: number) => [{ id: e.id, c0MgPerL: (e.c0MgPerL * doc) / spec.docMgPerL, K: e.K * f, oneOverN: e.oneOverN }],
        description: `EBC from the project: K = ${fmtK(e.K * f)} (mg/g)/(mg/L)^${e.oneOverN}, c0 = ${fmtK(e.c0MgPerL)} mg/L at DOC ${fmtK(spec.docMgPerL)} mg/L`,
      } satisfies CompoundSystem;
    }
    const background = bg.background;
    if (!background) throw new InputError('no fractionated background for the fictive-component model', { path: 'background' });
    const factor = cal?.model === 'fictive-k' && cal.targetKFactor !== undefined ? cal.targetKFactor : t?.targetKFactor ?? 1;
    const factorText = factor === 1 ? '' : (cal ? `, target K × ${fmtK(factor)} from jar tests` : `, target K × ${fmtK(factor)} ${t!.label}`) + (ownBackground ? " (calibrated beside the reference carbon's background)" : '');
    return {
      ...base,
      inMixture: { K: single.K * factor, oneOverN: single.oneOverN },
      competition: 'fictive',
      background: (doc: number) => scaleK(backgroundComponents(background, doc), bf),
      description: `${ownBackground ? "this carbon's own " : ''}fractionated DOC (${background.components.length} fictive components)${factorText}${f !== 1 ? `, carbon K factor ${f}${ownBackground ? ' on the compounds' : ''}` : ''}`,
    } satisfies CompoundSystem;
  });
}
