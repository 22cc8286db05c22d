/**
 * Step 1 of the job: the site's background (competing DOC) as the project gives it —
 * fractionate a DOC isotherm (adsorption analysis, src/fractionation), take a background file as
 * it is, or keep one EBC per compound (Najm, Snoeyink & Richard 1991, J. AWWA).
 */
import type { CsvTable } from '../tables/csvTable.js';
import { fractionate, type FractionateResult } from '../fractionation/fractionate.js';
import type { BackgroundFile } from '../fractionation/backgroundFile.js';
import type { BackgroundSpec } from '../project/projectTypes.js';
import { InputError } from '../core/errors.js';

export interface BackgroundStep {
  source: 'isotherm' | 'file' | 'ebc';
  /** The fictive components (isotherm or file); absent for EBC backgrounds. */
  background?: BackgroundFile;
  /** The fractionation result with fit details (isotherm only). */
  fractionation?: FractionateResult;
  warnings: string[];
}

/**
 * @param spec          the project's background entry
 * @param isotherm      the DOC isotherm table (spec.kind 'isotherm')
 * @param backgroundFile the checked background file (spec.kind 'file')
 * @throws InputError on bad isotherm data; ComputationError if the fit fails
 */
export function backgroundStep(spec: BackgroundSpec, isotherm?: CsvTable, backgroundFile?: BackgroundFile): BackgroundStep {
  if (spec.kind === 'isotherm') {
    if (!isotherm) throw new InputError('the DOC isotherm table was not loaded', { path: 'background.isotherm' });
    const opts: Parameters<typeof fractionate>[1] = { file: isotherm.file ?? spec.file };
    if (spec.options.components !== undefined) opts.components = spec.options.components;
    if (spec.options.exponent !== undefined) opts.exponent = spec.options.exponent;
    if (spec.options.fitK !== undefined) opts.fitK = spec.options.fitK;
    const fr = fractionate(isotherm, opts);
    return { source: 'isotherm', background: fr, fractionation: fr, warnings: [...(fr.warnings ?? [])] };
  }
  if (spec.kind === 'file') {
    if (!backgroundFile) throw new InputError('the background file was not loaded', { path: 'background.file' });
    return { source: 'file', background: backgroundFile, warnings: [] };
  }
  return { source: 'ebc', warnings: [] };
}
