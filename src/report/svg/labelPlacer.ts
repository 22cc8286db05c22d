/**
 * Greedy placement of text labels without overlap: each label offers candidate boxes in order of
 * preference and takes the first that overlaps nothing already taken (common practice in
 * plotting). Other labels are hard obstacles; data are soft ones (avoided when possible), kept
 * in a coarse occupancy grid so thousands of data points cost little.
 */

export interface Box {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Whether two boxes overlap (touching edges do not count). */
export function boxesOverlap(a: Box, b: Box): boolean {
  return a.x < b.x + b.w && b.x < a.x + a.w && a.y < b.y + b.h && b.y < a.y + a.h;
}

/** Grid cell size of the data occupancy map, SVG units. */
const CELL = 4;

export class LabelPlacer {
  private readonly hard: Box[] = [];
  private readonly cols: number;
  private readonly rows: number;
  private readonly soft: Uint8Array;

  /** A placer for an SVG of `width` × `height` units. */
  constructor(width: number, height: number) {
    this.cols = Math.max(1, Math.ceil(width / CELL));
    this.rows = Math.max(1, Math.ceil(height / CELL));
    this.soft = new Uint8Array(this.cols * this.rows);
  }

  /** Mark a region as occupied: `soft` regions (data) are avoided only when a free spot exists. */
  reserve(box: Box, soft = false): void {
    if (!soft) {
      this.hard.push(box);
      return;
    }
    const [c0, c1, r0, r1] = this.span(box);
    for (let r = r0; r <= r1; r++) for (let i = r * this.cols + c0, end = r * this.cols + c1; i <= end; i++) this.soft[i] = 1;
  }

  /** Mark the cells around one data point (x, y) as soft. */
  reservePoint(x: number, y: number): void {
    const c0 = Math.max(0, Math.floor((x - 4) / CELL));
    const c1 = Math.min(this.cols - 1, Math.floor((x + 4) / CELL));
    const r0 = Math.max(0, Math.floor((y - 4) / CELL));
    const r1 = Math.min(this.rows - 1, Math.floor((y + 4) / CELL));
    for (let r = r0; r <= r1; r++) for (let i = r * this.cols + c0, end = r * this.cols + c1; i <= end; i++) this.soft[i] = 1;
  }

  /** Mark the straight segment between two points as soft (data line), sampled every cell. */
  reserveSegment(x0: number, y0: number, x1: number, y1: number): void {
    const dx = x1 - x0;
    const dy = y1 - y0;
    const n = Math.min(400, Math.ceil(Math.sqrt(dx * dx + dy * dy) / CELL));
    for (let k = 0; k <= n; k++) {
      const f = n === 0 ? 0 : k / n;
      const c = Math.floor((x0 + dx * f) / CELL);
      const r = Math.floor((y0 + dy * f) / CELL);
      if (c >= 0 && c < this.cols && r >= 0 && r < this.rows) this.soft[r * this.cols + c] = 1;
    }
  }

  /** Cell range [c0, c1, r0, r1] of a box, clamped to the grid. */
  private span(b: Box): [number, number, number, number] {
    const clampC = (v: number) => Math.min(this.cols - 1, Math.max(0, v));
    const clampR = (v: number) => Math.min(this.rows - 1, Math.max(0, v));
    return [clampC(Math.floor(b.x / CELL)), clampC(Math.floor((b.x + b.w) / CELL)), clampR(Math.floor(b.y / CELL)), clampR(Math.floor((b.y + b.h) / CELL))];
  }

  /** Number of occupied data cells under `box` (stops counting at `stopAt`). */
  private softHits(box: Box, stopAt = Infinity): number {
    const [c0, c1, r0, r1] = this.span(box);
    let n = 0;
    for (let r = r0; r <= r1; r++) {
      for (let i = r * this.cols + c0, end = r * this.cols + c1; i <= end; i++) if (this.soft[i] && ++n >= stopAt) return n;
    }
    return n;
  }

  /**
   * Index of the chosen candidate: the first inside `bounds` that overlaps nothing; else, of those
   * inside `bounds` that overlap no other label, the one covering the least data; else the first
   * candidate (a label is never dropped). The chosen box is reserved as a label.
   */
  place(candidates: Box[], bounds?: Box): number {
    const fits = (b: Box) =>
      !bounds || (b.x >= bounds.x - 0.5 && b.y >= bounds.y - 0.5 && b.x + b.w <= bounds.x + bounds.w + 0.5 && b.y + b.h <= bounds.y + bounds.h + 0.5);
    const freeOfLabels = (b: Box) => !this.hard.some((t) => boxesOverlap(b, t));
    let idx = candidates.findIndex((c) => fits(c) && freeOfLabels(c) && this.softHits(c, 1) === 0);
    if (idx < 0) {
      let best = Infinity;
      candidates.forEach((c, i) => {
        if (!fits(c) || !freeOfLabels(c)) return;
        const n = this.softHits(c, best);
        if (n < best) (best = n), (idx = i);
      });
    }
    if (idx < 0) idx = 0;
    const chosen = candidates[idx];
    if (chosen) this.hard.push(chosen);
    return idx;
  }
}
