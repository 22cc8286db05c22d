/**
 * Ticks for a logarithmic axis: decades labelled, with 2 and 5 as sub-ticks where they help
 * (common practice for log-scaled engineering plots). The domain is snapped outwards to the
 * 1–2–5 sequence so short ranges do not waste a whole decade.
 */
import { toSuperscript } from '../../output/formatNumber.js';
import type { Tick } from './linearTicks.js';

/** Exact decimal m·10^k (parsed from text, so 5·10^-7 is the double nearest 5e-7). */
function dec(m: number, k: number): number {
  return Number(`${m}e${k}`);
}

/** Largest 1–2–5 value ≤ v (v > 0). */
export function floorNice125(v: number): number {
  const k = Math.floor(Math.log10(v) + 1e-12);
  for (const m of [5, 2, 1]) if (dec(m, k) <= v * (1 + 1e-12)) return dec(m, k);
  return dec(5, k - 1);
}

/** Smallest 1–2–5 value ≥ v (v > 0). */
export function ceilNice125(v: number): number {
  const k = Math.floor(Math.log10(v) - 1e-12);
  for (const m of [1, 2, 5, 10]) if (dec(m, k) >= v * (1 - 1e-12)) return dec(m, k);
  return dec(2, k + 1);
}

/**
 * Domain of a log axis holding [min, max] (both > 0): snapped outwards to the 1–2–5 sequence;
 * a single value is widened to its neighbours in that sequence. Falls back to [1, 10] when the
 * input is not positive and finite.
 */
export function logDomain(min: number, max: number): [number, number] {
  let lo = Math.min(min, max);
  let hi = Math.max(min, max);
  if (!(lo > 0) || !Number.isFinite(hi)) return [1, 10];
  lo = floorNice125(lo);
  hi = ceilNice125(hi);
  if (lo === hi) {
    lo = floorNice125(lo * 0.999);
    hi = ceilNice125(hi * 1.001);
  }
  return [lo, hi];
}

/** Label of m·10^k: plain decimals between 0.001 and 99 999, else "10⁻⁵" or "2×10⁻⁵". */
export function formatLogLabel(m: number, k: number): string {
  const v = dec(m, k);
  if (v >= 1e-3 && v < 1e5) return String(v);
  const exp = toSuperscript(k);
  return m === 1 ? `10${exp}` : `${m}×10${exp}`;
}

/**
 * Ticks for a log axis over [lo, hi] (lo > 0). By span s = log10(hi/lo):
 * s < 0.7: 1…9 × 10^k all labelled; s ≤ 2.5: 1, 2, 5 labelled; s ≤ 8: decades labelled with
 * unlabelled 2 and 5 sub-ticks; wider: every j-th decade labelled (at most ~8 labels), other
 * decades unlabelled.
 */
export function logTicks(lo: number, hi: number): Tick[] {
  if (!(lo > 0) || !(hi > lo) || !Number.isFinite(hi)) return logTicks(1, 10);
  const span = Math.log10(hi / lo);
  const kLo = Math.floor(Math.log10(lo) + 1e-9);
  const kHi = Math.ceil(Math.log10(hi) - 1e-9);
  const inside = (v: number) => v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9);
  const ticks: Tick[] = [];
  const labelEvery = span > 8 ? Math.ceil(span / 8) : 1;
  for (let k = kLo; k <= kHi; k++) {
    const mults = span < 0.7 ? [1, 2, 3, 4, 5, 6, 7, 8, 9] : span <= 8 ? [1, 2, 5] : [1];
    for (const m of mults) {
      const v = dec(m, k);
      if (!inside(v)) continue;
      let labelled: boolean;
      if (span < 0.7 || span <= 2.5) labelled = true;
      else labelled = m === 1 && (((k % labelEvery) + labelEvery) % labelEvery === 0);
      ticks.push({ value: v, label: labelled ? formatLogLabel(m, k) : null, major: m === 1 || span <= 2.5 });
    }
  }
  return ticks;
}
