/**
 * The machine's idle CPU time (ms, summed over its cores, from os.cpus()) with the time of the
 * reading, and the reading taken when this module was first loaded: the CLI loads it at start-up
 * (src/cli/main.ts), so that a later reading tells how busy the machine was meanwhile (used only
 * to decide whether to start a worker thread; never for a result).
 */
import { cpus } from 'node:os';

export interface IdleReading {
  /** performance.now() of the reading, ms. */
  atMs: number;
  /** Idle time of all cores so far, ms. */
  idleMs: number;
}

/** A reading now. */
export function idleReading(): IdleReading {
  let idleMs = 0;
  for (const c of cpus()) idleMs += c.times.idle;
  return { atMs: performance.now(), idleMs };
}

/** The reading when this module was first loaded. */
export const firstIdleReading: IdleReading = idleReading();
