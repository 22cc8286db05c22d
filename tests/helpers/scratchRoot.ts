/**
 * Vitest global setup: every temporary folder of the run goes under one folder of its own, removed
 * when the run ends. TMPDIR is set before the test workers start, so the workers (os.tmpdir()),
 * the CLI processes they spawn and Chromium all inherit it; the tests' mkdtemp folders then need
 * no cleanup of their own, and a run that another run overlaps never touches that run's folders.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export default function setup(): () => void {
  const previous = process.env.TMPDIR;
  const root = mkdtempSync(join(tmpdir(), 'sorbshare-tests-'));
  process.env.TMPDIR = root;
  return () => {
    if (previous === undefined) delete process.env.TMPDIR;
    else process.env.TMPDIR = previous;
    rmSync(root, { recursive: true, force: true });
  };
}
