/**
 * The README's library example runs as written: the block between the library-example markers
 * is copied into a consumer project that has this package in node_modules (a symlink to the
 * built package, as `npm install` would place it) and executed with tsx. It must print a dose
 * per PAC carbon and write every output file that `pipelineOutputs` lists.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { OUTPUT_FILES } from '../../src/outputFiles/pipelineOutputs.js';

function readmeExample(): string {
  const readme = readFileSync('README.md', 'utf8');
  const m = /<!-- library-example:start -->\s*```ts\n([\s\S]*?)```\s*<!-- library-example:end -->/.exec(readme);
  if (!m) throw new Error('README.md has no library-example block');
  return m[1]!;
}

describe('README library example', () => {
  it('runs as written against the built package and writes the outputs', () => {
    expect(existsSync(join(process.cwd(), 'dist/index.js')), 'npm run build first').toBe(true);
    const dir = mkdtempSync(join(tmpdir(), 'sorbshare-readme-'));
    mkdirSync(join(dir, 'node_modules'));
    symlinkSync(process.cwd(), join(dir, 'node_modules', 'sorbshare'), 'dir');
    writeFileSync(join(dir, 'package.json'), JSON.stringify({ name: 'consumer', type: 'module' }));
    writeFileSync(join(dir, 'example.ts'), readmeExample());
    const tsx = join(process.cwd(), 'node_modules', '.bin', 'tsx');
    const r = spawnSync(tsx, ['example.ts'], { encoding: 'utf8', cwd: dir, timeout: 240_000 });
    expect(r.status, r.stderr).toBe(0);
    // one line per PAC carbon of the demo project: "<name>: <dose> mg/L, governed by <goal>"
    const project = JSON.parse(readFileSync('fixtures/demo/project.json', 'utf8')) as { carbons: Array<{ name: string; type?: string }> };
    const pac = project.carbons.filter((c) => (c.type ?? 'PAC') === 'PAC');
    const lines = r.stdout.trim().split('\n');
    expect(lines).toHaveLength(pac.length);
    pac.forEach((c, i) => expect(lines[i]).toMatch(new RegExp(`^${c.name.replace(/[()]/g, '\\$&')}: \\d+\\.\\d mg/L, governed by \\S`)));
    for (const f of OUTPUT_FILES) expect(existsSync(join(dir, 'results', f)), f).toBe(true);
    expect(readFileSync(join(dir, 'results', 'report.html'), 'utf8')).toMatch(/<svg/);
  }, 300_000);
});
