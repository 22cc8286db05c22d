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
import { sharedTraceOutlets } from '../../src/uncertainty/sharedTraceOutlets.js';
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

  it('a target that is not a trace is refused (InputError) from the worker as in this thread', async () => {
    const bad = [{ ...TARGET, c0MgPerL: 0.5 }, TARGET];
    await expect(sharedTraceOutlets(tb, bad, { workerOnly: true }).finish()).rejects.toThrow(InputError);
    await expect(sharedTraceOutlets(tb, bad, { workers: 0 }).finish()).rejects.toThrow(InputError);
  }, 60_000);
});
