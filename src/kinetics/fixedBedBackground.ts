/**
 * The background of a fixed bed solved once, for the trace targets: the background components
 * (e.g. the fictive DOC components) alone in the fixed-bed model (src/kinetics/fixedBedModel.ts),
 * with their surface state stored at every accepted step of the integrator, so that each trace
 * target can then be integrated on its own against the stored history.
 *
 * Why this is exact up to the integrators' tolerances: a trace target enters neither ψ_B nor Q_B
 * (the trace form, Knappe et al. 1998, Environ. Sci. Technol. 32:1694, from memory; see
 * src/kinetics/reverseIast.ts), so the background does not depend on the targets, and a target
 * depends on the background only through κ_T = c°_T(ψ_B)/Q_B at the grain surface of each cell.
 * ψ_B = Σ q_b/β_b and Q_B = Σ q_b are linear in the background surface loadings, so they are stored
 * per cell with their time derivatives (from the model's right-hand side) and interpolated by the
 * cubic Hermite polynomial between steps (third order, as the TR-BDF2 steps that made them;
 * clamped at zero). A target's Ds, kf, K or 1/n then change only its own small system: the column
 * fit and the draws of a Monte Carlo solve the background once.
 *
 * Units: time in bed volumes τ = t/EBCT; ψ_B and Q_B mg/g.
 * @throws ComputationError when the background's integration fails (from the integrator)
 */
import { ComputationError } from '../core/errors.js';
import { fixedBedModel, type BedComponentScales, type BedGrid, type BedModel } from './fixedBedModel.js';
import { integrateImplicit, type IntegrationResult, type IntegratorOptions } from './implicitIntegrator.js';
import type { ReverseIastState, SurfaceIsotherms } from './reverseIast.js';

export interface BedBackgroundHistory {
  /** Freundlich K and β of the background components (for κ_T). */
  readonly iso: SurfaceIsotherms;
  /** Axial cells of the model that made it. */
  readonly cells: number;
  /** Last stored time, bed volumes (grows while a solve in segments goes on). */
  readonly toBedVolumes: number;
  /** Number of stored steps (the start included). */
  readonly steps: number;
  /** ψ_B and Q_B of the surface phase in cell j at time τ (0 ≤ τ ≤ toBedVolumes), written into `out`. */
  surfaceAt(tau: number, j: number, out: ReverseIastState): ReverseIastState;
  /** The stored values as plain data (copies), e.g. for a worker thread: bedBackgroundHistory(data) rebuilds it. */
  data(): BedBackgroundHistoryData;
}

/** A stored background as plain data (structured-cloneable). */
export interface BedBackgroundHistoryData {
  iso: { K: Float64Array; beta: Float64Array };
  cells: number;
  /** Stored times, bed volumes. */
  times: Float64Array;
  /** Per stored time and cell: ψ, Q, dψ/dτ, dQ/dτ (4·cells values per time). */
  values: Float64Array;
}

/** The history of `data` (the same interpolation as the stored one). */
export function bedBackgroundHistory(data: BedBackgroundHistoryData): BedBackgroundHistory {
  const n = 4 * data.cells;
  return storedHistory(data.iso, data.cells, Array.from(data.times), Array.from(data.times, (_, k) => data.values.subarray(k * n, (k + 1) * n)));
}

/** The history over `times` and `chunks` (live arrays: a solve in progress may still append to them). */
function storedHistory(iso: SurfaceIsotherms, Nz: number, times: number[], chunks: Float64Array[]): BedBackgroundHistory {
  let k = 0; // interval [times[k], times[k+1]] of the last query (queries mostly move forward)
  return {
    iso,
    cells: Nz,
    get toBedVolumes() { return times.length > 0 ? times[times.length - 1]! : 0; },
    get steps() { return times.length; },
    surfaceAt(tau, j, out) {
      const end = times.length > 0 ? times[times.length - 1]! : 0;
      if (times.length === 0 || !(tau >= 0 && tau <= end * (1 + 1e-12))) throw new ComputationError(`fixed bed: the stored background covers 0–${end} bed volumes, asked at ${tau}`);
      if (times.length === 1) { out.psi = chunks[0]![4 * j]!; out.total = chunks[0]![4 * j + 1]!; return out; }
      if (!(k + 1 < times.length && times[k]! <= tau && tau <= times[k + 1]!)) {
        let lo = 0, hi = times.length - 1; // times[lo] ≤ τ ≤ times[hi]
        while (hi - lo > 1) { const mid = (lo + hi) >> 1; if (times[mid]! <= tau) lo = mid; else hi = mid; }
        k = lo;
      }
      const t0 = times[k]!, h = times[k + 1]! - t0;
      const s = Math.min(1, Math.max(0, (tau - t0) / h));
      const s2 = s * s, s3 = s2 * s;
      const h00 = 2 * s3 - 3 * s2 + 1, h10 = s3 - 2 * s2 + s, h01 = -2 * s3 + 3 * s2, h11 = s3 - s2;
      const a = chunks[k]!, b = chunks[k + 1]!;
      const o = 4 * j;
      out.psi = Math.max(0, h00 * a[o]! + h10 * h * a[o + 2]! + h01 * b[o]! + h11 * h * b[o + 2]!);
      out.total = Math.max(0, h00 * a[o + 1]! + h10 * h * a[o + 3]! + h01 * b[o + 1]! + h11 * h * b[o + 3]!);
      return out;
    },
    data() {
      const n = 4 * Nz;
      const values = new Float64Array(times.length * n);
      chunks.forEach((c, i) => values.set(c, i * n));
      return { iso: { K: Float64Array.from(iso.K), beta: Float64Array.from(iso.beta) }, cells: Nz, times: Float64Array.from(times), values };
    },
  };
}

export interface SolvedBedBackground {
  history: BedBackgroundHistory;
  /** The background model and its integration (states at the output times), for outlets and mass balances. */
  model: BedModel;
  integration: IntegrationResult;
}

/** The background model with a history that stores every accepted step handed to `onStep`. */
export interface StoringBedBackground {
  model: BedModel;
  history: BedBackgroundHistory;
  /** The integrator's onStep: stores ψ_B, Q_B and their time derivatives per cell (a step at the last stored time replaces it). */
  onStep: (t: number, y: Float64Array, dydt: Float64Array) => void;
}

/**
 * The background components alone (all of them background, none trace) in the fixed-bed model,
 * with an empty history that `onStep` fills; an integration may go on in segments (the history
 * grows with each), see the file comment.
 */
export function storingBedBackground(components: readonly BedComponentScales[], porosity: number, particleDensityGPerL: number, grid: BedGrid): StoringBedBackground {
  const nb = components.length;
  if (nb < 1) throw new ComputationError('fixed bed: a stored background needs at least one background component');
  const model = fixedBedModel(components, nb, porosity, particleDensityGPerL, grid);
  const Nz = grid.cells;
  const P = model.perComponent, S = model.perCell, N = P - 2;
  const qRef = components.map((c) => c.qRefMgPerG);
  const beta = components.map((c) => c.beta);
  const times: number[] = [];
  // per step and cell: ψ, Q, dψ/dτ, dQ/dτ
  const chunks: Float64Array[] = [];
  const onStep = (t: number, y: Float64Array, f: Float64Array): void => {
    const v = new Float64Array(4 * Nz);
    for (let j = 0; j < Nz; j++) {
      let psi = 0, total = 0, dPsi = 0, dTotal = 0;
      for (let b = 0; b < nb; b++) {
        const o = j * S + b * P + 1 + N;
        const q = qRef[b]! * y[o]!;
        if (!(q > 0)) continue; // negative loadings (rounding) count as zero, as in reverse IAST
        const dq = qRef[b]! * f[o]!;
        psi += q / beta[b]!; total += q;
        dPsi += dq / beta[b]!; dTotal += dq;
      }
      v[4 * j] = psi; v[4 * j + 1] = total; v[4 * j + 2] = dPsi; v[4 * j + 3] = dTotal;
    }
    if (times.length > 0 && !(t > times[times.length - 1]!)) { chunks[chunks.length - 1] = v; return; }
    times.push(t);
    chunks.push(v);
  };
  const history = storedHistory({ K: Float64Array.from(components, (c) => c.K), beta: Float64Array.from(beta) }, Nz, times, chunks);
  return { model, history, onStep };
}

/**
 * Solve the background components alone (all of them background, none trace) to the last output
 * time and store their surface history; see the file comment.
 */
export function solveBedBackground(components: readonly BedComponentScales[], porosity: number, particleDensityGPerL: number, grid: BedGrid, outputBedVolumes: readonly number[], tolerances: IntegratorOptions): SolvedBedBackground {
  const { model, history, onStep } = storingBedBackground(components, porosity, particleDensityGPerL, grid);
  const integration = integrateImplicit(model, 0, new Float64Array(model.size), outputBedVolumes, { ...tolerances, onStep });
  return { history, model, integration };
}
