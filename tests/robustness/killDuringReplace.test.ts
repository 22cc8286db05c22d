/**
 * Killing `run` (SIGKILL) while it replaces an existing output folder, 20 times at random moments
 * over the run's wall time: each time the folder holds exactly the old set or exactly the new set
 * (never a mix, never a partial file), and the next complete run removes the leftovers of the
 * killed ones.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { BIN, requireBuild } from '../helpers/cliHarness.js';

const OLD_MARK = 'OLD SET (written by the test)';
const OLD_FILES = ['run.json', 'summary.md', 'compounds.csv', 'stale.csv'];

let dir: string;
let out: string;
let newNames: string[];
let fullRunMs: number;

function writeOldSet(): void {
  rmSync(out, { recursive: true, force: true });
  mkdirSync(out);
  for (const f of OLD_FILES) writeFileSync(join(out, f), f === 'run.json' ? JSON.stringify({ mark: OLD_MARK }) : OLD_MARK);
}

/** 'old', 'new', or a description of what is wrong. */
function classify(): string {
  if (!existsSync(out)) return 'no folder';
  const names = readdirSync(out).sort();
  const text = names.map((n) => readFileSync(join(out, n), 'utf8'));
  if (JSON.stringify(names) === JSON.stringify([...OLD_FILES].sort()) && text.every((t) => t.includes(OLD_MARK))) return 'old';
  if (JSON.stringify(names) === JSON.stringify(newNames)) {
    if (text.some((t) => t.includes(OLD_MARK) || t.length === 0)) return 'new names with old or empty content';
    JSON.parse(readFileSync(join(out, 'run.json'), 'utf8')); // complete (a cut file would not parse)
    if (!readFileSync(join(out, 'report.html'), 'utf8').trimEnd().endsWith('</html>')) return 'cut report';
    return 'new';
  }
  return `a mix: ${names.join(', ')}`;
}

/** A small project that writes the whole set (report, tables, workbook, run.json) in about half a second. */
const PROJECT = join(process.cwd(), 'fixtures/project/surrogates-gac-mc/project.json');

function runArgs(): string[] {
  return [BIN, 'run', PROJECT, '--out', out, '--draws', '0'];
}

beforeAll(() => {
  requireBuild();
  dir = mkdtempSync(join(tmpdir(), 'sorbshare-kill-'));
  out = join(dir, 'results');
  writeOldSet();
  const t0 = Date.now();
  const r = spawnSync(process.execPath, runArgs(), { encoding: 'utf8' });
  fullRunMs = Date.now() - t0;
  if (r.status !== 0) throw new Error(`reference run failed: ${r.stderr}`);
  newNames = readdirSync(out).sort();
}, 120_000);

afterAll(() => { if (dir) rmSync(dir, { recursive: true, force: true }); });

describe('SIGKILL while the output folder is replaced', () => {
  it('leaves exactly the old set or exactly the new set, 20 times at random moments', async () => {
    const seen: string[] = [];
    for (let i = 0; i < 20; i++) {
      writeOldSet();
      // random moments over the whole run, weighted towards its end where the folder is written
      const at = fullRunMs * (i % 2 === 0 ? Math.random() : 0.8 + 0.3 * Math.random());
      const child = spawn(process.execPath, runArgs(), { stdio: 'ignore' });
      const done = new Promise<void>((resolve) => child.on('exit', () => resolve()));
      await new Promise((r) => setTimeout(r, at));
      child.kill('SIGKILL');
      await done;
      const state = classify();
      seen.push(state);
      expect(['old', 'new'], `kill ${i + 1} at ${Math.round(at)} ms of ${fullRunMs} ms`).toContain(state);
    }
    // the next complete run removes what killed runs left beside the folder
    const r = spawnSync(process.execPath, runArgs(), { encoding: 'utf8' });
    expect(r.status, r.stderr).toBe(0);
    expect(classify()).toBe('new');
    expect(readdirSync(dir).filter((n) => n.startsWith('.results.'))).toEqual([]);
    console.log(`kill test: ${seen.filter((s) => s === 'old').length} old, ${seen.filter((s) => s === 'new').length} new (full run ${fullRunMs} ms)`);
  }, 300_000);

  it('two concurrent runs into one folder leave one complete set and no leftovers', async () => {
    writeOldSet();
    const one = () => new Promise<number | null>((resolve) => spawn(process.execPath, runArgs(), { stdio: 'ignore' }).on('exit', (code) => resolve(code)));
    const codes = await Promise.all([one(), one()]);
    expect(codes).toEqual([0, 0]);
    expect(classify()).toBe('new');
    expect(readdirSync(dir).filter((n) => n.startsWith('.results.'))).toEqual([]);
  }, 120_000);
});
