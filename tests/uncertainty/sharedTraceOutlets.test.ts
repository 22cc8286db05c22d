/**
 * Trace outlets shared with a worker thread (src/uncertainty/sharedTraceOutlets.ts): the outlets
 * computed on the worker, from the stored background handed over as plain data, equal those of
 * this thread bit for bit (each outlet is a pure function of its target; no source values, the
 * model against itself), and a target the trace shortcut refuses is an InputError from either
 * thread. Invented bed and water (tests/kinetics/fixedBedCases.ts), on a coarse grid.
 */
import { describe, expect, it } from 'vitest';
import { availableParallelism } from 'node:os';
import { traceBed, traceBedFromData } from '../../src/kinetics/fixedBed.js';
import { sharedTraceOutlets, SHARED_MIN_TARGETS_STARTED, startTraceOutletWorker } from '../../src/uncertainty/sharedTraceOutlets.js';
import { InputError } from '../../src/core/errors.js';
import { BED, TARGET, background } from '../kinetics/fixedBedCases.js';

describe('trace outlets shared with a worker thread', () => {
  const bvs = Array.from({ length: 12 }, (_, k) => 2500 * (k + 1));
  const tb = traceBed({ components: background(4), bed: BED }, { outputBedVolumes: bvs, cells: 20, interiorPoints: 3 });
  const targets = [TARGET, { ...TARGET, id: 'T2', K: 60, dsM2PerS: 3e-14 }, { ...TARGET, id: 'T3', oneOverN: 0.4 }];

  it('the stored background as data gives the same outlets; the worker\'s outlets equal this thread\'s', async () => {
    const here = targets.map((t) => tb.outlet(t).cOverC0);
    const copy = traceBedFromData(structuredClone(tb.data()));
    targets.forEach((t, i) => expect(copy.outlet(t).cOverC0).toEqual(here[i]));
    const shared = sharedTraceOutlets(tb, targets, { workerOnly: true });
    const out = await shared.finish();
    expect(out).toEqual(here);
    expect(shared.workers).toBe(availableParallelism() >= 2 ? 1 : 0); // a worker file exists from the sources too (tsx)
    if (shared.workers === 1) expect(shared.byWorker).toBe(targets.length);
    const inThread = sharedTraceOutlets(tb, targets, { workers: 0 });
    expect(inThread.workers).toBe(0);
    expect(await inThread.finish()).toEqual(here);
  }, 60_000);

  it('a worker started ahead of its work gives the same outlets; it serves one run, and one never taken is released', async () => {
    const here = targets.map((t) => tb.outlet(t).cOverC0);
    const started = startTraceOutletWorker();
    expect(started === undefined).toBe(availableParallelism() < 2);
    const shared = sharedTraceOutlets(tb, targets, { workerOnly: true, ...(started ? { started } : {}) });
    expect(shared.workers).toBe(started ? 1 : 0);
    expect(await shared.finish()).toEqual(here);
    if (started) {
      expect(shared.byWorker).toBe(targets.length);
      expect(started.taken).toBe(true);
      // taken: a second run starts no worker from it (fewer targets than SHARED_MIN_TARGETS), and the outlets are the same
      const again = sharedTraceOutlets(tb, targets, { started });
      expect(again.workers).toBe(0);
      expect(await again.finish()).toEqual(here);
    }
    // below SHARED_MIN_TARGETS_STARTED targets a started worker is not used, and release ends it
    const unused = startTraceOutletWorker();
    expect(targets.length).toBeLessThan(SHARED_MIN_TARGETS_STARTED);
    const alone = sharedTraceOutlets(tb, targets, { ...(unused ? { started: unused } : {}) });
    expect(alone.workers).toBe(0);
    expect(await alone.finish()).toEqual(here);
    if (unused) {
      expect(unused.taken).toBe(false);
      await unused.release();
      expect(unused.taken).toBe(true);
    }
  }, 60_000);

  it('a target that is not a trace is refused (InputError) from the worker as in this thread', async () => {
    const bad = [{ ...TARGET, c0MgPerL: 0.5 }, TARGET];
    await expect(sharedTraceOutlets(tb, bad, { workerOnly: true }).finish()).rejects.toThrow(InputError);
    await expect(sharedTraceOutlets(tb, bad, { workers: 0 }).finish()).rejects.toThrow(InputError);
  }, 60_000);
});
