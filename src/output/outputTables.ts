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
 * Between 1e-6 and 1e8 (toPrecision's fixed notation) the 8 digits come from one product
 * |v|·10^(7−e), exact to half an ulp, below 2^27 (7.5e-9 of a unit of the 8th digit): rounded
 * half up as toPrecision rounds the exact value, unless the product lies within 1e-6 of a half,
 * where toPrecision decides. The same text as toPrecision's path (tested on millions of values).
 */
export function significant8(v: number): string {
  return digits8(v) ? fixed8(digitsM, digitsE, v < 0) : significant8Slow(v);
}

/** The digits of the last successful digits8: the integer m (no trailing zeros) and the decimal exponent e of its first digit. */
let digitsM = 0;
let digitsE = 0;
/** How many digits digitsM has. */
let digitsN = 0;

/**
 * The 8 significant digits of v by the product above, into digitsM/digitsE/digitsN (trailing
 * zeros dropped); false where toPrecision must decide (outside 1e-6 … 1e8, or near a half).
 */
function digits8(v: number): boolean {
  const a = v < 0 ? -v : v;
  if (!(a >= 1e-6 && a < 1e8)) return false;
  let e = Math.floor(Math.log10(a));
  let scaled = a * POWERS_OF_TEN[7 - e]!;
  if (scaled < 1e7) { e--; scaled = a * POWERS_OF_TEN[7 - e]!; } // log10 just below a power of ten
  else if (scaled >= 1e8) { e++; scaled = a * POWERS_OF_TEN[7 - e]!; }
  const whole = Math.floor(scaled);
  const frac = scaled - whole;
  if (!(frac < 0.5 - 1e-6 || frac > 0.5 + 1e-6)) return false;
  let m = frac > 0.5 ? whole + 1 : whole;
  if (m === 1e8) { m = 1e7; e++; }
  if (e > 7) return false;
  let n = 8;
  while (m % 10 === 0) { m /= 10; n--; }
  digitsM = m; digitsE = e; digitsN = n;
  return true;
}

/** 10^k for k = 0 … 14, exact doubles. */
const POWERS_OF_TEN = Array.from({ length: 15 }, (_, k) => Number(`1e${k}`));

/** The fixed notation of m (digitsN digits, no trailing zeros) times 10^(e − digitsN + 1), −e ≤ 6. */
function fixed8(m: number, e: number, negative: boolean): string {
  const n = digitsN;
  const d = String(m);
  let s: string;
  if (e >= n - 1) s = e + 1 > n ? d + '0'.repeat(e + 1 - n) : d;
  else if (e >= 0) s = `${d.slice(0, e + 1)}.${d.slice(e + 1)}`;
  else s = `0.${'0'.repeat(-e - 1)}${d}`;
  return negative ? `-${s}` : s;
}

/** significant8 through toPrecision (any finite number; also the reference of the fast path's test). */
export function significant8Slow(v: number): string {
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
      if (!out.add(isDayDate(d.date) ? d.date : cell(d.date)) || !out.add(name)) return dailyDosesLines(r, header);
      out.cell(d.docMgPerL);
      out.byte(44); out.cell(d.flowM3PerD);
      out.byte(44); out.cell(d.doseMgPerL);
      out.byte(44); if (!out.add(text(d.governedBy))) return dailyDosesLines(r, header);
      out.byte(44); out.cell(d.carbonKgPerD);
      out.byte(44); out.cell(d.cost);
      if (!out.add(currency)) return dailyDosesLines(r, header);
      out.byte(10);
    }
  }
  return out.text();
}

/** A day's date as YYYY-MM-DD (digits and hyphens only): its cell is the text itself (nothing to neutralise or quote). */
function isDayDate(t: string): boolean {
  if (t.length !== 10) return false;
  for (let i = 0; i < 10; i++) {
    const c = t.charCodeAt(i);
    if (i === 4 || i === 7 ? c !== 45 : c < 48 || c > 57) return false;
  }
  return true;
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

/** ASCII text gathered as bytes in one growing buffer, decoded once (exported for its test). */
export class AsciiText {
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
  /** A cell as `cell` writes it: numbers straight into the buffer; false (nothing appended) for a text that is not ASCII. */
  cell(v: Cell): boolean {
    if (typeof v !== 'number') return this.add(cell(v));
    if (Number.isFinite(v)) this.number8(v);
    return true;
  }
  /** A finite number as significant8 writes it, its digits straight into the buffer. */
  number8(v: number): void {
    if (!digits8(v)) { this.add(significant8Slow(v)); return; }
    const n = digitsN, e = digitsE;
    this.room(n + 10);
    const buf = this.buf;
    let p = this.n;
    if (v < 0) buf[p++] = 45; // -
    if (e < 0) { buf[p++] = 48; buf[p++] = 46; for (let k = -e - 1; k > 0; k--) buf[p++] = 48; } // 0.00…
    // the digits, the point after the digit of exponent 0 when digits follow it, zeros up to it otherwise
    const point = e >= 0 && e < n - 1 ? e + 1 : -1;
    const len = n + (point > 0 ? 1 : 0);
    let m = digitsM;
    for (let k = n - 1; k >= 0; k--) {
      const at = p + k + (point > 0 && k >= point ? 1 : 0);
      buf[at] = 48 + (m % 10);
      m = (m - (m % 10)) / 10;
    }
    if (point > 0) buf[p + point] = 46;
    p += len;
    for (let k = e + 1 - n; k > 0; k--) buf[p++] = 48;
    this.n = p;
  }
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
