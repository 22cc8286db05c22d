/**
 * One spawned `sorbshare demo --out DIR --json` (the project's own draws) per test worker, shared by
 * the test files that only read what it printed and wrote: the demo is the suite's longest run, and
 * several files used to make it again each. The first call spawns it (after the build check of
 * `runBin`); later calls in the same worker get the same result. Tests must not change the shared
 * folder (a test that needs to change an output folder makes its own run): each later call checks
 * that the folder still holds the same files with the same sizes and times, and fails naming the
 * change otherwise. The folder is removed when the worker process exits normally (a worker the
 * runner kills leaves it in the system temp folder, like the other tests' scratch folders).
 */
import { mkdtempSync, readdirSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runBin, type CliRun } from './cliHarness.js';

/** The spawned demo's exit code, stdout (the JSON summary) and stderr, and its output folder. */
export interface SharedDemoRun extends CliRun {
  outDir: string;
}

let shared: SharedDemoRun | undefined;
let fingerprint = '';

function folderFingerprint(dir: string): string {
  try {
    return readdirSync(dir).sort().map((f) => { const s = statSync(join(dir, f)); return `${f} ${s.size} ${s.mtimeMs}`; }).join('\n');
  } catch {
    return '(no folder)';
  }
}

/** The worker's one `sorbshare demo --out DIR --json` (spawned on first use; not to be changed). */
export function sharedDemoRun(): SharedDemoRun {
  if (shared) {
    const now = folderFingerprint(shared.outDir);
    if (now !== fingerprint) throw new Error(`a test changed the shared demo outputs in ${shared.outDir} (tests must only read them):\nwas\n${fingerprint}\nnow\n${now}`);
    return shared;
  }
  const parent = mkdtempSync(join(tmpdir(), 'sorbshare-shared-demo-'));
  process.once('exit', () => rmSync(parent, { recursive: true, force: true }));
  const outDir = join(parent, 'demo-out');
  shared = { ...runBin('demo', '--out', outDir, '--json'), outDir };
  fingerprint = folderFingerprint(outDir);
  return shared;
}
