/**
 * A sampled breakthrough curve of one compound: c/c0 at the outlet of one filter against the bed
 * volumes it has treated (BV = t/EBCT), with linear interpolation between samples.
 *
 * The first sample may start after 0; before it the filter is taken as clean (c/c0 of the first
 * sample is held back to BV 0 only when it is 0). Beyond the last sample there is no value: the
 * caller must simulate long enough. Used by the staggered-filter blend and the run-length search.
 * @throws InputError when the arrays differ in length, are empty, the bed volumes are not
 *   strictly increasing from ≥ 0, or a c/c0 is not finite
 */
import { ComputationError, InputError } from '../core/errors.js';

export interface BreakthroughCurve {
  /** Bed volumes treated, strictly increasing, ≥ 0. */
  bedVolumes: readonly number[];
  /** Outlet c/c0 at each bed volume. */
  cOverC0: readonly number[];
}

/** Check a curve's arrays (see the file comment). */
export function checkCurve(curve: BreakthroughCurve, what = 'curve'): void {
  const { bedVolumes: bv, cOverC0: c } = curve;
  if (bv.length === 0 || bv.length !== c.length) throw new InputError(`expected equally long, non-empty bed-volume and c/c0 arrays (${bv.length} and ${c.length})`, { path: what });
  for (let i = 0; i < bv.length; i++) {
    if (!Number.isFinite(bv[i]!) || bv[i]! < 0 || (i > 0 && !(bv[i]! > bv[i - 1]!))) throw new InputError(`expected strictly increasing bed volumes ≥ 0; value ${bv[i]} at index ${i}`, { path: `${what}.bedVolumes[${i}]` });
    if (!Number.isFinite(c[i]!)) throw new InputError(`expected a finite c/c0, got ${c[i]}`, { path: `${what}.cOverC0[${i}]` });
  }
}

/** Last bed volume of the curve. */
export function curveEnd(curve: BreakthroughCurve): number {
  return curve.bedVolumes[curve.bedVolumes.length - 1]!;
}

/**
 * c/c0 at `bedVolumes` by linear interpolation. Before the first sample the value rises linearly
 * from 0 at BV 0 (a clean bed releases nothing at BV 0).
 * @throws ComputationError beyond the last sample (the run was not simulated that far)
 */
export function curveAt(curve: BreakthroughCurve, bedVolumes: number): number {
  const bv = curve.bedVolumes, c = curve.cOverC0;
  const n = bv.length;
  if (bedVolumes > bv[n - 1]! * (1 + 1e-12)) throw new ComputationError(`the breakthrough curve ends at ${bv[n - 1]} bed volumes; ${bedVolumes} were asked for (simulate a longer run)`);
  if (bedVolumes <= bv[0]!) return bv[0]! > 0 ? (c[0]! * Math.max(0, bedVolumes)) / bv[0]! : c[0]!;
  let lo = 0, hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (bv[mid]! <= bedVolumes) lo = mid; else hi = mid;
  }
  const w = (bedVolumes - bv[lo]!) / (bv[hi]! - bv[lo]!);
  return (1 - w) * c[lo]! + w * c[hi]!;
}

/** ∫₀^T c/c0 dBV by the trapezoidal rule on the samples (and the linear start), T ≤ the curve's end. */
export function curveIntegral(curve: BreakthroughCurve, toBedVolumes: number): number {
  const bv = curve.bedVolumes, c = curve.cOverC0;
  let s = 0;
  let prevX = 0, prevY = curveAt(curve, 0);
  for (let i = 0; i < bv.length && bv[i]! < toBedVolumes; i++) {
    if (bv[i]! <= 0) { prevY = c[i]!; continue; }
    s += 0.5 * (prevY + c[i]!) * (bv[i]! - prevX);
    prevX = bv[i]!; prevY = c[i]!;
  }
  const yEnd = curveAt(curve, toBedVolumes);
  s += 0.5 * (prevY + yEnd) * (toBedVolumes - prevX);
  return s;
}

/**
 * First bed volume at which the curve reaches `level` (linear interpolation between samples), or
 * null when it stays below within the curve.
 */
export function firstCrossing(curve: BreakthroughCurve, level: number): number | null {
  const bv = curve.bedVolumes, c = curve.cOverC0;
  let prevX = 0, prevY = curveAt(curve, 0);
  if (prevY >= level) return 0;
  for (let i = 0; i < bv.length; i++) {
    if (c[i]! >= level) {
      if (c[i]! === prevY) return bv[i]!;
      return prevX + ((level - prevY) / (c[i]! - prevY)) * (bv[i]! - prevX);
    }
    prevX = bv[i]!; prevY = c[i]!;
  }
  return null;
}
