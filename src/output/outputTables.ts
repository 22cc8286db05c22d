/**
 * The CSV tables of a run (compounds.csv, removal_curves.csv, carbons.csv, daily_doses.csv,
 * indicators.csv): plain text built from the pipeline result, units in the headers.
 */
import type { PipelineResult } from '../pipeline/pipelineTypes.js';
import { neutraliseCsvCell } from '../tables/safeCsvCell.js';

type Cell = string | number | null | undefined;

/**
 * A number to 8 significant digits in JavaScript's shortest form: String(Number(v.toPrecision(8)))
 * without the slow round trip where toPrecision wrote fixed notation (its digits are then already
 * the shortest decimal of that double once trailing zeros go: at most 8 significant digits).
 */
export function significant8(v: number): string {
  const p = v.toPrecision(8);
  if (p.includes('e')) return String(Number(p));
  if (!p.includes('.')) return p;
  let end = p.length;
  while (p.charCodeAt(end - 1) === 48 /* 0 */) end--;
  if (p.charCodeAt(end - 1) === 46 /* . */) end--;
  const s = p.slice(0, end);
  return s === '-0' ? '0' : s;
}

/** Numbers to 8 significant digits (ample for planning figures, free of binary noise); text neutralised against formulas. */
function cell(v: Cell): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? significant8(v) : '';
  const t = neutraliseCsvCell(v);
  return /[",\n\r]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t;
}

/** RFC 4180 CSV text (Shafranovich 2005): comma-separated, quoted where needed, CRLF-free. */
export function toCsv(headers: readonly string[], rows: readonly Cell[][]): string {
  return [headers.map(cell).join(','), ...rows.map((r) => r.map(cell).join(','))].join('\n') + '\n';
}

export function compoundsCsv(r: PipelineResult): string {
  const rows: Cell[][] = [];
  for (const cr of r.carbons) {
    if (!cr.required) continue;
    cr.required.compounds.forEach((d, i) => {
      const comp = r.project.compounds[i]!;
      const goal = r.goals[comp.id]!;
      const rl = cr.reducedLoadings?.[i];
      const sys = cr.systems[i]!;
      rows.push([
        cr.carbon.name, comp.id, comp.name, comp.indicatorCategory ?? '', comp.c0MgPerL * 1e6, goal.text, Math.max(0, goal.removalFraction * 100),
        d.doseMgPerL, d.status, cr.required!.governing?.compoundId === comp.id ? 'yes' : 'no',
        cr.designDoseMgPerL, rl ? rl.cMgPerL * 1e6 : null, rl ? rl.removalFraction * 100 : null, rl?.qSiteMgPerG, rl?.qSingleMgPerG, rl?.ratio,
        sys.single.K, sys.single.oneOverN, sys.inMixture.K, sys.competition, sys.calibration ?? 'none',
      ]);
    });
  }
  return toCsv([
    'carbon', 'compound', 'name', 'indicator category', 'c0 (ng/L)', 'goal', 'goal removal (%)',
    'dose for goal (mg/L)', 'status', 'governing', 'design dose (mg/L)', 'c at design dose (ng/L)', 'removal at design dose (%)',
    'q in site water (mg/g)', 'q single-solute at same c (mg/g)', 'reduced loading ratio',
    'K single-solute ((mg/g)/(mg/L)^(1/n))', '1/n', 'K in IAST ((mg/g)/(mg/L)^(1/n))', 'competition model', 'site calibration',
  ], rows);
}

export function removalCurvesCsv(r: PipelineResult): string {
  const ids = r.project.compounds.map((c) => c.id);
  const rows: Cell[][] = [];
  for (const cr of r.carbons) {
    const cv = cr.curves;
    if (!cv) continue;
    cv.dosesMgPerL.forEach((d, k) => rows.push([cr.carbon.name, d, ...ids.map((id) => cv.removalPercent[id]![k])]));
  }
  return toCsv(['carbon', 'dose (mg/L)', ...ids.map((id) => `${id} removal (%)`)], rows);
}

export function carbonsCsv(r: PipelineResult): string {
  const rows: Cell[][] = r.carbons.map((cr) => {
    const req = cr.required;
    const ind = cr.indicator;
    return [
      cr.carbon.name, cr.carbon.type, cr.carbon.pricePerKg, cr.carbon.currency, cr.carbon.kFactor, cr.background?.description,
      req?.doseMgPerL, req?.governedBy ?? cr.gacKinetic?.run.governedBy, req?.governing?.compoundId, req?.governing?.doseMgPerL, req?.indicator?.doseMgPerL,
      cr.costPerM3, cr.carbonKgPerDAtDesign, cr.yearly?.carbonKg, cr.yearly?.cost, cr.yearly?.basis,
      cr.daily?.dose?.median, cr.daily?.dose?.p90, cr.daily?.carbonKgPerD?.median, cr.daily?.carbonKgPerD?.p90,
      cr.designDoseMgPerL, ind?.set.meanRemovalPercent, ind ? (ind.set.admissible ? 'yes' : 'no') : null, ind?.range?.best.meanRemovalPercent, ind?.range?.worst.meanRemovalPercent,
    ];
  });
  return toCsv([
    'carbon', 'type', 'price per kg', 'currency', 'K factor', 'background',
    'required dose (mg/L)', 'governed by', 'governing compound', 'governing compound dose (mg/L)', 'indicator mean dose (mg/L)',
    'carbon cost per m3 treated', 'carbon at design flow (kg/d)', 'yearly carbon (kg)', 'yearly carbon cost', 'yearly basis',
    'daily dose median (mg/L)', 'daily dose P90 (mg/L)', 'daily carbon median (kg/d)', 'daily carbon P90 (kg/d)',
    'design dose (mg/L)', 'indicator mean at design dose (%)', 'indicator set admissible', 'best admissible mean (%)', 'worst admissible mean (%)',
  ], rows);
}

/**
 * daily_doses.csv: one line per day and carbon (a long series has 73,000 of them), written as
 * bytes (AsciiText) rather than as one string per line: the same text, without keeping tens of
 * thousands of small strings alive until the join (most of the cost was garbage collection).
 */
export function dailyDosesCsv(r: PipelineResult): string {
  const header = ['date', 'carbon', 'DOC (mg/L)', 'flow (m3/d)', 'dose (mg/L)', 'governed by', 'carbon (kg/d)', 'carbon cost per day', 'currency'].map(cell).join(',');
  let days = 0;
  for (const cr of r.carbons) days += cr.daily?.rows.length ?? 0;
  const out = new AsciiText(header.length + 1 + days * 120);
  if (!out.add(header)) return dailyDosesLines(r, header);
  out.byte(10);
  const texts = new Map<string, string>(); // the few texts of every day (governing goal) made once
  const text = (t: string): string => { let c = texts.get(t); if (c === undefined) { c = cell(t); texts.set(t, c); } return c; };
  for (const cr of r.carbons) {
    const name = `,${cell(cr.carbon.name)},`;
    const currency = `,${cell(cr.carbon.currency)}`;
    for (const d of cr.daily?.rows ?? []) {
      // a text that is not ASCII: the same lines as strings
      if (!out.add(cell(d.date)) || !out.add(name) || !out.add(cell(d.docMgPerL))) return dailyDosesLines(r, header);
      out.byte(44); out.add(cell(d.flowM3PerD));
      out.byte(44); out.add(cell(d.doseMgPerL));
      out.byte(44); if (!out.add(text(d.governedBy))) return dailyDosesLines(r, header);
      out.byte(44); out.add(cell(d.carbonKgPerD));
      out.byte(44); out.add(cell(d.cost));
      if (!out.add(currency)) return dailyDosesLines(r, header);
      out.byte(10);
    }
  }
  return out.text();
}

/** daily_doses.csv as lines of strings (any text). */
function dailyDosesLines(r: PipelineResult, header: string): string {
  const lines = [header];
  for (const cr of r.carbons) {
    const name = cell(cr.carbon.name);
    const currency = cell(cr.carbon.currency);
    for (const d of cr.daily?.rows ?? []) lines.push(`${cell(d.date)},${name},${cell(d.docMgPerL)},${cell(d.flowM3PerD)},${cell(d.doseMgPerL)},${cell(d.governedBy)},${cell(d.carbonKgPerD)},${cell(d.cost)},${currency}`);
  }
  return lines.join('\n') + '\n';
}

/** ASCII text gathered as bytes in one growing buffer, decoded once. */
class AsciiText {
  private buf: Uint8Array;
  private n = 0;
  constructor(capacity: number) { this.buf = new Uint8Array(Math.max(64, capacity)); }
  private room(k: number): void {
    if (this.n + k <= this.buf.length) return;
    const b = new Uint8Array(Math.max(this.buf.length * 2, this.n + k));
    b.set(this.buf.subarray(0, this.n));
    this.buf = b;
  }
  /** Append a text; false (nothing appended) when it is not ASCII. */
  add(s: string): boolean {
    const len = s.length;
    this.room(len);
    const buf = this.buf, start = this.n;
    for (let i = 0; i < len; i++) {
      const c = s.charCodeAt(i);
      if (c > 127) return false;
      buf[start + i] = c;
    }
    this.n = start + len;
    return true;
  }
  byte(c: number): void { this.room(1); this.buf[this.n++] = c; }
  text(): string { return new TextDecoder().decode(this.buf.subarray(0, this.n)); }
}

export function indicatorsCsv(r: PipelineResult): string {
  const rows: Cell[][] = [];
  for (const cr of r.carbons) {
    const ind = cr.indicator;
    if (!ind) continue;
    for (const v of ind.values) {
      rows.push([cr.carbon.name, ind.doseMgPerL, v.id, v.category, v.removalPercent,
        ind.set.ids.includes(v.id) ? 'yes' : 'no', ind.range ? (ind.range.best.ids.includes(v.id) ? 'yes' : 'no') : '', ind.range ? (ind.range.worst.ids.includes(v.id) ? 'yes' : 'no') : '']);
    }
  }
  return toCsv(['carbon', 'dose (mg/L)', 'compound', 'category', 'removal (%)', 'in evaluated set', 'in best admissible subset', 'in worst admissible subset'], rows);
}
