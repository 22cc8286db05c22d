/**
 * Plausibility warnings: inputs and fits that are valid but should make an engineer look twice.
 * Pure functions returning warning texts; the readers, fits and commands add them to their
 * warnings. Ranges are the trade's common practice and say so in the text:
 *
 * - an exponent 1/n above 1 (unfavourable isotherm): IAST then gives loadings above the
 *   single-solute ones for some compositions (the adsorbed-phase mixing rule of Radke & Prausnitz
 *   1972 assumes favourable isotherms in practice);
 * - effluent DOC far outside 5–15 mg/L (common practice for nitrified secondary effluent): below
 *   1 or above 50 mg/L;
 * - a micropollutant above 1 mg/L (trace compounds occur at ng/L to µg/L, common practice);
 * - a carbon dose above 200 mg/L (PAC is dosed at 10–20 mg/L, about 1–2 mg per mg DOC, common
 *   practice);
 * - a fractionation whose share interval spans (almost) the whole 0–100 % range, or whose fitting
 *   starts did not agree: the split is not identifiable from the data;
 * - a calibration on fewer than twice as many jar tests as parameters (common practice for a
 *   least-squares fit worth its intervals).
 */

/** Common-practice ranges used by the warnings (see above). */
export const PLAUSIBLE = {
  docMgPerL: { low: 1, high: 50, typical: '5–15 mg/L' },
  traceC0MgPerL: { high: 1 },
  doseMgPerL: { high: 200, typical: '10–20 mg/L' },
} as const;

/** Warnings for Freundlich components (mixture components, compounds). */
export function componentWarnings(components: ReadonlyArray<{ id: string; K: number; oneOverN: number }>, where = ''): string[] {
  const at = where ? `${where}: ` : '';
  return components.filter((c) => c.K > 0 && c.oneOverN > 1).map((c) => `${at}${c.id} has 1/n = ${c.oneOverN} > 1 (an unfavourable isotherm): IAST then gives loadings above the single-solute ones for some mixtures; check the isotherm`);
}

/** Warnings for trace-compound concentrations (mg/L). */
export function traceC0Warnings(compounds: ReadonlyArray<{ id: string; c0MgPerL: number }>, where = ''): string[] {
  const at = where ? `${where}: ` : '';
  return compounds.filter((c) => c.c0MgPerL > PLAUSIBLE.traceC0MgPerL.high).map((c) => `${at}${c.id} at ${c.c0MgPerL} mg/L is far above the ng/L–µg/L range of micropollutants (common practice); check the unit`);
}

/** Warning for an effluent DOC far outside the common range. */
export function docWarnings(docMgPerL: number, where = 'site DOC'): string[] {
  const r = PLAUSIBLE.docMgPerL;
  return docMgPerL < r.low || docMgPerL > r.high ? [`${where} of ${docMgPerL} mg/L is far outside the ${r.typical} of treated wastewater (common practice); check the value and unit`] : [];
}

/** Warning for a carbon dose far above common practice. */
export function doseWarnings(doseMgPerL: number, where = 'carbon dose'): string[] {
  const r = PLAUSIBLE.doseMgPerL;
  return doseMgPerL > r.high ? [`${where} of ${doseMgPerL} mg/L is far above the ${r.typical} of PAC stages (common practice); check the value and unit`] : [];
}

/** Warnings for an unidentifiable fractionation. */
export function fractionationWarnings(fractionCi: ReadonlyArray<readonly [number, number] | null | undefined>, starts: number, agreeing: number): string[] {
  const out: string[] = [];
  fractionCi.forEach((ci, j) => {
    if (ci && ci[0] <= 0.01 && ci[1] >= 0.99) out.push(`the 95 % interval of the share of F${j} spans the whole 0–100 % range: this split of the DOC is not identifiable from the data; try fewer components`);
  });
  if (agreeing < starts) out.push(`only ${agreeing} of ${starts} fitting starts reached the same optimum: the fractionation may not be unique; try fewer components or more isotherm points`);
  return out;
}

/** Warning for a calibration on fewer than twice as many points as parameters. */
export function calibrationPointsWarnings(points: number, parameters: number): string[] {
  return points < 2 * parameters ? [`${points} jar test(s) for ${parameters} parameter(s): fewer than twice as many points as parameters (common practice), so the calibration and its intervals rest on very few data; add jar tests`] : [];
}
