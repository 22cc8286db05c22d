/**
 * Specific dose: carbon dose per unit of DOC, mg carbon per mg DOC,
 *   D_spec = dose (mg/L) / DOC (mg/L).
 * Doses per mg DOC vary far less between effluents than plain doses (Altmann et al. 2014, Water
 * Research 55:185; Zietzschmann et al. 2016, Water Research 102:190), so the report gives it
 * beside every dose.
 *
 * @throws RangeError when DOC is not a positive finite number (a DOC of zero has no specific dose)
 */
export function specificDose(doseMgPerL: number, docMgPerL: number): number {
  if (!(docMgPerL > 0) || !Number.isFinite(docMgPerL)) throw new RangeError(`specific dose needs a positive DOC, got ${docMgPerL} mg/L`);
  return doseMgPerL / docMgPerL;
}
