/**
 * A progress indicator for long runs (Monte Carlo), written to standard error only.
 *
 * On a terminal it redraws one line in place (carriage return, at most every `minIntervalMs`);
 * otherwise (a log file, CI) it prints an occasional plain line at each quarter, so logs stay
 * short. It never writes to stdout: pass `ctx.err` and `ctx.isTTY` from the command context.
 *
 *   const bar = createProgressBar({ total: draws, label: 'Monte Carlo', write: ctx.err, isTTY: ctx.isTTY });
 *   monteCarlo(problem, { draws, seed, onProgress: (done) => bar.update(done) });
 *   bar.finish();
 */

export interface ProgressBarOptions {
  total: number;
  label: string;
  /** Where to write (standard error). */
  write: (text: string) => void;
  /** True on a terminal: redraw in place. */
  isTTY: boolean;
  /** Bar width in characters (default 30). */
  width?: number;
  /** Minimum time between redraws on a terminal, ms (default 100). */
  minIntervalMs?: number;
  /** Clock, ms (default performance.now; injectable for tests). */
  now?: () => number;
}

export interface ProgressBar {
  update(done: number): void;
  /** Draw 100 % (if not yet) and end the line. Safe to call twice. */
  finish(): void;
}

export function createProgressBar(o: ProgressBarOptions): ProgressBar {
  const total = Math.max(1, o.total);
  const width = o.width ?? 30;
  const minInterval = o.minIntervalMs ?? 100;
  const now = o.now ?? (() => performance.now());
  let lastDraw = -Infinity;
  let lastQuarter = 0;
  let done = 0;
  let finished = false;
  const line = (d: number) => {
    const f = Math.min(1, Math.max(0, d / total));
    const full = Math.round(f * width);
    return `${o.label} [${'#'.repeat(full)}${'.'.repeat(width - full)}] ${Math.floor(f * 100).toString().padStart(3)} % ${d}/${o.total}`;
  };
  return {
    update(d: number) {
      if (finished) return;
      done = Math.min(d, total);
      if (o.isTTY) {
        const t = now();
        if (t - lastDraw >= minInterval || done >= total) {
          o.write(`\r${line(done)}`);
          lastDraw = t;
        }
      } else {
        const quarter = Math.floor((done / total) * 4);
        if (quarter > lastQuarter) {
          lastQuarter = quarter;
          o.write(`${line(done)}\n`);
        }
      }
    },
    finish() {
      if (finished) return;
      if (o.isTTY) o.write(`\r${line(total)}\n`);
      else if (lastQuarter < 4) o.write(`${line(total)}\n`);
      finished = true;
      void done;
    },
  };
}
