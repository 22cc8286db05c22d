/** Spawning the built CLI (`dist/cli/bin.js`, built by `npm test` first) in end-to-end tests. */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export const BIN = join(process.cwd(), 'dist/cli/bin.js');

export interface CliRun {
  code: number | null;
  out: string;
  err: string;
}

/** Run `sorbshare ARGS…` and collect exit code, stdout and stderr. */
export function runBin(...args: string[]): CliRun {
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8' });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

/** Fail early with a clear message when the CLI has not been built. */
export function requireBuild(): void {
  if (!existsSync(BIN)) throw new Error('build first: npm run build');
}

/** A fresh temporary folder and a writer of text or JSON files into it. */
export function scratchDir(prefix: string): { dir: string; write: (name: string, content: unknown) => string } {
  const dir = mkdtempSync(join(tmpdir(), prefix));
  const write = (name: string, content: unknown) => {
    const p = join(dir, name);
    writeFileSync(p, typeof content === 'string' ? content : JSON.stringify(content));
    return p;
  };
  return { dir, write };
}
