/**
 * Nice tick values for a linear axis: Heckbert's "nice numbers" labelling (P. S. Heckbert,
 * "Nice numbers for graph labels", Graphics Gems, Academic Press 1990; from memory). The step is
 * 1, 2, 5 or 10 times a power of ten, chosen so that about `targetCount` ticks span the range.
 * Unlike Heckbert, the step is taken from the raw range (not a range first rounded up to a nice
 * number), which keeps closer to `targetCount` (0–60 gets steps of 10, not 20).
 */

export interface Tick {
  value: number;
  /** Text shown beside the tick; null for an unlabelled (minor) tick. */
  label: string | null;
  major: boolean;
}

export interface LinearAxisTicks {
  /** The axis range: widened outwards to whole steps ("loose"), or the fixed range as given. */
  domain: [number, number];
  step: number;
  ticks: Tick[];
}

/**
 * Nice number near `x` > 0 (Heckbert 1990): 1, 2, 5 or 10 × 10^k; rounded to the nearest when
 * `round`, else the smallest nice number ≥ x.
 */
export function niceNumber(x: number, round: boolean): number {
  const exp = Math.floor(Math.log10(x));
  const f = x / 10 ** exp;
  let nf: number;
  if (round) nf = f < 1.5 ? 1 : f < 3 ? 2 : f < 7 ? 5 : 10;
  else nf = f <= 1 ? 1 : f <= 2 ? 2 : f <= 5 ? 5 : 10;
  return Number(`${nf}e${exp}`);
}

/**
 * Ticks for a linear axis over [min, max] (any order; equal values are widened around the value).
 * With `fixed` the domain is exactly [min, max] and only ticks inside it are kept; otherwise the
 * domain is widened to whole steps. Non-finite input falls back to [0, 1].
 * Labels carry as many decimals as the step needs (Heckbert 1990: nfrac = max(−floor(log10 step), 0)).
 */
export function linearTicks(min: number, max: number, targetCount = 6, fixed = false): LinearAxisTicks {
  let lo = Math.min(min, max);
  let hi = Math.max(min, max);
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) [lo, hi] = [0, 1];
  if (hi === lo) {
    const pad = lo === 0 ? 1 : Math.abs(lo) * 0.1;
    lo -= pad;
    hi += pad;
  }
  const count = Math.max(2, Math.round(targetCount));
  const step = niceNumber((hi - lo) / (count - 1), true);
  const first = fixed ? Math.ceil(lo / step - 1e-9) : Math.floor(lo / step + 1e-9);
  const last = fixed ? Math.floor(hi / step + 1e-9) : Math.ceil(hi / step - 1e-9);
  const decimals = Math.max(0, -Math.floor(Math.log10(step)));
  const ticks: Tick[] = [];
  for (let k = first; k <= last; k++) {
    const value = Number((k * step).toFixed(Math.min(decimals, 20)));
    ticks.push({ value: value === 0 ? 0 : value, label: formatLinearLabel(value, decimals), major: true });
  }
  const domain: [number, number] = fixed ? [lo, hi] : [ticks[0]!.value, ticks[ticks.length - 1]!.value];
  return { domain, step, ticks };
}

/**
 * Tick label with `decimals` decimals; thousands grouped with commas from 10,000 (money and
 * masses on client figures); exponent notation for very large or tiny magnitudes.
 */
export function formatLinearLabel(value: number, decimals: number): string {
  if (value === 0) return '0';
  const a = Math.abs(value);
  if (a >= 1e12 || decimals > 6) return value.toExponential(2).replace(/\.?0+e/, 'e');
  if (a >= 1e4) return value.toLocaleString('en-US', { minimumFractionDigits: decimals, maximumFractionDigits: decimals }).replace('-', '−');
  return value.toFixed(decimals).replace('-', '−');
}
