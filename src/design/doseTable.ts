/**
 * The required dose against DOC over the range of a DOC series, as a small table that the run's
 * daily doses and every Monte Carlo draw interpolate alike (so the run's yearly figure and the
 * draws' come from the same arithmetic), and whose yearly sum does not grow with the number of
 * days.
 *
 * Nodes: DOC values equally spaced from the series' minimum to its maximum; at each node the
 * required dose (requiredDoseAt.ts, the same function the Monte Carlo draws use). Between nodes the dose is linear in the DOC:
 *   D(doc) = (1 − t)·D_k + t·D_{k+1},  t = (doc − doc_k)/(doc_{k+1} − doc_k).
 * Error bound (ours, checked, not assumed): after building, the exact design is solved at every
 * segment's midpoint, where the error of linear interpolation of a function whose second
 * derivative keeps its sign on the segment is largest (error ≤ h²/8·max|D''|, attained in the
 * middle for a quadratic: the interpolation error theorem, e.g. Burden & Faires, Numerical Analysis,
 * from memory); the
 * segments are halved until every midpoint is within `toleranceRel` (default 0.1 %) of the exact
 * dose, up to MAX_NODES. The largest midpoint error found is returned with the table. A series
 * with no more distinct DOC values than the starting nodes is tabulated at exactly those values
 * (no interpolation error at all).
 *
 * Yearly sums: because D is linear in the node doses, Σ_days D(doc_d)·Q_d = Σ_k (A_k·D_k + B_k·D_{k+1})
 * with A_k = Σ Q_d·(1 − t_d) and B_k = Σ Q_d·t_d over the days in segment k: the series is reduced
 * once to these segment sums (seriesSegments) and each evaluation costs O(nodes), not O(days). A
 * Monte Carlo draw that scales the whole DOC series by m uses nodes m·doc_k: every t_d, and hence
 * the segment sums, stay the same.
 */
import { ComputationError, InputError } from '../core/errors.js';
import { designDose, type Design, type DesignProblem } from './designDose.js';
import { requiredDoseAt, type RequiredAtDoc } from './requiredDoseAt.js';
import { isAnnualised } from './annualised.js';
import type { RemovalModel } from './removalModel.js';
import { carbonCost } from './carbonCost.js';

export const START_NODES = 5;
export const MAX_NODES = 65;
export const DEFAULT_TABLE_TOLERANCE = 1e-3;

export interface DoseTable {
  /** DOC nodes, ascending, mg/L. */
  docMgPerL: number[];
  /** The required dose and governing goal at each node. */
  nodes: RequiredAtDoc[];
  /** Largest relative error of the interpolated dose at the segment midpoints (0 when the nodes are the series' own values). */
  midpointErrorRel: number;
  toleranceRel: number;
}

/** Nodes from lo to hi, `count` equally spaced (one node when lo = hi). */
function spaced(lo: number, hi: number, count: number): number[] {
  if (hi === lo) return [lo];
  return Array.from({ length: count }, (_, i) => (i === 0 ? lo : i === count - 1 ? hi : lo + ((hi - lo) * i) / (count - 1)));
}

/**
 * @param model  the carbon's model at any DOC (moved to each node with atDoc)
 * @param series DOC of each day, mg/L
 * @param reference the design at the model's DOC (computed when not given)
 * @throws InputError for an empty series or a DOC ≤ 0; ComputationError if a solve fails or the
 *   tolerance is not reached with MAX_NODES nodes
 */
export function doseTable(model: RemovalModel, problem: DesignProblem, series: readonly number[], reference?: Design, toleranceRel = DEFAULT_TABLE_TOLERANCE): DoseTable {
  if (series.length === 0) throw new InputError('expected a non-empty DOC series', { path: 'site.series' });
  let lo = Infinity, hi = -Infinity;
  for (const d of series) {
    if (!(d > 0) || !Number.isFinite(d)) throw new InputError(`expected DOC values > 0 mg/L, got ${d}`, { path: 'site.series' });
    if (d < lo) lo = d;
    if (d > hi) hi = d;
  }
  const ref = reference ?? designDose(model, problem);
  const cache = new Map<number, RequiredAtDoc>();
  let previous: RequiredAtDoc | undefined;
  const at = (doc: number): RequiredAtDoc => {
    let d = cache.get(doc);
    if (!d) { d = requiredDoseAt(doc === model.docMgPerL ? model : model.atDoc(doc), problem, ref, previous); cache.set(doc, d); }
    previous = d;
    return d;
  };
  const distinct = [...new Set(series)].sort((a, b) => a - b);
  if (distinct.length <= START_NODES) {
    return { docMgPerL: distinct, nodes: distinct.map(at), midpointErrorRel: 0, toleranceRel };
  }
  for (let count = START_NODES; ; count = 2 * count - 1) {
    const nodes = spaced(lo, hi, count);
    const designs = nodes.map(at);
    let worst = 0;
    for (let k = 0; k + 1 < nodes.length; k++) {
      const a = designs[k]!.doseMgPerL, b = designs[k + 1]!.doseMgPerL;
      if (a === null || b === null) continue; // no dose there: those days have none
      const exact = at(0.5 * (nodes[k]! + nodes[k + 1]!)).doseMgPerL;
      if (exact === null) continue;
      const err = Math.abs(0.5 * (a + b) - exact) / Math.max(exact, 1e-300);
      if (err > worst) worst = err;
    }
    if (worst <= toleranceRel) return { docMgPerL: nodes, nodes: designs, midpointErrorRel: worst, toleranceRel };
    if (2 * count - 1 > MAX_NODES) throw new ComputationError(`the dose against DOC is not within ${toleranceRel * 100} % of a linear interpolation with ${count} nodes (midpoint error ${(worst * 100).toPrecision(3)} %)`);
  }
}

/** Segment index k (node k ≤ doc ≤ node k+1) and position t in [0, 1]; doc outside the nodes is clamped. */
export function segmentOf(nodes: ArrayLike<number>, doc: number): { k: number; t: number } {
  const n = nodes.length;
  if (n === 1) return { k: 0, t: 0 };
  let lo = 0, hi = n - 1;
  while (hi - lo > 1) { const mid = (lo + hi) >> 1; if (nodes[mid]! <= doc) lo = mid; else hi = mid; }
  const t = (doc - nodes[lo]!) / (nodes[lo + 1]! - nodes[lo]!);
  return { k: lo, t: Math.min(1, Math.max(0, t)) };
}

/** Interpolated dose (mg/L) at a DOC from node doses; null when either neighbour has none. */
export function interpolateDose(nodes: ArrayLike<number>, doses: ArrayLike<number | null>, doc: number): number | null {
  const { k, t } = segmentOf(nodes, doc);
  const a = doses[k]!;
  if (nodes.length === 1) return a;
  const b = doses[k + 1]!;
  if (a === null || b === null) return null;
  return t === 0 ? a : t === 1 ? b : (1 - t) * a + t * b;
}

/** The series reduced to segment sums (see the file comment). */
export interface SeriesSegments {
  /** Σ Q·(1 − t) per segment, m³/d (one entry per node; the last is unused except with one node). */
  a: Float64Array;
  /** Σ Q·t per segment, m³/d. */
  b: Float64Array;
  /** Days per segment. */
  days: Int32Array;
  /** Days in the series. */
  totalDays: number;
}

/**
 * @param nodes DOC nodes (ascending), mg/L
 * @param flowM3PerD one flow per day, or one for all
 */
export function seriesSegments(nodes: ArrayLike<number>, docMgPerL: readonly number[], flowM3PerD: readonly number[] | number): SeriesSegments {
  const n = nodes.length;
  const a = new Float64Array(n), b = new Float64Array(n);
  const days = new Int32Array(n);
  docMgPerL.forEach((doc, i) => {
    const q = typeof flowM3PerD === 'number' ? flowM3PerD : flowM3PerD[i]!;
    const { k, t } = segmentOf(nodes, doc);
    a[k] = a[k]! + q * (1 - t);
    b[k] = b[k]! + q * t;
    days[k]!++;
  });
  return { a, b, days, totalDays: docMgPerL.length };
}

export interface SeriesCarbon {
  /** Σ over the days with a dose of dose × flow / 1000, kg. */
  totalKg: number;
  /** Days with a dose. */
  daysWithDose: number;
  /** Totals for a year: the total itself for a 365- or 366-day series, else × 365/days (annualised). */
  yearlyKg: number;
  annualised: boolean;
}

/** Carbon over the series from node doses (mg/L), O(nodes). */
export function seriesCarbon(segments: SeriesSegments, doses: ArrayLike<number | null>): SeriesCarbon {
  const n = doses.length;
  let grams = 0, daysWithDose = 0;
  if (n === 1) {
    const d = doses[0]!;
    if (d !== null) { grams = d * segments.a[0]!; daysWithDose = segments.days[0]!; }
  } else {
    for (let k = 0; k + 1 < n; k++) {
      const d0 = doses[k]!, d1 = doses[k + 1]!;
      if (segments.days[k] === 0 || d0 === null || d1 === null) continue;
      grams += segments.a[k]! * d0 + segments.b[k]! * d1; // mg/L = g/m³, × m³/d = g/d
      daysWithDose += segments.days[k]!;
    }
  }
  const totalKg = grams / 1000;
  const annualised = isAnnualised(segments.totalDays);
  return { totalKg, daysWithDose, yearlyKg: annualised ? (totalKg * 365) / segments.totalDays : totalKg, annualised };
}

/**
 * Carbon over a year at one constant dose and flow (no DOC series): one day at that dose,
 * annualised through the same segment sums as a series (kg/a = dose × flow × 365 / 1000), so the
 * run, the sensitivity step and the Monte Carlo agree by construction.
 */
export function yearlyAtOneDose(doseMgPerL: number, flowM3PerD: number, pricePerKg: number): { carbonKg: number; cost: number } {
  const y = seriesCarbon(seriesSegments([0], [0], flowM3PerD), [doseMgPerL]);
  return { carbonKg: y.yearlyKg, cost: carbonCost(y.yearlyKg, pricePerKg) };
}
