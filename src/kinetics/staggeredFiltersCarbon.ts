/**
 * Carbon use and cost of a GAC stage from its run length (mass balances, closed form):
 *
 *   carbon usage rate CUR = ρ_bed/BV_run        g carbon per L treated; ×1000 → g/m³
 *   yearly carbon     = CUR·Q·365 d             (kg/a with CUR in g/m³, Q in m³/d, /1000)
 *   yearly cost       = yearly carbon·price     (price per kg of fresh or reactivated carbon)
 *   cost per m³       = CUR/1000·price
 *   filter life       = BV_run·EBCT             (days with EBCT in days)
 *
 * The same for one filter and for N staggered filters: each holds ρ_bed·EBCT·Q/N of carbon and is
 * replaced every BV_run·EBCT, so N of them use ρ_bed·Q/BV_run per unit time. CUR in g/m³ is
 * numerically the same as an equivalent continuous PAC dose in mg/L, so GAC and PAC compare on
 * one footing.
 *
 * Units: ρ_bed kg/m³ (= g/L), Q m³/d, EBCT min, price per kg.
 * @throws InputError when an input is not a positive finite number
 */
import { InputError } from '../core/errors.js';

export interface CarbonUseInput {
  runBedVolumes: number;
  bedDensityKgPerM3: number;
  /** Plant flow through the stage, m³/d (optional: yearly figures need it). */
  flowM3PerD?: number;
  /** Empty-bed contact time of one filter, min (optional: the filter life needs it). */
  ebctMin?: number;
  /** Price per kg of the carbon that replaces spent carbon (fresh or reactivated). */
  pricePerKg?: number;
}

export interface CarbonUse {
  carbonUsageGPerM3: number;
  filterLifeDays?: number;
  yearlyCarbonKg?: number;
  yearlyCost?: number;
  costPerM3?: number;
}

function positive(v: number | undefined, path: string): void {
  if (v === undefined) return;
  if (!(v > 0) || !Number.isFinite(v)) throw new InputError(`expected a positive number, got ${v}`, { path });
}

/** Carbon usage, yearly mass and cost of a GAC stage (see the file comment). */
export function gacCarbonUse(input: CarbonUseInput): CarbonUse {
  positive(input.runBedVolumes, 'runBedVolumes');
  positive(input.bedDensityKgPerM3, 'bedDensityKgPerM3');
  positive(input.flowM3PerD, 'flowM3PerD');
  positive(input.ebctMin, 'ebctMin');
  if (input.pricePerKg !== undefined && !(input.pricePerKg >= 0 && Number.isFinite(input.pricePerKg))) throw new InputError(`expected a price ≥ 0, got ${input.pricePerKg}`, { path: 'pricePerKg' });
  const cur = (input.bedDensityKgPerM3 / input.runBedVolumes) * 1000; // ρ_bed/BV g/L → g/m³
  const out: CarbonUse = { carbonUsageGPerM3: cur };
  if (input.ebctMin !== undefined) out.filterLifeDays = (input.runBedVolumes * input.ebctMin) / 1440;
  if (input.pricePerKg !== undefined) out.costPerM3 = (cur / 1000) * input.pricePerKg;
  if (input.flowM3PerD !== undefined) {
    out.yearlyCarbonKg = (cur * input.flowM3PerD * 365) / 1000;
    if (input.pricePerKg !== undefined) out.yearlyCost = out.yearlyCarbonKg * input.pricePerKg;
  }
  return out;
}
