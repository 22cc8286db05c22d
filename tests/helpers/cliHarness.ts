/**
 * Spawning the built CLI (`dist/cli/bin.js`, built by `npm test` first) in end-to-end tests.
 * `runBin` first checks, once per test process, that every source file has a compiled file in
 * `dist` at least as new: a CLI test never runs yesterday's build by accident.
 *
 * `runInProcess` runs the same command line through `runCli` (src/cli/main.ts, which bin.js only
 * wraps) in the test's own process: the same exit code, stdout and stderr, without the half-second
 * Node start-up and module loading of a spawned run. It is for the many bad-input cases of a
 * command; each command keeps spawned runs (`runBin`), since the real binary's exit code and
 * streams are part of the behaviour.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';

export const BIN = join(process.cwd(), 'dist/cli/bin.js');

export interface CliRun {
  code: number | null;
  out: string;
  err: string;
}

/** Run `sorbshare ARGS…` and collect exit code, stdout and stderr (after the build check). */
export function runBin(...args: string[]): CliRun {
  requireBuild();
  const r = spawnSync(process.execPath, [BIN, ...args], { encoding: 'utf8' });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

/**
 * Run `sorbshare ARGS…` in this process (`runCli` from the sources, no build needed) and collect
 * exit code, stdout and stderr as `runBin` does. Not for runs that change `process` state.
 */
export async function runInProcess(...args: string[]): Promise<CliRun> {
  const { runCli } = await import('../../src/cli/main.js');
  let out = '';
  let err = '';
  const code = await runCli(args, { stdout: (s) => { out += s; }, stderr: (s) => { err += s; }, isTTY: false });
  return { code, out, err };
}

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((d) => {
    const p = join(dir, d.name);
    return d.isDirectory() ? sourceFiles(p) : d.name.endsWith('.ts') && !d.name.endsWith('.d.ts') ? [p] : [];
  });
}

/**
 * The source files whose compiled file in `dist` is missing or older, as "src/a.ts (reason)".
 * `root` is the project folder (src/ and dist/ inside).
 */
export function staleBuildFiles(root: string): string[] {
  const stale: string[] = [];
  for (const src of sourceFiles(join(root, 'src'))) {
    const rel = relative(join(root, 'src'), src);
    const out = join(root, 'dist', rel.replace(/\.ts$/, '.js'));
    if (!existsSync(out)) stale.push(`src/${rel} (no dist/${rel.replace(/\.ts$/, '.js')})`);
    else if (statSync(out).mtimeMs < statSync(src).mtimeMs) stale.push(`src/${rel} (newer than dist/${rel.replace(/\.ts$/, '.js')})`);
  }
  return stale;
}

let buildChecked = false;
/** Fail with a clear message when the CLI has not been built or `dist` is older than `src`. */
export function requireBuild(root = process.cwd()): void {
  if (buildChecked && root === process.cwd()) return;
  if (!existsSync(join(root, 'dist/cli/bin.js'))) throw new Error('the CLI is not built: run `npm run build` (npm test does it first)');
  const stale = staleBuildFiles(root);
  if (stale.length) {
    throw new Error(`dist is older than src: ${stale.slice(0, 5).join(', ')}${stale.length > 5 ? ` and ${stale.length - 5} more` : ''}; run \`npm run build\` (npm test does it first)`);
  }
  if (root === process.cwd()) buildChecked = true;
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
