/**
 * The dose at which a trace target reaches its removal goal, on solves shared with the other
 * targets of its background (sharedBackground.ts): every dose already solved for any target of
 * the group is a free point of this target's curve too.
 *
 * Works on x = ln D and the log-odds of removal y = ln((1 − c/c0)/(c/c0)), increasing in x. In
 * the stirred reactor c/c0 = 1/(1 + D·Φ_T) gives y = ln D + ln Φ_T with Φ_T varying slowly
 * with D, so y is nearly linear in x with slope 1 (ours; it holds roughly for plug flow too).
 * Each step is a secant through the two solved points nearest the goal in y (from a single
 * point the slope that came with the start, e.g. that of the same target at a nearby DOC, else 1),
 * at most 3 in ln D beyond the points, kept inside the bracket once the goal is
 * bracketed and replaced by bisection when the nearest point's distance to the goal in y does not
 * halve in two steps (the safeguard
 * of Brent 1973, simplified). It stops at |c/c0 − (1 − R)| ≤ tolerance.
 *
 * Units: dose g/L.
 * Returns undefined (the caller then runs the design layer's dose search, which gives the status)
 * when the goal is not met between D_min and D_max, or not reached within 24 solves.
 */
import { MAX_DOSE_G_PER_L, MIN_DOSE_G_PER_L } from '../design/doseSearch.js';

export interface TraceDoseRoot {
  doseGPerL: number;
  /** c/c0 at that dose (within the tolerance of 1 − R). */
  remainingFraction: number;
  /** d ln(c/c0)/d ln D from the two solved points nearest the goal (undefined from one point). */
  slope?: number;
  /** New solves made for this root. */
  solves: number;
}

/** Largest number of new solves for one root (ours). */
const MAX_SOLVES = 24;
/** Largest step in ln D beyond the solved points (ours: a factor e³ ≈ 20 in dose). */
const MAX_STEP = 3;

interface Point { x: number; r: number; y: number }

/**
 * @param remainingAt c/c0 of the target at a dose (g/L); remembered by the caller
 * @param known       doses (g/L) already solved, with the target's c/c0 there
 * @param removalFraction the goal R, 0 < R < 1
 * @param tolerance   |c/c0 − (1 − R)| accepted
 * @param start       the first dose to solve when nothing is known, g/L (asked only then), with
 *                    the slope dy/d ln D to take from a single point when it knows one
 * @param guess       a predicted root with its slope (e.g. the same target's root at a nearby DOC
 *                    or under nearby conditions), asked when points are known but none meets the
 *                    goal: solved first (inside the bracket), and the next step taken from it with
 *                    that slope rather than a secant to a far point
 */
export function traceDoseRoot(remainingAt: (doseGPerL: number) => number, known: Iterable<readonly [number, number]>, removalFraction: number, tolerance: number, start: () => number | { doseGPerL: number; slope?: number }, guess?: () => { doseGPerL: number; slope: number } | undefined): TraceDoseRoot | undefined {
  if (!(removalFraction > 0 && removalFraction < 1)) return undefined;
  const rGoal = 1 - removalFraction;
  // aim half the tolerance past the goal and accept only doses that meet it (c/c0 ≤ 1 − R): a
  // caller checking the goal at the dose found (the design layer's dose table) finds it met
  const tol = Math.min(tolerance, 0.5 * rGoal);
  const rAim = rGoal - 0.5 * tol;
  const yGoal = Math.log((1 - rAim) / rAim);
  const accepted = (r: number) => r <= rGoal && r >= rGoal - tol;
  const xMin = Math.log(MIN_DOSE_G_PER_L);
  const xMax = Math.log(MAX_DOSE_G_PER_L);
  const pts: Point[] = [];
  for (const [d, r] of known) if (d >= MIN_DOSE_G_PER_L && d <= MAX_DOSE_G_PER_L) pts.push({ x: Math.log(d), r, y: logOdds(r) });
  let solves = 0;
  let singleSlope = 1;
  let guessed: { x: number; slope: number } | undefined; // the guess solved, while it is the nearest point
  let lastResidual = Infinity;
  let olderResidual = Infinity;
  for (;;) {
    let best: Point | undefined;
    for (const p of pts) if (accepted(p.r) && (!best || Math.abs(p.r - rAim) < Math.abs(best.r - rAim))) best = p;
    if (best) return { doseGPerL: Math.exp(best.x), remainingFraction: best.r, ...slopeAt(best, pts, yGoal), solves };
    if (solves >= MAX_SOLVES) return undefined;
    let lo: Point | undefined, hi: Point | undefined;
    for (const p of pts) {
      if (p.y < yGoal) { if (!lo || p.x > lo.x) lo = p; } else if (!hi || p.x < hi.x) hi = p;
    }
    if (lo && lo.x >= xMax) return undefined; // not met at D_max
    if (hi && hi.x <= xMin) return undefined; // met at D_min
    const finite = pts.filter((p) => Number.isFinite(p.y)).sort((a, b) => Math.abs(a.y - yGoal) - Math.abs(b.y - yGoal));
    const p1 = finite[0];
    let x: number;
    const g = solves === 0 && p1 && guess ? guess() : undefined;
    if (g && g.doseGPerL > 0 && Number.isFinite(g.doseGPerL) && g.slope > 0 && Number.isFinite(g.slope) && (!lo || Math.log(g.doseGPerL) > lo.x) && (!hi || Math.log(g.doseGPerL) < hi.x)) {
      x = Math.log(g.doseGPerL);
      guessed = { x, slope: g.slope };
    } else if (p1 && guessed && p1.x === guessed.x) {
      x = p1.x + (yGoal - p1.y) / guessed.slope;
      x = Math.min(p1.x + MAX_STEP, Math.max(p1.x - MAX_STEP, x));
    } else if (!p1) {
      if (lo) x = lo.x + MAX_STEP;
      else if (hi) x = hi.x - MAX_STEP;
      else {
        const st = start();
        if (typeof st === 'number') x = Math.log(st);
        else { x = Math.log(st.doseGPerL); if (st.slope !== undefined && st.slope > 0 && Number.isFinite(st.slope)) singleSlope = st.slope; }
      }
    } else {
      const p2 = finite.find((p) => Math.abs(p.x - p1.x) > 1e-12);
      const s = p2 ? (p1.y - p2.y) / (p1.x - p2.x) : singleSlope;
      x = p1.x + (yGoal - p1.y) / (s > 0 && Number.isFinite(s) ? s : 1);
      x = Math.min(p1.x + MAX_STEP, Math.max(p1.x - MAX_STEP, x));
    }
    const residual = p1 ? Math.abs(p1.y - yGoal) : Infinity;
    if (lo && hi) {
      if (hi.x - lo.x <= 1e-12) return undefined;
      if (!(x > lo.x && x < hi.x) || residual > 0.5 * olderResidual) x = 0.5 * (lo.x + hi.x);
    }
    olderResidual = lastResidual;
    lastResidual = residual;
    x = Math.min(xMax, Math.max(xMin, x));
    if (pts.some((p) => p.x === x)) return undefined; // no new dose to try
    const d = Math.exp(x);
    const r = remainingAt(d);
    solves++;
    pts.push({ x, r, y: logOdds(r) });
  }
}

/** The slope d ln(c/c0)/d ln D at `p` from its nearest other solved point (d ln r = −(1 − r)·dy). */
function slopeAt(p: Point, pts: readonly Point[], _yGoal: number): { slope?: number } {
  let q: Point | undefined;
  for (const o of pts) if (o !== p && Number.isFinite(o.y) && Math.abs(o.x - p.x) > 1e-12 && (!q || Math.abs(o.x - p.x) < Math.abs(q.x - p.x))) q = o;
  if (!q || !Number.isFinite(p.y)) return {};
  const s = -(1 - p.r) * ((p.y - q.y) / (p.x - q.x));
  return Number.isFinite(s) && s < 0 ? { slope: s } : {};
}

/** The log-odds of removal ln((1 − c/c0)/(c/c0)) at c/c0 = r (±Infinity at r = 0 or 1), in which the dose roots step. */
export function logOdds(r: number): number {
  return Math.log((1 - r) / r);
}
