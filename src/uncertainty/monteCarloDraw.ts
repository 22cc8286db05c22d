/**
 * One Monte Carlo draw: sample the uncertain parameters, then compute the quantities (dose for
 * each target's goal, governing dose, UV254 set-point, DOC reduction, yearly carbon and cost).
 * `runChunk` runs a block of draws from the chunk's own random stream; the serial and the
 * parallel runner both call it, so their results are identical.
 *
 * Sampling (stated in the output): positive parameters with a relative SD are lognormal with the
 * point value as median (σ_ln = √(ln(1 + cv²))); parameters named in a covariance are drawn
 * jointly normal (ln K, fraction, 1/n) around the point values; fractions are renormalised to
 * sum to 1 in every draw and the background is c0_i = fraction_i·DOC.
 * A goal that no dose up to 5 g/L reaches gives +Infinity for that draw (counted as unreachable).
 */
import { ComputationError, InputError } from '../core/errors.js';
import { prepareMixture, type FreundlichComponent } from '../equilibrium/preparedMixture.js';
import { solveBatchPrepared } from '../equilibrium/iastBatch.js';
import { doseForRemoval } from '../design/doseForRemoval.js';
import { cholesky, lognormalFromZ, lognormalSigma, multivariateNormalDeviation, NormalSampler } from './distributions.js';
import { chunkRng } from './prng.js';
import { targetGoal, validateMonteCarloProblem, type MonteCarloProblem } from './monteCarloProblem.js';
import { docLevelsLogSpaced, interpolateDoseLogDoc, yearlyCarbon } from './yearlyCarbon.js';

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
  sigma: { bgK: number[]; bgF: number[]; tK: number[]; tN: number[]; doc: number };
  index: { uv: number; docRed: number; yearlyKg: number; yearlyCost: number; governing: number };
}

export interface DrawnParameters {
  background: FreundlichComponent[];
  targets: FreundlichComponent[];
  docMgPerL: number;
}

/** Validate a problem and precompute what every draw needs. @throws InputError */
export function compileDrawModel(problem: MonteCarloProblem): DrawModel {
  validateMonteCarloProblem(problem);
  const T = problem.targets.length;
  const quantities: QuantityDef[] = problem.targets.map((t) => ({ key: `dose:${t.id}`, label: `dose for the goal of ${t.id}`, unit: 'mg/L' }));
  quantities.push({ key: 'governing_dose', label: 'governing dose (largest over targets)', unit: 'mg/L' });
  quantities.push({ key: 'doc_reduction', label: 'DOC reduction at the governing dose', unit: 'fraction' });
  const index = { governing: T, docRed: T + 1, uv: -1, yearlyKg: -1, yearlyCost: -1 };
  if (problem.uv254AbsorbancePerM) {
    index.uv = quantities.length;
    quantities.push({ key: 'uv254_setpoint', label: 'UV254 reduction at the governing dose (set-point)', unit: 'fraction' });
  }
  if (problem.yearly) {
    index.yearlyKg = quantities.length;
    quantities.push({ key: 'yearly_carbon', label: 'yearly carbon mass', unit: 'kg/a' });
    index.yearlyCost = quantities.length;
    quantities.push({ key: 'yearly_cost', label: 'yearly carbon cost', unit: 'currency/a' });
  }
  const covIndex = new Map<string, number>();
  let L: number[][] = [];
  if (problem.covariance) {
    problem.covariance.parameters.forEach((n, i) => covIndex.set(n, i));
    L = cholesky(problem.covariance.matrix);
  }
  return {
    problem,
    goals: problem.targets.map((t, i) => targetGoal(t, `targets[${i}]`)),
    quantities,
    L,
    covIndex,
    sigma: {
      bgK: problem.background.map((b) => lognormalSigma(b.KRelSd ?? 0)),
      bgF: problem.background.map((b) => lognormalSigma(b.fractionRelSd ?? 0)),
      tK: problem.targets.map((t) => lognormalSigma(t.KRelSd ?? 0)),
      tN: problem.targets.map((t) => lognormalSigma(t.oneOverNRelSd ?? 0)),
      doc: lognormalSigma(problem.docRelSd ?? 0),
    },
    index,
  };
}

/**
 * Parameters of one draw. With `normal` undefined every deviation is zero (the point estimate,
 * through the same arithmetic). The normals consumed per draw are fixed by the problem.
 */
export function sampleParameters(model: DrawModel, normal: NormalSampler | undefined): DrawnParameters {
  const { problem: p, covIndex, sigma } = model;
  const delta = new Float64Array(model.L.length);
  if (normal && model.L.length > 0) multivariateNormalDeviation(model.L, normal, delta);
  const z = () => (normal ? normal.next() : 0);
  const cov = (name: string): number | undefined => {
    const k = covIndex.get(name);
    return k === undefined ? undefined : delta[k]!;
  };
  const fractions: number[] = [];
  const Ks: number[] = [];
  p.background.forEach((b, i) => {
    const zK = z();
    const zF = z();
    const dK = cov(`lnK:${b.id}`);
    Ks.push(b.K === 0 ? 0 : dK !== undefined ? b.K * Math.exp(dK) : lognormalFromZ(b.K, sigma.bgK[i]!, zK));
    const dF = cov(`fraction:${b.id}`);
    fractions.push(dF !== undefined ? Math.max(0, b.fraction + dF) : lognormalFromZ(b.fraction, sigma.bgF[i]!, zF));
  });
  const targets: FreundlichComponent[] = p.targets.map((t, i) => {
    const zK = z();
    const zN = z();
    const dK = cov(`lnK:${t.id}`);
    const dN = cov(`one_over_n:${t.id}`);
    return {
      id: t.id,
      c0MgPerL: t.c0MgPerL,
      K: dK !== undefined ? t.K * Math.exp(dK) : lognormalFromZ(t.K, sigma.tK[i]!, zK),
      oneOverN: dN !== undefined ? Math.max(0.01, t.oneOverN + dN) : lognormalFromZ(t.oneOverN, sigma.tN[i]!, zN),
    };
  });
  const docMgPerL = lognormalFromZ(p.docMgPerL, sigma.doc, z());
  let sum = 0;
  for (const f of fractions) sum += f;
  if (!(sum > 0)) throw new ComputationError('a Monte Carlo draw gave background fractions that sum to 0');
  const background = p.background.map((b, i): FreundlichComponent => {
    const dN = cov(`one_over_n:${b.id}`);
    return {
      id: b.id,
      K: Ks[i]!,
      oneOverN: b.K === 0 ? b.oneOverN : dN !== undefined ? Math.max(0.01, b.oneOverN + dN) : b.oneOverN,
      c0MgPerL: (fractions[i]! / sum) * docMgPerL,
    };
  });
  return { background, targets, docMgPerL };
}

function scaleBackground(bg: readonly FreundlichComponent[], factor: number): FreundlichComponent[] {
  return bg.map((c) => ({ ...c, c0MgPerL: c.c0MgPerL * factor }));
}

/** Dose in mg/L for a removal goal; +Infinity when no dose up to 5 g/L reaches it. */
export function doseOrInfinity(target: FreundlichComponent, background: readonly FreundlichComponent[], goal: number): number {
  const pm = prepareMixture([target, ...background]);
  try {
    return doseForRemoval(pm, 0, goal).doseGPerL * 1000;
  } catch (e) {
    if (e instanceof InputError) return Infinity;
    throw e;
  }
}

/** The quantities of one draw, written into `out` (length = model.quantities.length). */
export function evaluateDraw(model: DrawModel, d: DrawnParameters, out: Float64Array): number {
  const p = model.problem;
  const T = p.targets.length;
  let governing = 0;
  for (let t = 0; t < T; t++) {
    out[t] = doseOrInfinity(d.targets[t]!, d.background, model.goals[t]!);
    if (out[t]! > out[governing]!) governing = t;
  }
  const dGov = out[governing]!;
  out[model.index.governing] = dGov;
  if (dGov === Infinity) {
    out[model.index.docRed] = Infinity;
    if (model.index.uv >= 0) out[model.index.uv] = Infinity;
  } else {
    const pmBg = prepareMixture(d.background);
    const s = solveBatchPrepared(pmBg, dGov / 1000);
    let doc0 = 0, doc = 0, uv0 = 0, uv = 0;
    const a = p.uv254AbsorbancePerM;
    d.background.forEach((c, i) => {
      doc0 += c.c0MgPerL;
      doc += s.cMgPerL[i]!;
      if (a) { uv0 += a[i]! * c.c0MgPerL; uv += a[i]! * s.cMgPerL[i]!; } // Beer–Lambert additivity
    });
    out[model.index.docRed] = 1 - doc / doc0;
    if (model.index.uv >= 0) out[model.index.uv] = 1 - uv / uv0;
  }
  if (p.yearly) {
    const y = p.yearly;
    const mult = d.docMgPerL / p.docMgPerL;
    let lo = Infinity, hi = 0;
    for (const v of y.docSeriesMgPerL) { lo = Math.min(lo, v); hi = Math.max(hi, v); }
    const levels = docLevelsLogSpaced(lo * mult, hi * mult, y.docLevels ?? 5);
    const table = d.targets.map((tc, t) => Float64Array.from(levels, (lv) => doseOrInfinity(tc, scaleBackground(d.background, lv / d.docMgPerL), model.goals[t]!)));
    const yc = yearlyCarbon(y.docSeriesMgPerL, y.flowM3PerD, (docDay) => {
      let m = 0;
      for (const row of table) m = Math.max(m, interpolateDoseLogDoc(levels, row, docDay * mult));
      return m;
    });
    out[model.index.yearlyKg] = yc.yearlyKg;
    out[model.index.yearlyCost] = yc.yearlyKg * y.carbonPricePerKg;
  }
  return governing;
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
