/**
 * PAC against GAC on the same footing (capability 22): per carbon the carbon mass per year, the
 * carbon cost per m³ treated and per year, from what the run computed — PAC at its required dose
 * (yearly from the DOC series or the design DOC), GAC from the equilibrium estimate of its
 * governing compound (carbon usage rate at the equilibrium bed life, a reference only) or, with
 * fixed-bed inputs, from the kinetic run length of the staggered filters (gacKineticStep).
 *   GAC cost per m³ = usage (g/m³) / 1000 × price per kg.
 * The cheapest carbon is named only among carbons priced in the same currency (one per currency).
 */
import type { CarbonResult } from '../pipeline/pipelineTypes.js';

export interface CarbonComparisonRow {
  carbonName: string;
  type: 'PAC' | 'GAC';
  currency: string;
  /** Carbon per year, t/a. */
  carbonTonnesPerYear: number | null;
  costPerM3: number | null;
  costPerYear: number | null;
  /** How the yearly figures were obtained. */
  basis: string;
}

export interface PacGacComparison {
  rows: CarbonComparisonRow[];
  /** Cheapest carbon per year in each currency (only currencies with two or more carbons). */
  cheapestByCurrency: Array<{ currency: string; carbonName: string; of: number }>;
}

export function pacGacComparison(carbons: readonly CarbonResult[]): PacGacComparison {
  const rows: CarbonComparisonRow[] = carbons.map((cr) => {
    const c = cr.carbon;
    const use = cr.gacKinetic?.use;
    if (cr.gacKinetic) {
      return {
        carbonName: c.name, type: 'GAC', currency: c.currency,
        carbonTonnesPerYear: use?.yearlyCarbonKg !== undefined ? use.yearlyCarbonKg / 1000 : null,
        costPerM3: use?.costPerM3 ?? null,
        costPerYear: use?.yearlyCost ?? null,
        basis: use ? `kinetic run length of ${cr.gacKinetic.filters} staggered filter(s), governed by ${cr.gacKinetic.run.governedBy}` : 'no GAC run meets every goal',
      };
    }
    if (cr.gac) {
      const g = cr.gac.governing;
      return {
        carbonName: c.name, type: 'GAC', currency: c.currency,
        carbonTonnesPerYear: g.carbonTonnesPerYear ?? null,
        costPerM3: (g.carbonUsageGPerM3 / 1000) * c.pricePerKg, // g/m³ → kg/m³ × price per kg
        costPerYear: g.carbonTonnesPerYear !== undefined ? cr.gac.yearlyCost : null,
        basis: `equilibrium carbon usage of ${g.id} (a reference, not a bound)`,
      };
    }
    return {
      carbonName: c.name, type: c.type, currency: c.currency,
      carbonTonnesPerYear: cr.yearly ? cr.yearly.carbonKg / 1000 : null,
      costPerM3: cr.costPerM3 ?? null,
      costPerYear: cr.yearly?.cost ?? null,
      basis: cr.yearly ? (cr.yearly.basis === 'DOC series' ? 'required dose over the DOC series' : 'required dose at the design DOC and flow') : 'no reachable goal',
    };
  });
  const currencies = [...new Set(rows.map((r) => r.currency))];
  const cheapestByCurrency = currencies.flatMap((cur) => {
    const priced = rows.filter((r) => r.currency === cur && r.costPerYear !== null);
    if (priced.length < 2) return [];
    const best = priced.reduce((a, b) => (b.costPerYear! < a.costPerYear! ? b : a));
    return [{ currency: cur, carbonName: best.carbonName, of: priced.length }];
  });
  return { rows, cheapestByCurrency };
}

/** Where the GAC rows' figures come from, in words (the comparison's caption and paragraph). */
export function gacBasisNote(carbons: readonly CarbonResult[]): string {
  const gac = carbons.filter((c) => c.gac);
  const kinetic = gac.filter((c) => c.gacKinetic).length;
  if (kinetic === gac.length) return 'GAC from the kinetic run length of its staggered filters (fixed-bed model with DOC preloading; confirm with pilot columns)';
  const eq = 'GAC without fixed-bed inputs from the equilibrium bed life, a reference and not a bound: single beds usually need more carbon';
  return kinetic === 0 ? eq : `GAC with fixed-bed inputs from the kinetic run length of its staggered filters; ${eq}`;
}
