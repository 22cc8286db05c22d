/**
 * Report section of capability 22, the consultant's first questions: carbon per mg DOC, how the
 * dose moves with DOC (IAST scaling against a constant specific dose), which input the dose and
 * the yearly cost are most sensitive to, and PAC against GAC side by side. Presentation only:
 * every number comes from the pipeline (doseAgainstDocStep, sensitivityStep, pacGacComparison).
 */
import type { BarPlotSpec, PlotSpec, ReportSection, ReportTable, TornadoPlotSpec } from './reportModel.js';
import { fmtFixed, fmtMoney, fmtNumber as fn } from './formatting.js';
import { gacBasisNote, pacGacComparison } from './pacGacComparison.js';
import type { PipelineResult } from '../pipeline/pipelineTypes.js';
import type { Sensitivity } from '../pipeline/sensitivityStep.js';

/** Line colours of the dose-against-DOC figure: our own dark teal for IAST, grey for the rule. */
const IAST_LINE = '#1f5f6b';

function tornado(s: Sensitivity, index: number, what: 'dose' | 'cost'): TornadoPlotSpec {
  const pick = (r: Sensitivity['rows'][number]) => (what === 'dose' ? [r.doseLowMgPerL, r.doseHighMgPerL] : [r.yearlyCostLow, r.yearlyCostHigh]);
  const base = what === 'dose' ? s.baseDoseMgPerL : s.baseYearlyCost;
  const rows = s.rows
    .map((r) => { const [lo, hi] = pick(r); return { label: r.input, low: lo ?? NaN, high: hi ?? NaN }; })
    .filter((r) => what === 'cost' || r.label !== 'carbon price')
    .sort((a, b) => Math.abs(b.high - b.low) - Math.abs(a.high - a.low));
  const pct = `${fn(s.step * 100, 2)} %`;
  return {
    kind: 'tornado', id: `sensitivity-${what}-${index + 1}`,
    title: `${what === 'dose' ? 'Required dose' : 'Yearly carbon cost'} with each input lowered and raised by ${pct} — ${s.carbonName}`,
    xLabel: what === 'dose' ? 'required dose (mg/L)' : `yearly carbon cost (${s.currency} per year)`,
    base, baseLabel: what === 'dose' ? `point estimate ${fn(base, 3)} mg/L` : `point estimate ${fmtMoney(base, s.currency)}`,
    rows, lowName: `input −${pct}`, highName: `input +${pct}`,
  };
}

/** Bars of one quantity per carbon (one category per carbon). */
function bars(id: string, title: string, yLabel: string, names: string[], values: number[]): BarPlotSpec {
  return { kind: 'bars', compact: true, id, title, yLabel, categories: names, stacks: [{ name: yLabel, values, colour: IAST_LINE }] };
}

export function decisionSection(r: PipelineResult): ReportSection | undefined {
  const pac = r.carbons.filter((c) => c.doseAgainstDoc || c.sensitivity);
  if (pac.length === 0 && !r.carbons.some((c) => c.gac)) return undefined;
  const paragraphs: string[] = [
    'Specific dose: mg of carbon per mg of DOC (dose divided by DOC), given beside every dose. Doses per mg DOC vary far less between effluents than plain doses (Altmann et al. 2014; Zietzschmann et al. 2016).',
  ];
  const tables: ReportTable[] = [];
  const plots: PlotSpec[] = [];
  pac.forEach((cr, k) => {
    const d = cr.doseAgainstDoc;
    if (d) {
      // under PAC contact conditions the doses are those of the contact model, not of equilibrium IAST
      const how = cr.contact ? 'contact model at the plant\'s contact conditions, background scaled with DOC' : 'IAST, background scaled with DOC';
      paragraphs.push(`${cr.carbon.name}: ${fn(d.specificDoseAtDesign, 3)} mg carbon per mg DOC at the design DOC of ${fn(d.designDocMgPerL, 3)} mg/L. Over ${d.rangeSource === 'DOC series' ? 'the DOC range of the series' : 'the design DOC ±50 %'} the required dose is solved anew (${how}) and set beside a constant specific dose (the design value times DOC).`);
      plots.push({
        kind: 'xy', id: `dose-against-doc-${k + 1}`, title: `Required dose against DOC: ${cr.contact ? 'the contact model' : 'IAST scaling'} and a constant specific dose — ${cr.carbon.name}`,
        xLabel: 'DOC (mg/L)', yLabel: 'dose (mg/L)',
        series: [
          { name: `required dose (${how})`, colour: IAST_LINE, points: d.docMgPerL.flatMap((x, i) => (d.requiredDoseMgPerL[i] === null ? [] : [[x, d.requiredDoseMgPerL[i]!] as [number, number]])) },
          { name: `constant specific dose ${fn(d.specificDoseAtDesign, 3)} mg/mg DOC`, key: 'reference', style: 'dashed', points: d.docMgPerL.map((x, i) => [x, d.constantRuleDoseMgPerL[i]!] as [number, number]) },
        ],
        vLines: [{ x: d.designDocMgPerL, label: `design DOC ${fn(d.designDocMgPerL, 3)} mg/L` }],
      });
      const idx = [0, Math.floor((d.docMgPerL.length - 1) / 2), d.docMgPerL.length - 1];
      tables.push({
        caption: `${cr.carbon.name}: required dose against the constant-specific-dose rule`,
        columns: ['DOC (mg/L)', 'required dose (mg/L)', 'mg carbon per mg DOC', 'rule dose (mg/L)', 'difference (mg/L)', 'difference (%)'],
        rows: idx.map((i) => {
          const req = d.requiredDoseMgPerL[i] ?? null;
          const rule = d.constantRuleDoseMgPerL[i]!;
          return [fn(d.docMgPerL[i]!, 3), req === null ? 'unreachable' : fn(req, 3), req === null ? '—' : fn(req / d.docMgPerL[i]!, 3), fn(rule, 3), req === null ? '—' : fmtFixed(req - rule, 1), req === null ? '—' : fmtFixed((100 * (req - rule)) / rule, 0)];
        }),
      });
    }
    const s = cr.sensitivity;
    if (s) {
      plots.push(tornado(s, k, 'dose'), tornado(s, k, 'cost'));
      tables.push({
        caption: `${cr.carbon.name}: required dose and yearly carbon cost with each input −${fn(s.step * 100, 2)} % and +${fn(s.step * 100, 2)} % (point estimate ${fn(s.baseDoseMgPerL, 3)} mg/L, ${fmtMoney(s.baseYearlyCost, s.currency)} per year)`,
        columns: ['input', 'dose, input lowered (mg/L)', 'dose, input raised (mg/L)', `cost per year, lowered (${s.currency})`, `cost per year, raised (${s.currency})`],
        rows: s.rows.map((x) => [x.input, x.doseLowMgPerL === null ? 'unreachable' : fn(x.doseLowMgPerL, 3), x.doseHighMgPerL === null ? 'unreachable' : fn(x.doseHighMgPerL, 3), x.yearlyCostLow === null ? '—' : fmtMoney(x.yearlyCostLow, ''), x.yearlyCostHigh === null ? '—' : fmtMoney(x.yearlyCostHigh, '')]),
      });
      if (k === 0) paragraphs.push(`Sensitivity: one input at a time, the rest at their design values; K and 1/n of the governing compound (${s.governingCompound}), DOC (the design value and every day of the series), the adsorbable part of the background (DOC kept; the non-adsorbable part takes the difference) and the carbon price${s.rows.some((x) => x.key === 'contact_time') ? `; under the plant's PAC contact conditions also the contact time${s.rows.some((x) => x.key === 'carbon_age') ? ' and the carbon age (never below the contact time)' : ''}` : ''}.${s.notModelled.length ? ` Not modelled in this ${s.rows.some((x) => x.key === 'contact_time') ? 'run' : 'equilibrium run'}: ${s.notModelled.join(' and ')}.` : ''}`);
      const docRow = s.rows.find((x) => x.key === 'doc');
      const bgRow = s.rows.find((x) => x.key === 'background');
      const same = (x: number | null | undefined, y: number | null | undefined) => x != null && y != null && Math.abs(x - y) <= 1e-3 * Math.abs(y);
      if (docRow && bgRow && same(docRow.doseLowMgPerL, bgRow.doseLowMgPerL) && same(docRow.doseHighMgPerL, bgRow.doseHighMgPerL)) {
        paragraphs.push(`${cr.carbon.name}: DOC and the adsorbable background move the dose alike, because the non-adsorbable part of the DOC does not compete for the carbon; only the adsorbable part matters.`);
      }
    }
  });
  const cmp = pacGacComparison(r.carbons);
  if (cmp.rows.some((x) => x.type === 'GAC') && cmp.rows.some((x) => x.type === 'PAC')) {
    const names = cmp.rows.map((x) => x.carbonName);
    plots.push(bars('pac-gac-mass', 'Carbon per year', 'carbon (t/a)', names, cmp.rows.map((x) => x.carbonTonnesPerYear ?? NaN)));
    for (const cur of [...new Set(cmp.rows.map((x) => x.currency))]) {
      const rows = cmp.rows.filter((x) => x.currency === cur);
      const suffix = cmp.rows.length === rows.length ? '' : `-${cur.toLowerCase()}`;
      plots.push(bars(`pac-gac-cost-m3${suffix}`, `Carbon cost per m³ treated (${cur})`, `${cur} per m³`, rows.map((x) => x.carbonName), rows.map((x) => x.costPerM3 ?? NaN)));
      plots.push(bars(`pac-gac-cost-year${suffix}`, `Carbon cost per year (${cur})`, `${cur} per year`, rows.map((x) => x.carbonName), rows.map((x) => x.costPerYear ?? NaN)));
    }
    tables.push({
      caption: `PAC against GAC: carbon per year and carbon cost (carbon only; ${gacBasisNote(r.carbons)})`,
      columns: ['carbon', 'type', 'carbon (t/a)', 'cost per m³', 'cost per year', 'basis'],
      rows: cmp.rows.map((x) => [x.carbonName, x.type, x.carbonTonnesPerYear === null ? '—' : fn(x.carbonTonnesPerYear, 3), x.costPerM3 === null ? '—' : fmtMoney(x.costPerM3, x.currency), x.costPerYear === null ? '—' : fmtMoney(x.costPerYear, x.currency), x.basis]),
    });
    paragraphs.push(cmp.cheapestByCurrency.length
      ? `Lowest carbon cost per year: ${cmp.cheapestByCurrency.map((c) => `${c.carbonName} among the ${c.of} carbons priced in ${c.currency}`).join('; ')}. Carbons priced in different currencies are not ranked against each other. GAC: ${gacBasisNote(r.carbons)}.`
      : `No two carbons share a currency; they are not ranked. GAC: ${gacBasisNote(r.carbons)}.`);
  }
  return { id: 'decisions', heading: 'Decision figures: specific dose, DOC, sensitivity, PAC against GAC', paragraphs, tables, plots };
}
