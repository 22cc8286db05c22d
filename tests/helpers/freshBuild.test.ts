/** CLI tests refuse to run a build older than the sources (tests/helpers/cliHarness.ts). */
import { describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { requireBuild, staleBuildFiles } from './cliHarness.js';

function project(): { root: string; write: (rel: string, mtimeS: number) => void } {
  const root = mkdtempSync(join(tmpdir(), 'sorbshare-build-'));
  const write = (rel: string, mtimeS: number) => {
    const p = join(root, rel);
    mkdirSync(join(p, '..'), { recursive: true });
    writeFileSync(p, '');
    utimesSync(p, mtimeS, mtimeS);
  };
  return { root, write };
}

describe('build freshness', () => {
  it('passes when every source has a compiled file at least as new', () => {
    const { root, write } = project();
    write('src/a.ts', 1000); write('src/cli/bin.ts', 1000); write('src/types.d.ts', 5000);
    write('dist/a.js', 1000); write('dist/cli/bin.js', 2000);
    expect(staleBuildFiles(root)).toEqual([]);
    expect(() => requireBuild(root)).not.toThrow();
  });
  it('names each source newer than its build, or without one, and says to build', () => {
    const { root, write } = project();
    write('src/a.ts', 3000); write('src/cli/bin.ts', 1000); write('src/new.ts', 1000);
    write('dist/a.js', 2000); write('dist/cli/bin.js', 2000);
    expect(staleBuildFiles(root).sort()).toEqual(['src/a.ts (newer than dist/a.js)', 'src/new.ts (no dist/new.js)']);
    expect(() => requireBuild(root)).toThrow(/dist is older than src: .*src\/a\.ts \(newer than dist\/a\.js\).*run `npm run build`/);
  });
  it('says the CLI is not built when dist/cli/bin.js is missing', () => {
    const { root, write } = project();
    write('src/cli/bin.ts', 1000);
    expect(() => requireBuild(root)).toThrow(/the CLI is not built: run `npm run build`/);
  });
});
