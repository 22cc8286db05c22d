/**
 * `sorbshare run` on a long series starts the results.xlsx worker when the run begins
 * (workbookThreadAhead); a run that then fails still exits with its code and message, writes
 * nothing, and does not wait on the worker. The project is the demo with its series repeated to
 * 8,000 days (16,000 daily rows of the two PAC carbons) and the UV254 columns left out of its DOC
 * isotherm, so the pilot check fails after the daily doses (invented data).
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { cpSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { BIN, requireBuild } from '../helpers/cliHarness.js';
import { loadProject } from '../../src/io/loadProject.js';
import { workbookThreadAhead } from '../../src/cli/workbookThread.js';

describe('sorbshare run with the workbook worker started ahead', () => {
  it('a failure in the pipeline: exit 2 with the message, nothing written, no wait on the worker', () => {
    requireBuild();
    const dir = mkdtempSync(join(tmpdir(), 'sorbshare-ahead-'));
    try {
      const p = join(dir, 'p');
      cpSync(join(process.cwd(), 'fixtures/demo'), p, { recursive: true });
      const series = readFileSync(join(p, 'site_series.csv'), 'utf8').trimEnd().split('\n');
      const head = series.slice(0, 2);
      const days = series.slice(2);
      const day0 = Date.UTC(2000, 0, 1);
      const long = Array.from({ length: 8000 }, (_, k) => [new Date(day0 + k * 86_400_000).toISOString().slice(0, 10), ...days[k % days.length]!.split(',').slice(1)].join(','));
      writeFileSync(join(p, 'site_series.csv'), [...head, ...long].join('\n') + '\n');
      const iso = readFileSync(join(p, 'doc_isotherm.csv'), 'utf8').trimEnd().split('\n');
      writeFileSync(join(p, 'doc_isotherm.csv'), [iso[0], ...iso.slice(1).map((l) => l.split(',').slice(0, 3).join(','))].join('\n') + '\n');
      expect(workbookThreadAhead(loadProject(join(p, 'project.json')))).toBe(true);
      const out = join(dir, 'out');
      const started = Date.now();
      const r = spawnSync(process.execPath, [BIN, 'run', join(p, 'project.json'), '--out', out, '--draws', '0'], { encoding: 'utf8', timeout: 120_000 });
      expect(r.error).toBeUndefined(); // not killed by the time-out
      expect(r.status, r.stderr).toBe(2);
      expect(r.stderr).toMatch(/pilot check needs UV254/);
      expect(r.stdout).toBe('');
      expect(existsSync(out)).toBe(false);
      expect(readdirSync(dir)).toEqual(['p']);
      expect(Date.now() - started).toBeLessThan(120_000);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 150_000);
});
