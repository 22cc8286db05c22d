/**
 * No comment, doc or test cites a file outside the repository (the published sources are in
 * docs/references.md). PENDING lists files that other branches are rewriting at the time of
 * writing; remove each entry when its citation is gone (the test says which).
 */
import { describe, expect, it } from 'vitest';
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';

const OUTSIDE = /\/work\/shared|\bshared\/(?:DESIGN|CHECKS|STYLE)|\b(?:DESIGN|CHECKS|STYLE)\.md\b/;
const SELF = 'tests/checks/outsideCitations.test.ts';
const PENDING = new Set<string>([]);

function files(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? files(p) : /\.(ts|md|json|csv|html)$/.test(n) ? [p] : [];
  });
}

describe('citations stay inside the repository', () => {
  const root = process.cwd();
  const all = [...['src', 'tests', 'scripts', 'fixtures', 'docs', 'schema', 'types'].flatMap((d) => files(join(root, d))), join(root, 'README.md'), join(root, 'DEVELOPERS.md')]
    .map((p) => relative(root, p)).filter((p) => p !== SELF);
  it('no file outside the pending list names DESIGN.md, CHECKS.md, STYLE.md or the shared folder', () => {
    const offenders = all.filter((p) => !PENDING.has(p) && OUTSIDE.test(readFileSync(p, 'utf8')));
    expect(offenders).toEqual([]);
  });
  it('every pending entry still exists and still cites (otherwise remove it from the list)', () => {
    const done = [...PENDING].filter((p) => !existsSync(p) || !OUTSIDE.test(readFileSync(p, 'utf8')));
    expect(done).toEqual([]);
  });
  it('docs/references.md gives the sources the check cases name', () => {
    const refs = readFileSync('docs/references.md', 'utf8');
    for (const s of ['Radke', 'Crittenden', 'Sheindorf', 'Knappe', 'Chen, Z., Xing, B., McGill', 'SR 814.201.231', 'Hendricks', 'Steele', 'Clopper']) expect(refs).toContain(s);
  });
});
