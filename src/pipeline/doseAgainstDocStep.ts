/**
 * Dose against DOC on one PAC carbon (capability 22): the required dose at DOC values over the
 * site's range, solved as the dose table's nodes are (requiredDoseAt: the dose designDose gives,
 * found from the goal that governed at the nearest DOC solved and checked against every other
 * goal, else designDose itself; the background scaled to each DOC: fictive fractions and EBC
 * concentrations proportional to DOC), beside the alternative rule of a constant specific dose
 * (mg carbon per mg DOC) fixed at the design DOC,
 *   D_const(DOC) = (D_req(DOC_design) / DOC_design) · DOC,
 * the rule that DOC-normalised doses give similar removals across effluents (Zietzschmann et
 * al. 2016, Water Research 102:190). The difference D_req − D_const shows where the rule over-
 * or under-doses.
 *
 * Thin on purpose: when the design model replaces the dose logic, only the `required` callback
 * changes.
 */
import { specificDose } from '../design/specificDose.js';
import type { Design, DesignProblem } from '../design/designDose.js';
import type { DoseTable } from '../design/doseTable.js';
import { requiredDoseAt, type RequiredAtDoc } from '../design/requiredDoseAt.js';
import type { RemovalModel } from '../design/removalModel.js';

export interface DoseAgainstDoc {
  carbonName: string;
  designDocMgPerL: number;
  /** Specific dose at the design DOC, mg carbon / mg DOC. */
  specificDoseAtDesign: number;
  /** Where the DOC range came from. */
  rangeSource: 'DOC series' | 'design DOC ±50 %';
  docMgPerL: number[];
  /** Required dose (IAST with the background scaled to DOC), mg/L; null where no goal is reachable. */
  requiredDoseMgPerL: Array<number | null>;
  /** Dose of the constant-specific-dose rule, mg/L. */
  constantRuleDoseMgPerL: number[];
}

/** DOC range of the figure: the series' min–max, or the design DOC ±50 % (common practice span). */
export function docRange(designDocMgPerL: number, seriesDoc?: readonly number[]): { lo: number; hi: number; source: DoseAgainstDoc['rangeSource'] } {
  if (seriesDoc && seriesDoc.length > 1) {
    const lo = Math.min(...seriesDoc, designDocMgPerL);
    const hi = Math.max(...seriesDoc, designDocMgPerL);
    if (hi > lo) return { lo, hi, source: 'DOC series' };
  }
  return { lo: designDocMgPerL * 0.5, hi: designDocMgPerL * 1.5, source: 'design DOC ±50 %' };
}

/**
 * The required dose at other DOCs on one carbon's model, as the run's dose table solves its
 * nodes (requiredDoseAt), each started from the answer at the nearest DOC already solved: the
 * design DOC's, the table's nodes or an earlier DOC of this figure. At a DOC that is a node of
 * the table the node's answer is taken as it is (the same function at the same DOC).
 * @param design the run's design at the model's DOC
 * @param table  the run's dose table on this carbon, when there is a DOC series
 */
export function requiredAtDocs(model: RemovalModel, problem: DesignProblem, design: Design, table?: DoseTable): (docMgPerL: number) => { doseMgPerL: number | null } {
  const solved: RequiredAtDoc[] = table ? [...table.nodes] : [];
  return (doc) => {
    let near: RequiredAtDoc | undefined;
    for (const s of solved) if (!near || Math.abs(Math.log(s.docMgPerL / doc)) < Math.abs(Math.log(near.docMgPerL / doc))) near = s;
    if (near && near.docMgPerL === doc) return near;
    const r = requiredDoseAt(doc === model.docMgPerL ? model : model.atDoc(doc), problem, design, near && Math.abs(Math.log(near.docMgPerL / doc)) < Math.abs(Math.log(design.docMgPerL / doc)) ? near : undefined);
    solved.push(r);
    return r;
  };
}

/**
 * @param design   the required dose at the design DOC (its dose must be reachable)
 * @param required the required dose at another DOC (requiredAtDocs on this carbon's model)
 * @param range    DOC range, mg/L; `points` evenly spaced values (default 11)
 * @throws RangeError when the design dose is not reachable (no rule to compare)
 */
export function doseAgainstDocStep(
  carbonName: string, design: Design, required: (docMgPerL: number) => { doseMgPerL: number | null },
  range: { lo: number; hi: number; source: DoseAgainstDoc['rangeSource'] }, points = 11,
): DoseAgainstDoc {
  if (design.doseMgPerL === null) throw new RangeError('dose against DOC needs a reachable dose at the design DOC');
  const spec = specificDose(design.doseMgPerL, design.docMgPerL);
  const docs = Array.from({ length: points }, (_, k) => range.lo + ((range.hi - range.lo) * k) / (points - 1));
  return {
    carbonName,
    designDocMgPerL: design.docMgPerL,
    specificDoseAtDesign: spec,
    rangeSource: range.source,
    docMgPerL: docs,
    requiredDoseMgPerL: docs.map((d) => required(d).doseMgPerL),
    constantRuleDoseMgPerL: docs.map((d) => spec * d),
  };
}
