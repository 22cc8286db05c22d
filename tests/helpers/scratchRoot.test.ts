/**
 * The run's temporary folders live under one folder of the run (tests/helpers/scratchRoot.ts,
 * vitest's global setup), which is removed when the run ends: the worker and the processes it
 * spawns see it as their temporary folder.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { tmpdir } from 'node:os';
import { basename, dirname } from 'node:path';

describe('the run’s temporary folder', () => {
  it('is one folder of this run (sorbshare-tests-*), seen by the worker and by a spawned process', () => {
    expect(basename(tmpdir())).toMatch(/^sorbshare-tests-/);
    const child = spawnSync(process.execPath, ['-e', 'process.stdout.write(require("node:os").tmpdir())'], { encoding: 'utf8' });
    expect(child.stdout).toBe(tmpdir());
    expect(dirname(tmpdir())).not.toBe(tmpdir());
  });
});
