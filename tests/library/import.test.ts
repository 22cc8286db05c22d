/**
 * The package is usable as a library: `import('sorbshare')` from the project root (package
 * self-reference) and from another project that has it in node_modules, with types shipped.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, mkdirSync, symlinkSync, writeFileSync, existsSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const script = `import('sorbshare').then((m) => {
  const r = m.equilibrium({ components: [{ id: 'A', c0: '3 mg/L', K: 10, one_over_n: 0.5 }] }, '50 mg/L');
  console.log(JSON.stringify({ c: r.components[0].c_mg_per_L, version: m.VERSION, fns: ['equilibrium','equilibriumCurve','doseFor','loadingsAt'].every((f) => typeof m[f] === 'function') }));
});`;

describe('library entry point', () => {
  it('imports from the project root by package name', () => {
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8', cwd: process.cwd() });
    expect(r.status, r.stderr).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.c).toBeCloseTo(2.25, 12);
    expect(j.fns).toBe(true);
    expect(j.version).toBe(JSON.parse(readFileSync('package.json', 'utf8')).version);
  });

  it('imports from another project that has it installed, and ships .d.ts types', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sorbshare-consumer-'));
    mkdirSync(join(dir, 'node_modules'));
    symlinkSync(process.cwd(), join(dir, 'node_modules', 'sorbshare'), 'dir');
    writeFileSync(join(dir, 'package.json'), JSON.stringify({ name: 'consumer', type: 'module' }));
    const r = spawnSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8', cwd: dir });
    expect(r.status, r.stderr).toBe(0);
    expect(JSON.parse(r.stdout).c).toBeCloseTo(2.25, 12);
    expect(existsSync(join(process.cwd(), 'dist/index.d.ts'))).toBe(true);
  });
});
