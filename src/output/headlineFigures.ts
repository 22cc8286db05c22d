/**
 * The headline figures of the report (its key-figure cards), filled from a pipeline result:
 * per PAC carbon the required dose with its specific dose (mg carbon per mg DOC), the cost per
 * m³, the carbon per year (said to be annualised when the DOC series is not a whole year), the
 * goals that are not met, the cheapest carbon within one currency, the UV254 set-point, the
 * indicator mean, the GAC bed-life bound and the pilot check. Presentation only.
 */
import type { KeyFigure } from './reportModel.js';
import { fmtMoney, fmtNumber as fn, fmtWhole } from './formatting.js';
import { pacGacComparison } from './pacGacComparison.js';
import { gacHeadline } from './gacHeadline.js';
import type { CarbonResult, PipelineResult } from '../pipeline/pipelineTypes.js';
import { specificDose } from '../design/specificDose.js';

const pct = (x: number | null | undefined, sig = 4) => (x === null || x === undefined ? '—' : `${fn(x, sig)} %`);
const mgL = (x: number | null | undefined, sig = 3) => (x === null || x === undefined ? '—' : `${fn(x, sig)} mg/L`);

/** "23.6 mg/L (2.95 mg carbon per mg DOC)". */
export function doseWithSpecific(doseMgPerL: number | null | undefined, docMgPerL: number): string {
  if (doseMgPerL === null || doseMgPerL === undefined) return '—';
  return `${mgL(doseMgPerL)} (${fn(specificDose(doseMgPerL, docMgPerL), 3)} mg/mg DOC)`;
}

/** How the yearly figures were obtained, in words: a whole-year series, an annualised part-year series, or the design values. */
export function yearlyBasisText(cr: CarbonResult): string {
  if (!cr.yearly) return '';
  if (cr.gacKinetic) return 'GAC run length at the design DOC and flow × 365 days';
  if (cr.yearly.basis !== 'DOC series' || !cr.daily) return 'design DOC and flow × 365 days';
  const n = cr.daily.rows.length;
  return n === 365 || n === 366 ? `DOC series, ${n} days` : `annualised: ${n}-day DOC series scaled to 365 days`;
}

/** Goals not met on one carbon, in words (empty when every goal is met). */
export function unmetGoals(r: PipelineResult, cr: CarbonResult): string[] {
  const out: string[] = [];
  const req = cr.required;
  if (!req) return out;
  for (const c of req.compounds) if (c.status === 'unreachable') out.push(`${c.compoundId}: ${r.goals[c.compoundId]?.text ?? 'goal'} not reachable`);
  if (req.indicator && req.indicator.status !== 'met') out.push(`indicator mean: ${req.indicator.message}`);
  if (cr.indicator && !cr.indicator.met) out.push(`indicator mean ${pct(cr.indicator.set.meanRemovalPercent, 3)} at the design dose, goal ${cr.indicator.goalPercent} %${cr.indicator.set.admissible ? '' : ' (set not admissible)'}`);
  return out;
}

export function headlineFigures(r: PipelineResult): KeyFigure[] {
  const figs: KeyFigure[] = [];
  const pac = r.carbons.filter((c) => c.required);
  const doc = r.project.site.docMgPerL;
  for (const cr of pac) {
    const req = cr.required!;
    const unmet = unmetGoals(r, cr);
    const reportOnly = req.compounds.filter((c) => c.status === 'report only').map((c) => c.compoundId);
    const reportOnlyNote = reportOnly.length ? `reported only, without a goal: ${reportOnly.join(', ')}` : '';
    if (req.doseMgPerL === null) { figs.push({ label: `${cr.carbon.name}: required dose`, value: unmet.length ? 'no reachable goal' : 'no goal to design for', note: [...unmet, ...(reportOnlyNote ? [reportOnlyNote] : [])].join('; ') }); continue; }
    const others = [
      req.governedBy !== 'indicator mean' || !req.governing ? '' : `; governing compound ${req.governing.compoundId} at ${mgL(req.governing.doseMgPerL)}`,
      req.governedBy === 'indicator mean' || req.indicator?.doseMgPerL == null ? '' : `; indicator mean reached at ${doseWithSpecific(req.indicator.doseMgPerL, doc)}`,
    ].join('');
    const gd = cr.uncertainty?.result.quantities.find((q) => q.key === 'governing_dose');
    const band = gd && Number.isFinite(gd.p90) ? `; P10–P90 ${fn(gd.p10, 3)}–${fn(gd.p90, 3)} mg/L (Monte Carlo)` : '';
    figs.push({ label: `${cr.carbon.name}: dose`, value: mgL(req.doseMgPerL), note: `${fn(specificDose(req.doseMgPerL, doc), 3)} mg carbon per mg DOC; required at DOC ${fn(req.docMgPerL, 3)} mg/L${cr.contact ? ` under the plant's PAC contact conditions (${cr.contact.equilibriumDoseMgPerL === null ? 'no goal reachable at equilibrium' : `${mgL(cr.contact.equilibriumDoseMgPerL)} at equilibrium`})` : ''}, governed by ${req.governedBy}${others}${band}` });
    figs.push({ label: `${cr.carbon.name}: goals`, value: unmet.length ? `${unmet.length} goal${unmet.length === 1 ? '' : 's'} not met` : 'all goals met', note: [unmet.length ? unmet.join('; ') : 'every compound goal at the required dose', ...(reportOnlyNote ? [reportOnlyNote] : [])].join('; ') });
    if (cr.costPerM3 !== undefined) figs.push({ label: `${cr.carbon.name}: cost per m³`, value: fmtMoney(cr.costPerM3, cr.carbon.currency), note: 'carbon only, at the required dose' });
    if (cr.yearly) {
      const yc = cr.uncertainty?.result.quantities.find((q) => q.key === 'yearly_cost');
      const ycBand = yc && Number.isFinite(yc.p90) ? `; P10–P90 ${fmtMoney(yc.p10, cr.carbon.currency)}–${fmtMoney(yc.p90, cr.carbon.currency)}` : '';
      figs.push({ label: `${cr.carbon.name}: carbon per year`, value: `${fmtWhole(cr.yearly.carbonKg / 1000)} t`, note: `${fmtMoney(cr.yearly.cost, cr.carbon.currency)} per year (${yearlyBasisText(cr)})${ycBand}` });
    }
  }
  const cheapest = pacGacComparison(r.carbons.filter((c) => c.required || c.gacKinetic)).cheapestByCurrency;
  for (const c of cheapest) figs.push({ label: `Lowest yearly carbon cost (${c.currency})`, value: c.carbonName, note: `among the ${c.of} carbons priced in ${c.currency} (PAC, and GAC with a kinetic run length); carbon cost only` });
  const sp = pac.find((c) => c.surrogates?.atRequiredDose?.uv254Reduction != null);
  if (sp) figs.push({ label: 'UV254 set-point', value: pct(sp.surrogates!.atRequiredDose!.uv254Reduction! * 100, 3), note: `UV254 reduction to dose to with ${sp.carbon.name} (required dose ${mgL(sp.surrogates!.atRequiredDose!.doseMgPerL)}, governed by ${sp.surrogates!.atRequiredDose!.governedBy})` });
  const first = pac[0];
  if (first?.indicator) figs.push({ label: 'Indicator mean', value: pct(first.indicator.set.meanRemovalPercent, 3), note: `${first.carbon.name} at ${doseWithSpecific(first.indicator.doseMgPerL, r.project.site.docMgPerL)}; goal ${first.indicator.goalPercent} % ${first.indicator.met ? 'met' : 'NOT met'}; ${first.indicator.set.admissible ? 'admissible set' : `not admissible: ${first.indicator.set.reason}`}` });
  for (const cr of r.carbons) { const h = gacHeadline(cr); if (h) figs.push(h); }
  if (r.pilot) figs.push({ label: 'Pilot check', value: r.pilot.check.outlierCompounds.length === 0 ? 'all within band' : r.pilot.check.outlierCompounds.length <= 3 ? `${r.pilot.check.outlierCompounds.join(', ')} off` : `${r.pilot.check.outlierCompounds.length} compounds off`, note: r.pilot.check.outlierCompounds.length ? `outside ±${r.pilot.bandPercent} percentage points: ${r.pilot.check.outlierCompounds.join(', ')}` : `±${r.pilot.bandPercent} percentage points` });
  return figs;
}
