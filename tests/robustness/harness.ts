/**
 * Table-driven bad-input cases for the built CLI: each case writes its files into its own folder
 * of one temporary directory, runs `dist/cli/bin.js` (several at a time), and the tests assert the
 * exit code, the named place in the message, empty stdout, no stack trace and an unchanged folder
 * (nothing written).
 */
import { spawn } from 'node:child_process';
import { cpSync, mkdirSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { expect } from 'vitest';
import { BIN } from '../helpers/cliHarness.js';

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

export interface CaseResult { code: number | null; out: string; err: string; before: string[]; after: string[] }

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

/** Prepare and run every case (`parallel` at a time); results by case name. */
export async function runCases(root: string, cases: readonly BadCase[], parallel = 3): Promise<Map<string, CaseResult>> {
  const results = new Map<string, CaseResult>();
  const jobs = cases.map((c, i) => async () => {
    const dir = join(root, `case${i}`);
    mkdirSync(dir, { recursive: true });
    if (c.copy) cpSync(c.copy, dir, { recursive: true });
    for (const [name, content] of Object.entries(c.files ?? {})) {
      mkdirSync(dirname(join(dir, name)), { recursive: true });
      writeFileSync(join(dir, name), content);
    }
    const before = listing(dir);
    const r = await runOne(c.args((name) => join(dir, name)), dir);
    results.set(c.name, { ...r, before, after: listing(dir) });
  });
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
