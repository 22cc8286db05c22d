import { afterEach, describe, expect, it, vi } from 'vitest';
import { progressPrinter } from '../../src/cli/commands/projectRun.js';

// Common practice (no source): a progress line appears only once a step has run for more than a second.
describe('progress on stderr', () => {
  afterEach(() => vi.restoreAllMocks());

  it('prints nothing for short steps and a line once a step passes one second', () => {
    let now = 0;
    vi.spyOn(Date, 'now').mockImplementation(() => now);
    const err: string[] = [];
    const p = progressPrinter({ out: () => undefined, err: (t) => err.push(t), isTTY: false });
    p.onProgress({ step: 'a', done: 0, total: 10 });
    now = 500; p.onProgress({ step: 'a', done: 5, total: 10 });
    expect(err).toEqual([]);
    now = 600; p.onProgress({ step: 'b', done: 0, total: 365 });
    now = 1700; p.onProgress({ step: 'b', done: 180, total: 365 });
    now = 1800; p.onProgress({ step: 'b', done: 190, total: 365 }); // within 0.5 s of the last line
    now = 2300; p.onProgress({ step: 'b', done: 300, total: 365 });
    p.done();
    expect(err).toEqual(['sorbshare: b … 180/365\n', 'sorbshare: b … 300/365\n']);
  });
});
