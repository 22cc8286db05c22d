/**
 * Table-driven bad-input cases for the CLI: each case writes its files into its own folder of one
 * temporary directory and runs the command line; the tests assert the exit code, the named place
 * in the message, empty stdout, no stack trace and an unchanged folder (nothing written).
 *
 * The first case of each kind (the name's prefix before ":") and of each command, every case with
 * a relative path (resolved in the case folder, the spawned binary's working directory) and every
 * `run` or `demo` without `--out` (whose default output folder is relative) spawn the built
 * `dist/cli/bin.js` in the case folder (several at a time). The other cases, whose paths are all
 * absolute, go through the same `runCli` in the test process (`runInProcess`,
 * tests/helpers/cliHarness.ts: the binary's exit code, stdout and stderr without a Node start-up
 * each, which made these files the slowest of the suite); for them the working directory's own
 * listing must stay unchanged too.
 */
import { spawn } from 'node:child_process';
import { cpSync, mkdirSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { dirname, isAbsolute, join } from 'node:path';
import { expect } from 'vitest';
import { BIN, runInProcess } from '../helpers/cliHarness.js';

export interface BadCase {
  name: string;
  /** Files to write into the case folder (text or bytes); `copy` copies a fixture folder first. */
  files?: Record<string, string | Uint8Array>;
  copy?: string;
  /** Command-line arguments; `p(name)` is the path of a file in the case folder. */
  args: (p: (name: string) => string) => string[];
  code: number;
  /** Every pattern must match stderr (the named place: file, row, column, JSON path or option). */
  place: RegExp[];
}

export interface CaseResult { code: number | null; out: string; err: string; before: string[]; after: string[]; spawned: boolean }

/** Every file and folder under `dir`, relative, sorted. */
export function listing(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string, rel: string) => {
    for (const name of readdirSync(d).sort()) {
      const r = rel ? `${rel}/${name}` : name;
      out.push(r);
      if (statSync(join(d, name)).isDirectory()) walk(join(d, name), r);
    }
  };
  walk(dir, '');
  return out;
}

function runOne(args: string[], cwd: string): Promise<{ code: number | null; out: string; err: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [BIN, ...args], { cwd });
    let out = '', err = '';
    child.stdout.on('data', (d) => { out += d; });
    child.stderr.on('data', (d) => { err += d; });
    child.on('close', (code) => resolve({ code, out, err }));
  });
}

/** Which cases spawn the binary (see the file comment); the others run in-process. */
export function spawnedCases(cases: readonly BadCase[]): Set<string> {
  const kinds = new Set<string>();
  const commands = new Set<string>();
  const spawned = new Set<string>();
  for (const c of cases) {
    const args = c.args((name) => join('/case', name));
    const kind = c.name.split(':')[0]!;
    const command = args[0] ?? '';
    // a path not made by the case's p(): relative to the working directory
    const relative = args.some((a, k) => k > 0 && !isAbsolute(a) && (a === '.' || a === '..' || args[k - 1] === '--out' || /\.(json|csv|xlsx|txt|html|pdf)(#|$)/i.test(a)));
    if (!kinds.has(kind) || !commands.has(command) || relative || ((command === 'run' || command === 'demo') && !args.includes('--out'))) spawned.add(c.name);
    kinds.add(kind);
    commands.add(command);
  }
  return spawned;
}

/** Prepare and run every case (spawned ones `parallel` at a time); results by case name. */
export async function runCases(root: string, cases: readonly BadCase[], parallel = 3): Promise<Map<string, CaseResult>> {
  const results = new Map<string, CaseResult>();
  const spawned = spawnedCases(cases);
  const prepare = (c: BadCase, i: number): string => {
    const dir = join(root, `case${i}`);
    mkdirSync(dir, { recursive: true });
    if (c.copy) cpSync(c.copy, dir, { recursive: true });
    for (const [name, content] of Object.entries(c.files ?? {})) {
      mkdirSync(dirname(join(dir, name)), { recursive: true });
      writeFileSync(join(dir, name), content);
    }
    return dir;
  };
  // in-process cases one after the other (the test process's working directory must not change)
  for (const [i, c] of cases.entries()) {
    if (spawned.has(c.name)) continue;
    const dir = prepare(c, i);
    const before = listing(dir);
    const cwdBefore = readdirSync(process.cwd());
    const r = await runInProcess(...c.args((name) => join(dir, name)));
    const strays = readdirSync(process.cwd()).filter((n) => !cwdBefore.includes(n)).map((n) => `(working directory) ${n}`);
    results.set(c.name, { ...r, before, after: [...listing(dir), ...strays], spawned: false });
  }
  const jobs = cases.flatMap((c, i) => (spawned.has(c.name) ? [async () => {
    const dir = prepare(c, i);
    const before = listing(dir);
    const r = await runOne(c.args((name) => join(dir, name)), dir);
    results.set(c.name, { ...r, before, after: listing(dir), spawned: true });
  }] : []));
  let next = 0;
  await Promise.all(Array.from({ length: parallel }, async () => { while (next < jobs.length) await jobs[next++]!(); }));
  return results;
}

/**
 * The promise every refused input keeps: the expected exit code, nothing on stdout, one error line
 * naming the place (no stack trace), and the folder exactly as it was (nothing written).
 */
export function expectRefused(r: CaseResult, c: BadCase): void {
    const shown = `exit ${r.code}\nstderr: ${r.err}\nstdout: ${r.out}`;
    expect(r.code, shown).toBe(c.code);
    expect(r.out, shown).toBe('');
    expect(r.err, shown).toMatch(/^sorbshare: (bad input|computation failed): |^error: /m);
    expect(r.err, shown).not.toMatch(/internal error|\n\s+at .*\(.*:\d+:\d+\)/);
    for (const p of c.place) expect(r.err, shown).toMatch(p);
    expect(r.after, 'nothing written').toEqual(r.before);
}
