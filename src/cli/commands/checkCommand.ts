/** `sorbshare check [--json]` — run the reference check cases shipped in fixtures/checks/<case>/ (input.json, expected.json). */
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { CommandSpec } from '../commandSpec.js';
import { ComputationError, InputError } from '../../core/errors.js';
import { readJsonFile } from '../../io/readFiles.js';
import { PROVENANCES, type CheckOutcome } from '../../checks/checkCase.js';
import { inFile } from './shared.js';
import { fmt } from '../format.js';
import { snakeCaseJsonText } from '../../output/snakeCaseJson.js';

/** The shipped check cases, three folders above this file in both src/ and dist/ layouts. */
export function checksDir(): string {
  return fileURLToPath(new URL('../../../fixtures/checks/', import.meta.url));
}

function fmtValue(x: number | null): string {
  if (x === null) return '—';
  const a = Math.abs(x);
  return a !== 0 && (a < 1e-3 || a >= 1e7) ? x.toExponential(9) : String(Number(x.toPrecision(10)));
}

function render(outcomes: CheckOutcome[]): string {
  const lines: string[] = [];
  for (const o of outcomes) {
    lines.push(`${o.pass ? 'PASS' : 'FAIL'}  ${o.id}: ${o.title}`);
    lines.push(`      source:   ${o.source}`);
    lines.push(`      provenance: ${o.provenance}`);
    lines.push(`      expected: ${fmtValue(o.expected)} ${o.unit}   computed: ${fmtValue(o.computed)} ${o.unit}   ${o.error ? `error: ${o.error}` : `relative difference ${o.relativeError === null ? '—' : fmt(o.relativeError, 2)}`}`);
  }
  const failed = outcomes.filter((o) => !o.pass).length;
  const byProvenance = PROVENANCES.map((p) => [p, outcomes.filter((o) => o.provenance === p).length] as const).filter(([, n]) => n > 0);
  lines.push('', `${outcomes.length - failed} of ${outcomes.length} check cases agree${failed ? `; ${failed} failed` : ''} (${byProvenance.map(([p, n]) => `${n} ${p}`).join(', ')}).`);
  return lines.join('\n');
}

export const checkCommand: CommandSpec = {
  name: 'check',
  args: [],
  summary: 'Run the shipped reference check cases and print expected and computed values with their sources and the provenance of each expected value',
  options: [{ flags: '--json', description: 'print JSON instead of text' }],
  examples: ['sorbshare check', 'sorbshare check --json'],
  async action(_args, opts, ctx) {
    const { readCheckInput, readCheckExpected, runCheckCase } = await import('../../checks/checkCase.js');
    const dir = checksDir();
    let names: string[];
    try {
      names = readdirSync(dir, { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name).sort();
    } catch {
      throw new InputError('check cases folder not found; expected fixtures/checks/ beside the installed package', { file: dir });
    }
    const outcomes = names.map((n) => {
      const inputFile = join(dir, n, 'input.json');
      const expectedFile = join(dir, n, 'expected.json');
      const c = inFile(inputFile, () => readCheckInput(readJsonFile(inputFile, 'check case')));
      const expected = inFile(expectedFile, () => readCheckExpected(readJsonFile(expectedFile, 'expected value of a check case')));
      return runCheckCase({ ...c, expected });
    });
    const failed = outcomes.filter((o) => !o.pass);
    const text = opts.json ? snakeCaseJsonText({ cases: outcomes, passed: outcomes.length - failed.length, failed: failed.length }) : render(outcomes);
    if (failed.length) {
      // stdout stays empty on failure (CLI rule); the full listing goes to stderr with exit 1
      ctx.err(text.endsWith('\n') ? text : text + '\n');
      throw new ComputationError(`${failed.length} of ${outcomes.length} check cases failed: ${failed.map((f) => f.id).join(', ')}`);
    }
    ctx.out(text);
  },
};
