/**
 * GAC fixed-bed breakthrough of every component of a mixture (fictive DOC components and trace
 * targets) from the same IAST and surface-diffusion model: plug flow through the bed, film
 * transfer, homogeneous surface diffusion in the grains and reverse IAST at their surface, clean
 * bed, constant feed.
 *
 *   ε·∂c_i/∂t + v·∂c_i/∂z = −(1 − ε)·(3/R)·kf_i·(c_i − c_s,i),   v = L/EBCT, ρ_bed = ρp·(1 − ε)
 *   ∂q_i/∂t = Ds_i·(1/r²)·∂/∂r(r²·∂q_i/∂r),   ρp·Ds_i·∂q_i/∂r|_R = kf_i·(c_i − c_s,i)
 *   c_s from reverse IAST (Radke & Prausnitz 1972) over the background components; trace
 *   components (feed below `traceFraction` of the adsorbable total) in the trace form
 * (Crittenden & Weber 1978, J. Environ. Eng. Div. 104; Hand, Crittenden & Thacker 1983,
 * J. Environ. Eng. 109:82, both from memory). Film: Wilson & Geankoplis (1966) unless kf is
 * given. Method of lines (src/kinetics/fixedBedModel.ts) with TR-BDF2
 * (src/kinetics/implicitIntegrator.ts). Components with K = 0 pass straight through: c/c0 = 0
 * before BV = ε (the pore volume) and 1 after.
 *
 * Outputs: c/c0 of every component, of DOC (sum of the DOC components, adsorbable or not) and of
 * UV254 (from the components' specific absorbances) against bed volumes BV = t/EBCT; the bed
 * volumes at given c/c0 (default 0.1, 0.2, 0.5) and at each goal; the run-averaged removal; the
 * mass-balance error max |fed − left − held|/fed over the output times (held in the pores and on
 * the carbon), which closes to the linear solves' rounding (a linear invariant of the scheme).
 *
 * Units: see src/kinetics/fixedBedInput.ts; bed volumes dimensionless.
 * @throws InputError for invalid inputs (naming the component and field); ComputationError when
 *   the integration fails (with the reason and the bed volumes reached)
 */
import { InputError } from '../core/errors.js';
import { firstCrossing, curveIntegral, type BreakthroughCurve } from './breakthroughCurve.js';
import { checkBed, checkComponents, filmCoefficients, type ComponentFilm, type FixedBedComponent, type FixedBedInput, type FixedBedSpec } from './fixedBedInput.js';
import { bedBackgroundHistory, storingBedBackground, solveBedBackground, type BedBackgroundHistory, type BedBackgroundHistoryData, type StoringBedBackground } from './fixedBedBackground.js';
import { fixedBedModel, type BedComponentScales, type BedModel } from './fixedBedModel.js';
import { integrateImplicit, type IntegratorStats } from './implicitIntegrator.js';

export interface FixedBedOptions {
  /** Length of the run, bed volumes. */
  toBedVolumes: number;
  /** Output points, evenly spaced from 0 (default 201), plus 30 log-spaced points from 1 BV up to the first of them (early fronts). */
  points?: number;
  /** Output bed volumes instead (strictly increasing, > 0; the last one is the run length). */
  outputBedVolumes?: readonly number[];
  /** Axial cells (default 60). */
  cells?: number;
  /** Interior collocation points in the grain (default 5). */
  interiorPoints?: number;
  /**
   * Integrator tolerances on u = c/c0 and q/q_ref (defaults FIXED_BED_TOLERANCES: on the demo water
   * 3e-4 moves no breakthrough point by more than 0.002 % from 1e-4, with 22 % fewer steps; the
   * grid error is 10–100 times larger).
   */
  rtol?: number;
  atol?: number;
  /** c/c0 levels whose bed volumes are reported (default 0.1, 0.2, 0.5). */
  levels?: readonly number[];
  /** Allowed outlet c/c0 per component id (a goal: 1 − removal, or limit/c0). */
  goals?: Readonly<Record<string, number>>;
  /** Feed share of the adsorbable total below which a component is a trace (default 1e-3). */
  traceFraction?: number;
  /**
   * Stop early: asked after every STOP_CHECK_POINTS output points with the outlet curves so far
   * (c/c0 by component id, on `bedVolumes`); true ends the run there (the result then ends at the
   * last output point computed, and `toBedVolumes` is only the longest run).
   */
  stopWhen?: (bedVolumes: readonly number[], cOverC0ById: Readonly<Record<string, readonly number[]>>) => boolean;
  /** Replay these integrator steps (the `stepTimes` of an earlier run; not with `stopWhen`): results smooth in the parameters. */
  stepTimes?: readonly number[];
  /**
   * Solve the background components first, alone, with their surface history stored, then each
   * trace alone against it (the trace shortcut of traceBed; equal to the coupled solve within the
   * integrators' tolerances, tests/kinetics/fixedBedTrace.test.ts), and return the stored
   * background as `storedBackground` for more targets on the same bed-volume grid. Used when
   * there are both background components and traces; not with `stepTimes`. Default false (coupled).
   */
  storedBackground?: boolean;
}

/** Default integrator tolerances of the fixed-bed model (ours; see FixedBedOptions.rtol). */
export const FIXED_BED_TOLERANCES = { rtol: 3e-4, atol: 1e-7 } as const;

/** Output points between two questions to `stopWhen`. */
export const STOP_CHECK_POINTS = 8;

/** c/c0 levels whose bed volumes are reported by default. */
export const DEFAULT_BREAKTHROUGH_LEVELS = [0.1, 0.2, 0.5] as const;
/**
 * Default grid of the fixed-bed solver: axial cells and interior collocation points per grain.
 * Ours, from grid studies on the demo water (fixtures/column/demo-water.json): 30 cells moved the
 * first target's BV at c/c0 0.1 by 1.6 % when doubled, 60 cells by < 0.1 % (120 × 10 as the
 * reference); 10 grain points instead of 5 change the targets and the stronger DOC fractions by
 * < 0.1 %, but the weakest DOC fraction (through within the first ~100 BV, when the carbon is
 * loaded only in a thin shell) needs more grain points (tests/kinetics/fixedBedGrid.test.ts).
 */
export const DEFAULT_FIXED_BED_GRID = { cells: 60, interiorPoints: 5 } as const;

export interface BreakthroughPoint {
  cOverC0: number;
  /** First bed volumes at which the outlet reaches c/c0, null when not within the run. */
  bedVolumes: number | null;
}

export interface FixedBedComponentResult {
  id: string;
  c0MgPerL: number;
  adsorbable: boolean;
  /** Modelled in the trace form (its loading negligible against the background's). */
  trace: boolean;
  cOverC0: number[];
  breakthrough: BreakthroughPoint[];
  /** Bed volumes at which the outlet first exceeds the goal's allowed c/c0 (null: not within the run). */
  goal?: { maxCOverC0: number; bedVolumes: number | null; runAveragedRemoval: number | null };
  /** 1 − (1/T)·∫₀^T c/c0 dBV over the whole simulated run. */
  runAveragedRemoval: number;
  /** max |fed − left − held|/fed over the output times (0 for non-adsorbable components). */
  massBalanceError: number;
}

export interface FixedBedResult {
  bedVolumes: number[];
  components: FixedBedComponentResult[];
  /** DOC c/c0 (sum of the DOC components), when any component is marked as DOC. */
  doc?: { doc0MgPerL: number; cOverC0: number[] };
  /** UV254 a/a0, when any component has a specific absorbance. */
  uv254?: { uv0PerM: number; ratio: number[] };
  /** Largest mass-balance error of any component. */
  massBalanceError: number;
  films: ComponentFilm[];
  grid: { cells: number; interiorPoints: number };
  stats: IntegratorStats;
  /** End time of every accepted step, bed volumes (for a replay; absent with `stopWhen` and with a stored background). */
  stepTimes?: number[];
  /** With `storedBackground`: the background solved once, for more trace targets on `bedVolumes` (not data: a handle). */
  storedBackground?: TraceBed;
  warnings: string[];
}

/** Simulate the breakthrough of every component (see the file comment). */
export function simulateFixedBed(input: FixedBedInput, options: FixedBedOptions): FixedBedResult {
  const { bed } = input;
  checkBed(bed);
  checkComponents(input.components);
  const toBv = options.toBedVolumes;
  if (!(toBv > 0) || !Number.isFinite(toBv)) throw new InputError(`expected a run length > 0 bed volumes, got ${toBv}`, { path: 'toBedVolumes' });
  const points = options.points ?? 201;
  if (!Number.isInteger(points) || points < 3) throw new InputError(`expected at least 3 output points, got ${points}`, { path: 'points' });
  const levels = options.levels ?? DEFAULT_BREAKTHROUGH_LEVELS;
  levels.forEach((l, i) => { if (!(l > 0 && l <= 1.2)) throw new InputError(`expected a c/c0 level in (0, 1.2], got ${l}`, { path: `levels[${i}]` }); });
  const comps = input.components;
  comps.forEach((c, i) => { if (c.K > 0 && !(c.c0MgPerL > 0)) throw new InputError(`component "${c.id}": an adsorbable component needs a feed concentration c0 > 0`, { path: `components[${i}].c0` }); });
  const eps = bed.porosity;
  const films = filmCoefficients(comps, bed);
  const kfOf = new Map(films.map((f) => [f.id, f.kfMPerS]));
  const adsorbable = comps.map((c, i) => ({ c, i })).filter((x) => x.c.K > 0);
  const totalAds = adsorbable.reduce((s, x) => s + x.c.c0MgPerL, 0);
  const traceFraction = options.traceFraction ?? 1e-3;
  const isTrace = (c0: number) => c0 < traceFraction * totalAds;
  const ordered = [...adsorbable.filter((x) => !isTrace(x.c.c0MgPerL)), ...adsorbable.filter((x) => isTrace(x.c.c0MgPerL))];
  const nb = ordered.filter((x) => !isTrace(x.c.c0MgPerL)).length;
  const rhoP = bed.particleDensityKgPerM3;
  const scales = ordered.map(({ c }) => componentScales(c, kfOf.get(c.id)!, bed));
  const given = options.outputBedVolumes;
  if (given) given.forEach((b, k) => { if (!(b > 0) || !Number.isFinite(b) || (k > 0 && !(b > given[k - 1]!))) throw new InputError(`expected strictly increasing output bed volumes > 0; value ${b} at index ${k}`, { path: `outputBedVolumes[${k}]` }); });
  const bvs = given ? [0, ...given] : outputGrid(toBv, points);
  if (given && Math.abs(bvs[bvs.length - 1]! - toBv) > 1e-9 * toBv) throw new InputError('expected the last output bed volume to equal the run length', { path: 'outputBedVolumes' });
  const cOverC0 = comps.map(() => new Array<number>(bvs.length).fill(0));
  const massErr = comps.map(() => 0);
  let stats: IntegratorStats = { steps: 0, rejectedSteps: 0, newtonIterations: 0, newtonFailures: 0, factorizations: 0, rhsEvaluations: 0, maxAcceptedError: 0 };
  const grid = { cells: options.cells ?? DEFAULT_FIXED_BED_GRID.cells, interiorPoints: options.interiorPoints ?? DEFAULT_FIXED_BED_GRID.interiorPoints };
  let end = bvs.length; // output points computed (all unless stopWhen ends the run)
  let stepTimes: number[] | undefined;
  if (options.stepTimes && options.stopWhen) throw new InputError('a replay of steps cannot stop early', { path: 'stepTimes' });
  const split = options.storedBackground === true && nb >= 1 && nb < ordered.length;
  if (options.storedBackground && options.stepTimes) throw new InputError('a replay of steps needs the coupled solve (not storedBackground)', { path: 'stepTimes' });
  let stored: StoringBedBackground | undefined;
  if (ordered.length > 0) {
    // the systems integrated: the coupled model of every component, or (split) the background
    // alone with its history stored, then each trace alone against that history
    interface Part { model: BedModel; members: number[]; y: Float64Array; h?: number; onStep?: StoringBedBackground['onStep'] }
    const parts: Part[] = [];
    if (split) {
      stored = storingBedBackground(scales.slice(0, nb), eps, rhoP, grid);
      parts.push({ model: stored.model, members: ordered.slice(0, nb).map((x) => x.i), y: new Float64Array(stored.model.size), onStep: stored.onStep });
      for (let m = nb; m < ordered.length; m++) {
        const model = fixedBedModel([scales[m]!], 0, eps, rhoP, grid, stored.history);
        parts.push({ model, members: [ordered[m]!.i], y: new Float64Array(model.size) });
      }
    } else {
      const model = fixedBedModel(scales, nb, eps, rhoP, grid);
      parts.push({ model, members: ordered.map((x) => x.i), y: new Float64Array(model.size) });
    }
    const keep = (part: Part, y: Float64Array, k: number) => {
      const model = part.model;
      part.members.forEach((i, m) => {
        cOverC0[i]![k] = model.outlet(y, m);
        if (k > 0) {
          const fed = bvs[k]!;
          const err = Math.abs(fed - y[model.outflowIndex(m)]! - model.held(y, m)) / fed;
          if (err > massErr[i]!) massErr[i] = err;
        }
      });
    };
    const tol = { rtol: options.rtol ?? FIXED_BED_TOLERANCES.rtol, atol: options.atol ?? FIXED_BED_TOLERANCES.atol };
    const sum = stats as unknown as Record<string, number>;
    const add = (st: IntegratorStats) => { for (const [key, v] of Object.entries(st)) sum[key] = key === 'maxAcceptedError' ? Math.max(sum[key]!, v) : sum[key]! + v; };
    const stop = options.stopWhen;
    if (!stop) {
      for (const part of parts) {
        const res = integrateImplicit(part.model, 0, part.y, bvs, { ...tol, ...(options.stepTimes ? { stepTimes: options.stepTimes } : {}), ...(part.onStep ? { onStep: part.onStep } : {}) });
        add(res.stats);
        if (!split) stepTimes = res.stepTimes;
        res.states.forEach((y, k) => keep(part, y, k));
      }
    } else {
      // in segments of STOP_CHECK_POINTS output points, each continuing from the last state with
      // the last step size, asking stopWhen in between (split: the background's segment first)
      let from = 0;
      for (const part of parts) keep(part, part.y, 0);
      end = 1;
      while (end < bvs.length) {
        const seg = bvs.slice(end, Math.min(bvs.length, end + STOP_CHECK_POINTS));
        for (const part of parts) {
          const res = integrateImplicit(part.model, bvs[from]!, part.y, seg, { ...tol, ...(part.h === undefined ? {} : { initialStep: part.h }), ...(part.onStep ? { onStep: part.onStep } : {}) });
          add(res.stats);
          res.states.forEach((st, k) => keep(part, st, end + k));
          const st = res.stepTimes;
          if (st.length >= 2) part.h = st[st.length - 1]! - st[st.length - 2]!;
          part.y = res.states[res.states.length - 1]!;
        }
        from = end + seg.length - 1;
        end += seg.length;
        if (end < bvs.length) {
          const sofar = bvs.slice(0, end);
          const byId: Record<string, number[]> = {};
          comps.forEach((c, i) => { byId[c.id] = c.K === 0 ? sofar.map((b) => (b >= eps ? 1 : 0)) : cOverC0[i]!.slice(0, end); });
          if (stop(sofar, byId)) break;
        }
      }
    }
  }
  if (end < bvs.length) {
    bvs.length = end;
    cOverC0.forEach((c) => { c.length = end; });
  }
  const runEnd = bvs[bvs.length - 1]!;
  comps.forEach((c, i) => { if (c.K === 0) bvs.forEach((b, k) => { cOverC0[i]![k] = b >= eps ? 1 : 0; }); });
  const goals = options.goals ?? {};
  const components = comps.map((c, i): FixedBedComponentResult => {
    const curve: BreakthroughCurve = { bedVolumes: bvs, cOverC0: cOverC0[i]! };
    const out: FixedBedComponentResult = {
      id: c.id,
      c0MgPerL: c.c0MgPerL,
      adsorbable: c.K > 0,
      trace: c.K > 0 && isTrace(c.c0MgPerL),
      cOverC0: cOverC0[i]!,
      // a non-adsorbable component arrives as a step after one pore volume, BV = ε (plug flow)
      breakthrough: levels.map((l) => ({ cOverC0: l, bedVolumes: c.K === 0 ? (l <= 1 && runEnd >= eps ? eps : null) : firstCrossing(curve, l) })),
      // non-adsorbable: removed only while the first pore volume fills (exact for the step at BV = ε)
      runAveragedRemoval: c.K === 0 ? Math.min(eps, runEnd) / runEnd : 1 - curveIntegral(curve, runEnd) / runEnd,
      massBalanceError: massErr[i]!,
    };
    const g = goals[c.id];
    if (g !== undefined) {
      if (!(g > 0)) throw new InputError(`expected an allowed c/c0 > 0 for "${c.id}", got ${g}`, { path: `goals.${c.id}` });
      const at = firstCrossing(curve, g);
      out.goal = { maxCOverC0: g, bedVolumes: at, runAveragedRemoval: at && at > 0 ? 1 - curveIntegral(curve, at) / at : null };
    }
    return out;
  });
  const result: FixedBedResult = {
    bedVolumes: bvs,
    components,
    massBalanceError: Math.max(0, ...massErr),
    films,
    grid,
    stats,
    ...(stepTimes ? { stepTimes } : {}),
    ...(stored ? { storedBackground: storedTraceBed(bed, grid, bvs, stored.history, ordered.slice(0, nb).reduce((s, x) => s + x.c.c0MgPerL, 0), { rtol: options.rtol ?? FIXED_BED_TOLERANCES.rtol, atol: options.atol ?? FIXED_BED_TOLERANCES.atol }) } : {}),
    warnings: films.filter((f) => f.warning).map((f) => f.warning!),
  };
  const docIdx = comps.map((c, i) => (c.doc ? i : -1)).filter((i) => i >= 0);
  if (docIdx.length > 0) {
    const doc0 = docIdx.reduce((s, i) => s + comps[i]!.c0MgPerL, 0);
    result.doc = { doc0MgPerL: doc0, cOverC0: bvs.map((_, k) => docIdx.reduce((s, i) => s + comps[i]!.c0MgPerL * cOverC0[i]![k]!, 0) / doc0) };
  }
  const uvIdx = comps.map((c, i) => (c.uv254PerMgPerL !== undefined && c.uv254PerMgPerL > 0 ? i : -1)).filter((i) => i >= 0);
  if (uvIdx.length > 0) {
    const uv0 = uvIdx.reduce((s, i) => s + comps[i]!.uv254PerMgPerL! * comps[i]!.c0MgPerL, 0); // Beer–Lambert additivity
    result.uv254 = { uv0PerM: uv0, ratio: bvs.map((_, k) => uvIdx.reduce((s, i) => s + comps[i]!.uv254PerMgPerL! * comps[i]!.c0MgPerL * cOverC0[i]![k]!, 0) / uv0) };
  }
  return result;
}

/** The dimensionless scales of one adsorbable component with film coefficient kf (m/s) in `bed`. */
function componentScales(c: FixedBedComponent, kf: number, bed: FixedBedSpec): BedComponentScales {
  const eps = bed.porosity, R = bed.particleRadiusM, rhoP = bed.particleDensityKgPerM3, ebct = bed.ebctS;
  const qRef = c.K * Math.pow(c.c0MgPerL, c.oneOverN);
  return {
    c0MgPerL: c.c0MgPerL, K: c.K, beta: c.oneOverN, qRefMgPerG: qRef,
    stanton: ((1 - eps) * 3 * kf * ebct) / R, // St = (1 − ε)·3·kf·EBCT/R
    diffusion: (c.dsM2PerS! * ebct) / (R * R), // Dτ = Ds·EBCT/R²
    film: (3 * kf * ebct * c.c0MgPerL) / (R * rhoP * qRef), // Φ = 3·kf·EBCT·c0/(R·ρp·q_ref)
  };
}

/** Options of a background solved once for trace targets. */
export interface TraceBedOptions {
  /** Output bed volumes (strictly increasing, > 0; the last one is the run length). */
  outputBedVolumes: readonly number[];
  /** Axial cells and interior grain points (default DEFAULT_FIXED_BED_GRID). */
  cells?: number;
  interiorPoints?: number;
  /** Tolerances of the background's integration (default FIXED_BED_TOLERANCES). */
  rtol?: number;
  atol?: number;
}

/** The outlet of one trace target against a stored background. */
export interface TraceOutlet {
  /** c/c0 at 0 and at each output bed volume. */
  cOverC0: number[];
  /** max |fed − left − held|/fed of the target over the output times. */
  massBalanceError: number;
  stats: IntegratorStats;
  /** End time of every accepted step (for a replay). */
  stepTimes: number[];
}

/**
 * A fixed bed whose background components are solved once (src/kinetics/fixedBedBackground.ts);
 * `outlet` then integrates one trace target alone against the stored background, with its own
 * step control. Equal to the coupled solve of simulateFixedBed within the integrators' tolerances
 * (tests/kinetics/fixedBedTrace.test.ts), and far cheaper when many targets or many values of a
 * target's parameters are asked (column fits, Monte Carlo draws).
 */
export interface TraceBed {
  readonly bedVolumes: readonly number[];
  readonly background: BedBackgroundHistory;
  /**
   * The target's outlet; it must be a trace against the background (feed below `traceFraction`, default
   * 1e-3, of the adsorbable total) and have Ds and kf or DL. `rtol`/`atol` of its own integration
   * (default FIXED_BED_TOLERANCES); `stepTimes` replays the steps of an earlier outlet (results smooth in the
   * target's parameters, for difference quotients).
   * @throws InputError for a target that is not a trace or lacks inputs; ComputationError when the integration fails
   */
  outlet(target: FixedBedComponent, options?: { rtol?: number; atol?: number; traceFraction?: number; stepTimes?: readonly number[] }): TraceOutlet;
  /** Everything `outlet` needs, as plain data (e.g. for a worker thread): traceBedFromData rebuilds it. */
  data(): TraceBedData;
}

/** A TraceBed as plain data (structured-cloneable). */
export interface TraceBedData {
  bed: FixedBedSpec;
  grid: { cells: number; interiorPoints: number };
  /** Output bed volumes, 0 first. */
  bedVolumes: number[];
  history: BedBackgroundHistoryData;
  /** Adsorbable feed total of the background, mg/L (for the trace check). */
  backgroundTotalMgPerL: number;
  tolerances: { rtol: number; atol: number };
}

/** The TraceBed of `data` (outlets equal to those of the TraceBed that gave it). */
export function traceBedFromData(data: TraceBedData): TraceBed {
  return storedTraceBed(data.bed, data.grid, data.bedVolumes, bedBackgroundHistory(data.history), data.backgroundTotalMgPerL, data.tolerances);
}

/** Solve the background of `input` (its components, none of them the targets) once; see TraceBed. */
export function traceBed(input: FixedBedInput, options: TraceBedOptions): TraceBed {
  const { bed } = input;
  checkBed(bed);
  checkComponents(input.components);
  const given = options.outputBedVolumes;
  given.forEach((b, k) => { if (!(b > 0) || !Number.isFinite(b) || (k > 0 && !(b > given[k - 1]!))) throw new InputError(`expected strictly increasing output bed volumes > 0; value ${b} at index ${k}`, { path: `outputBedVolumes[${k}]` }); });
  if (given.length === 0) throw new InputError('expected at least one output bed volume', { path: 'outputBedVolumes' });
  const bvs = [0, ...given];
  const ads = input.components.filter((c) => c.K > 0);
  if (ads.length === 0) throw new InputError('a stored background needs at least one adsorbable background component', { path: 'components' });
  ads.forEach((c) => { if (!(c.c0MgPerL > 0)) throw new InputError(`component "${c.id}": an adsorbable component needs a feed concentration c0 > 0`, { path: 'components' }); });
  const totalAds = ads.reduce((s, c) => s + c.c0MgPerL, 0);
  const films = filmCoefficients(ads, bed);
  const grid = { cells: options.cells ?? DEFAULT_FIXED_BED_GRID.cells, interiorPoints: options.interiorPoints ?? DEFAULT_FIXED_BED_GRID.interiorPoints };
  const tol = { rtol: options.rtol ?? FIXED_BED_TOLERANCES.rtol, atol: options.atol ?? FIXED_BED_TOLERANCES.atol };
  const { history } = solveBedBackground(ads.map((c, i) => componentScales(c, films[i]!.kfMPerS, bed)), bed.porosity, bed.particleDensityKgPerM3, grid, bvs, tol);
  return storedTraceBed(bed, grid, bvs, history, totalAds, tol);
}

/** The TraceBed of a stored background `history` (adsorbable feed total `backgroundTotalMgPerL`) on the output grid `bvs` (0 first). */
function storedTraceBed(bed: FixedBedSpec, grid: { cells: number; interiorPoints: number }, bvs: readonly number[], history: BedBackgroundHistory, backgroundTotalMgPerL: number, tol: { rtol: number; atol: number }): TraceBed {
  return {
    bedVolumes: bvs,
    background: history,
    outlet(target, opts = {}) {
      checkComponents([target]);
      if (!(target.K > 0) || !(target.c0MgPerL > 0)) throw new InputError(`target "${target.id}": expected an adsorbable target with c0 > 0`, { path: 'target' });
      const fraction = opts.traceFraction ?? 1e-3;
      if (!(target.c0MgPerL < fraction * (backgroundTotalMgPerL + target.c0MgPerL))) throw new InputError(`target "${target.id}" is not a trace against the background (c0 ${target.c0MgPerL} mg/L)`, { path: 'target.c0' });
      const kf = filmCoefficients([target], bed)[0]!.kfMPerS;
      const model = fixedBedModel([componentScales(target, kf, bed)], 0, bed.porosity, bed.particleDensityKgPerM3, grid, history);
      const res = integrateImplicit(model, 0, new Float64Array(model.size), bvs, { rtol: opts.rtol ?? tol.rtol, atol: opts.atol ?? tol.atol, ...(opts.stepTimes ? { stepTimes: opts.stepTimes } : {}) });
      let massErr = 0;
      const cOverC0 = res.states.map((y, k) => {
        if (k > 0) massErr = Math.max(massErr, Math.abs(bvs[k]! - y[model.outflowIndex(0)]! - model.held(y, 0)) / bvs[k]!);
        return model.outlet(y, 0);
      });
      return { cOverC0, massBalanceError: massErr, stats: res.stats, stepTimes: res.stepTimes };
    },
    data: () => ({ bed: { ...bed }, grid: { ...grid }, bedVolumes: [...bvs], history: history.data(), backgroundTotalMgPerL, tolerances: { ...tol } }),
  };
}

/** Evenly spaced bed volumes from 0 to `toBv`, with 30 log-spaced ones from 1 BV below the first step. */
function outputGrid(toBv: number, points: number): number[] {
  const even = Array.from({ length: points }, (_, k) => (toBv * k) / (points - 1));
  const first = even[1]!;
  if (!(first > 2)) return even;
  const early = Array.from({ length: 30 }, (_, k) => Math.exp((Math.log(first) * k) / 30)); // 1 BV … first
  return [0, ...early, ...even.slice(1)];
}
