/**
 * One Monte Carlo draw: sample the uncertain parameters, then design the carbon again with the
 * design layer's one model (src/design/designDose.ts on the problem's removal model): each
 * compound's goal dose, the indicator-mean dose, the required dose, the DOC/UV254 reduction at
 * it, the cost per m³, and the yearly carbon and cost over the DOC series from the dose table
 * (src/design/doseTable.ts: the same DOC nodes and segment sums as the run, so with every
 * deviation zero the draw reproduces the run's figures). `runChunk` runs a block of draws from
 * the chunk's own random stream; the serial and the parallel runner both call it, so their
 * results are identical.
 *
 * Sampling (stated in the output): positive parameters with a relative SD are lognormal with the
 * point value as median (σ_ln = √(ln(1 + cv²))); parameters named in a covariance are drawn
 * jointly normal (ln K, fraction, 1/n) around the point values; fractions are renormalised to
 * sum to 1 in every draw and the background is c0_i = fraction_i·DOC; the DOC factor applies to
 * the design DOC and the whole series (the table's nodes move with it).
 * Values: a goal that no dose up to 5 g/L reaches gives +Infinity for that draw (counted as
 * unreachable); a goal met without carbon or below the smallest dose gives 0.
 */
import { ComputationError } from '../core/errors.js';
import type { FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { designDose, designDoseWarm, type Design, type DesignProblem, type DesignWarmStarts } from '../design/designDose.js';
import { requiredDoseAt, type RequiredAtDoc } from '../design/requiredDoseAt.js';
import { REPORT_ONLY_GOAL } from '../design/compoundGoal.js';
import { seriesCarbon, seriesSegments, doseTable, type SeriesSegments } from '../design/doseTable.js';
import { REMOVAL_MODELS } from '../design/removalModels.js';
import type { CompetitionSet, RemovalModel, RemovalModelFactory } from '../design/removalModel.js';
import { carbonCost } from '../design/carbonCost.js';
import { yearlyLabel } from '../design/annualised.js';
import { cholesky, lognormalFromZ, lognormalSigma, multivariateNormalDeviation, NormalSampler } from './distributions.js';
import { chunkRng } from './prng.js';
import { targetGoal, validateMonteCarloProblem, type MonteCarloProblem } from './monteCarloProblem.js';
import { kineticDrawFactory, pointKinetics, sampleKinetics, type DrawnKinetics } from './kineticUncertainty.js';

export interface QuantityDef {
  key: string;
  label: string;
  unit: string;
}

export interface DrawModel {
  problem: MonteCarloProblem;
  goals: number[];
  quantities: QuantityDef[];
  /** Cholesky factor of the covariance (empty when none). */
  L: number[][];
  /** Position in the covariance vector of `lnK:id`, `fraction:id`, `one_over_n:id`. */
  covIndex: Map<string, number>;
  /** The same positions by component (−1: not in the covariance), for the draws. */
  covAt: CovPositions;
  /** 1 for a report-only target, by target index. */
  reportOnly: Uint8Array;
  sigma: { bgK: number[]; bgF: number[]; tK: number[]; tN: number[]; doc: number };
  index: { uv: number; docRed: number; yearlyKg: number; yearlyCost: number; governing: number; indicator: number; costPerM3: number };
  /** The design problem every draw solves (goals, indicator goal, price, absorbances). */
  design: DesignProblem;
  factory: RemovalModelFactory;
  /** DOC nodes of the dose table at the design DOC (scaled by each draw's DOC factor) and the series' segment sums. */
  yearly?: { nodes: number[]; segments: SeriesSegments };
  /** The design at the point estimate: starting hints for every draw's searches (only a speed-up). */
  pointDesign?: Design;
  /** The point design's solve states (warm starts of every draw's solves; only a speed-up). */
  pointWarm?: DesignWarmStarts;
}

export interface DrawnParameters {
  background: FreundlichComponent[];
  targets: FreundlichComponent[];
  docMgPerL: number;
  /** Ds of the draw under PAC contact conditions (problem.kinetics; kineticUncertainty.ts). */
  kinetics?: DrawnKinetics;
}

/** Validate a problem and precompute what every draw needs. @throws InputError */
export function compileDrawModel(problem: MonteCarloProblem): DrawModel {
  validateMonteCarloProblem(problem);
  const T = problem.targets.length;
  const factory = problem.kinetics ? kineticDrawFactory(problem.kinetics, problem.targets.map((t) => t.id), pointKinetics(problem.kinetics)) : REMOVAL_MODELS[problem.model ?? 'equilibrium']!;
  const goals = problem.targets.map((t, i) => targetGoal(t, `targets[${i}]`));
  const design: DesignProblem = {
    goals: goals.map((R, i) => (problem.targets[i]!.reportOnly === true ? REPORT_ONLY_GOAL : { kind: 'removal' as const, removalFraction: R, text: `${(R * 100).toPrecision(4)} % removal of ${problem.targets[i]!.id}` })),
    pricePerKg: problem.carbonPricePerKg ?? problem.yearly?.carbonPricePerKg ?? 0,
  };
  if (problem.indicator) design.indicator = { members: problem.indicator.members.map((m) => ({ ...m })), goalPercent: problem.indicator.goalPercent, ...(problem.indicator.chosen ? { chosen: problem.indicator.chosen.slice() } : {}) };
  if (problem.uv254AbsorbancePerM) design.uv254AbsorbancePerM = problem.uv254AbsorbancePerM;
  const quantities: QuantityDef[] = problem.targets.map((t) => (t.reportOnly === true ? { key: `removal:${t.id}`, label: `removal of ${t.id} at the required dose (report only)`, unit: 'fraction' } : { key: `dose:${t.id}`, label: `dose for the goal of ${t.id}`, unit: 'mg/L' }));
  quantities.push({ key: 'governing_dose', label: 'required dose (governing goal)', unit: 'mg/L' });
  quantities.push({ key: 'doc_reduction', label: 'DOC reduction at the required dose', unit: 'fraction' });
  const index = { governing: T, docRed: T + 1, uv: -1, yearlyKg: -1, yearlyCost: -1, indicator: -1, costPerM3: -1 };
  if (problem.indicator) {
    index.indicator = quantities.length;
    quantities.push({ key: 'indicator_dose', label: 'dose for the indicator-mean goal', unit: 'mg/L' });
  }
  if (problem.uv254AbsorbancePerM) {
    index.uv = quantities.length;
    quantities.push({ key: 'uv254_setpoint', label: 'UV254 reduction at the required dose (set-point)', unit: 'fraction' });
  }
  index.costPerM3 = quantities.length;
  quantities.push({ key: 'cost_per_m3', label: 'carbon cost per m³ treated', unit: 'currency/m3' });
  let yearly: DrawModel['yearly'];
  if (problem.yearly) {
    const y = problem.yearly;
    const nodes = y.docNodesMgPerL ?? pointNodes(problem, factory, design);
    const segments = seriesSegments(nodes, y.docSeriesMgPerL, y.flowM3PerD);
    yearly = { nodes, segments };
    index.yearlyKg = quantities.length;
    quantities.push({ key: 'yearly_carbon', label: yearlyLabel('yearly carbon mass', segments.totalDays), unit: 'kg/a' });
    index.yearlyCost = quantities.length;
    quantities.push({ key: 'yearly_cost', label: yearlyLabel('yearly carbon cost', segments.totalDays), unit: 'currency/a' });
  }
  const covIndex = new Map<string, number>();
  let L: number[][] = [];
  if (problem.covariance) {
    problem.covariance.parameters.forEach((n, i) => covIndex.set(n, i));
    L = cholesky(problem.covariance.matrix);
  }
  const out: DrawModel = {
    problem,
    goals,
    quantities,
    L,
    covIndex,
    covAt: covPositions(problem, covIndex),
    reportOnly: Uint8Array.from(problem.targets, (t) => (t.reportOnly === true ? 1 : 0)),
    sigma: {
      bgK: problem.background.map((b) => lognormalSigma(b.KRelSd ?? 0)),
      bgF: problem.background.map((b) => lognormalSigma(b.fractionRelSd ?? 0)),
      tK: problem.targets.map((t) => lognormalSigma(t.KRelSd ?? 0)),
      tN: problem.targets.map((t) => lognormalSigma(t.oneOverNRelSd ?? 0)),
      doc: lognormalSigma(problem.docRelSd ?? 0),
    },
    index,
    design,
    factory,
  };
  if (yearly) out.yearly = yearly;
  const point = designDoseWarm(drawModel(out, sampleParameters(out, undefined)), design);
  out.pointDesign = point.design;
  out.pointWarm = point.warm;
  return out;
}

/** The dose-table nodes at the point estimate, when the problem does not give the run's. */
function pointNodes(problem: MonteCarloProblem, factory: RemovalModelFactory, design: DesignProblem): number[] {
  const bg = problem.background.map((b): FreundlichComponent => ({ id: b.id, c0MgPerL: b.fraction * problem.docMgPerL, K: b.K, oneOverN: b.oneOverN }));
  const model = factory(problem.targets.map((t) => ({ target: { id: t.id, c0MgPerL: t.c0MgPerL, K: t.K, oneOverN: t.oneOverN }, competitors: bg })), problem.docMgPerL, bg);
  return doseTable(model, design, problem.yearly!.docSeriesMgPerL).docMgPerL;
}

/**
 * Parameters of one draw. With `normal` undefined every deviation is zero (the point estimate,
 * through the same arithmetic). The normals consumed per draw are fixed by the problem.
 */
export function sampleParameters(model: DrawModel, normal: NormalSampler | undefined): DrawnParameters {
  const { problem: p, sigma } = model;
  const at = model.covAt;
  const delta = new Float64Array(model.L.length);
  if (normal && model.L.length > 0) multivariateNormalDeviation(model.L, normal, delta);
  const B = p.background.length;
  const T = p.targets.length;
  // the draw's other normals, in the order they are used below (two per background component,
  // two per target, one for the DOC), taken from the sampler in one loop
  const nz = 2 * B + 2 * T + 1;
  const z = normalScratch(nz);
  if (normal) for (let k = 0; k < nz; k++) z[k] = normal.next();
  else z.fill(0, 0, nz);
  const fractions = new Float64Array(B);
  const Ks = new Float64Array(B);
  for (let i = 0; i < B; i++) {
    const b = p.background[i]!;
    const zK = z[2 * i]!;
    const zF = z[2 * i + 1]!;
    const kK = at.bgK[i]!, kF = at.bgF[i]!;
    Ks[i] = b.K === 0 ? 0 : kK >= 0 ? b.K * Math.exp(delta[kK]!) : lognormalFromZ(b.K, sigma.bgK[i]!, zK);
    fractions[i] = kF >= 0 ? Math.max(0, b.fraction + delta[kF]!) : lognormalFromZ(b.fraction, sigma.bgF[i]!, zF);
  }
  const targets = new Array<FreundlichComponent>(T);
  for (let i = 0; i < T; i++) {
    const t = p.targets[i]!;
    const zK = z[2 * B + 2 * i]!;
    const zN = z[2 * B + 2 * i + 1]!;
    const kK = at.tK[i]!, kN = at.tN[i]!;
    targets[i] = {
      id: t.id,
      c0MgPerL: t.c0MgPerL,
      K: kK >= 0 ? t.K * Math.exp(delta[kK]!) : lognormalFromZ(t.K, sigma.tK[i]!, zK),
      oneOverN: kN >= 0 ? Math.max(0.01, t.oneOverN + delta[kN]!) : lognormalFromZ(t.oneOverN, sigma.tN[i]!, zN),
    };
  }
  const docMgPerL = lognormalFromZ(p.docMgPerL, sigma.doc, z[2 * B + 2 * T]!);
  let sum = 0;
  for (let i = 0; i < B; i++) sum += fractions[i]!;
  if (!(sum > 0)) throw new ComputationError('a Monte Carlo draw gave background fractions that sum to 0');
  const background = new Array<FreundlichComponent>(B);
  for (let i = 0; i < B; i++) {
    const b = p.background[i]!;
    const kN = at.bgN[i]!;
    // the key order of every FreundlichComponent (one object layout for the solvers)
    background[i] = {
      id: b.id,
      c0MgPerL: (fractions[i]! / sum) * docMgPerL,
      K: Ks[i]!,
      oneOverN: b.K === 0 ? b.oneOverN : kN >= 0 ? Math.max(0.01, b.oneOverN + delta[kN]!) : b.oneOverN,
    };
  }
  const drawn: DrawnParameters = { background, targets, docMgPerL };
  if (p.kinetics) drawn.kinetics = sampleKinetics(p.kinetics, () => (normal ? normal.next() : 0)); // after every other normal: equilibrium streams unchanged
  return drawn;
}

/** Scratch for a draw's normals (only the first `n`, written before they are read, are used). */
let normals = new Float64Array(64);
function normalScratch(n: number): Float64Array {
  if (normals.length < n) normals = new Float64Array(2 * n);
  return normals;
}

/** Positions in the covariance vector of each parameter (−1: not in the covariance), by component. */
export interface CovPositions { bgK: Int32Array; bgF: Int32Array; bgN: Int32Array; tK: Int32Array; tN: Int32Array }

function covPositions(p: MonteCarloProblem, covIndex: ReadonlyMap<string, number>): CovPositions {
  const pos = (name: string) => covIndex.get(name) ?? -1;
  return {
    bgK: Int32Array.from(p.background, (b) => pos(`lnK:${b.id}`)),
    bgF: Int32Array.from(p.background, (b) => pos(`fraction:${b.id}`)),
    bgN: Int32Array.from(p.background, (b) => pos(`one_over_n:${b.id}`)),
    tK: Int32Array.from(p.targets, (t) => pos(`lnK:${t.id}`)),
    tN: Int32Array.from(p.targets, (t) => pos(`one_over_n:${t.id}`)),
  };
}

/** The removal model of one draw at its DOC. */
export function drawModel(model: DrawModel, d: DrawnParameters): RemovalModel {
  const factory = d.kinetics ? kineticDrawFactory(model.problem.kinetics!, model.problem.targets.map((t) => t.id), d.kinetics) : model.factory;
  const sets: CompetitionSet[] = []; // by push: one array layout in every tier (designDose.ts)
  for (const t of d.targets) sets.push({ target: t, competitors: d.background });
  return factory(sets, d.docMgPerL, d.background);
}

const orInfinity = (v: number | null): number => (v === null ? Infinity : v);

/**
 * The quantities of one draw, written into `out` (length = model.quantities.length).
 * @returns the index of the governing target, targets.length for the indicator mean, −1 when nothing is reachable
 */
export function evaluateDraw(model: DrawModel, d: DrawnParameters, out: Float64Array): number {
  const p = model.problem;
  const T = p.targets.length;
  const removal = drawModel(model, d);
  const design: Design = designDose(removal, model.design, model.pointDesign, model.pointWarm);
  const required = orInfinity(design.doseMgPerL);
  for (let t = 0; t < T; t++) {
    // a report-only compound: its removal at the required dose (none without a dose)
    out[t] = model.reportOnly[t] === 0 ? orInfinity(design.compounds[t]!.doseMgPerL)
      : required === Infinity ? Infinity : required > 0 ? 1 - removal.remaining(t, required / 1000).remainingFraction : 0;
  }
  out[model.index.governing] = required;
  if (model.index.indicator >= 0) out[model.index.indicator] = orInfinity(design.indicator?.doseMgPerL ?? null);
  const s = design.surrogate;
  out[model.index.docRed] = required === Infinity ? Infinity : s ? s.docReduction : 0;
  if (model.index.uv >= 0) out[model.index.uv] = required === Infinity ? Infinity : s ? s.uv254Reduction ?? 0 : 0;
  out[model.index.costPerM3] = orInfinity(design.costPerM3);
  if (model.yearly) {
    const factor = d.docMgPerL / p.docMgPerL;
    let near: RequiredAtDoc | undefined;
    const doses: Array<number | null> = []; // by push: one array layout in every tier (designDose.ts)
    for (const node of model.yearly.nodes) {
      const doc = node * factor;
      near = requiredDoseAt(doc === removal.docMgPerL ? removal : removal.atDoc(doc), model.design, design, near);
      doses.push(near.doseMgPerL);
    }
    const y = seriesCarbon(model.yearly.segments, doses);
    const nothing = y.daysWithDose === 0;
    out[model.index.yearlyKg] = nothing ? Infinity : y.yearlyKg;
    out[model.index.yearlyCost] = nothing ? Infinity : carbonCost(y.yearlyKg, model.design.pricePerKg);
  }
  if (design.governedBy === 'indicator mean') return T;
  if (!design.governing) return -1;
  return p.targets.findIndex((t) => t.id === design.governing!.compoundId);
}

export interface ChunkResult {
  chunk: number;
  count: number;
  /** count × quantities values, draw-major. */
  values: Float64Array;
  /** Index of the governing target in each draw. */
  governing: Int32Array;
}

/** Run draws [0, count) of chunk `chunk` from its own stream chunkRng(seed, chunk). */
export function runChunk(model: DrawModel, seed: number, chunk: number, count: number): ChunkResult {
  const nq = model.quantities.length;
  const values = new Float64Array(count * nq);
  const governing = new Int32Array(count);
  const normal = new NormalSampler(chunkRng(seed, chunk));
  const row = new Float64Array(nq);
  for (let i = 0; i < count; i++) {
    const params = sampleParameters(model, normal);
    governing[i] = evaluateDraw(model, params, row);
    values.set(row, i * nq);
  }
  return { chunk, count, values, governing };
}
