import { describe, expect, it } from 'vitest';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { InputError } from '../../src/core/errors.js';

const demoDir = join(__dirname, '../../fixtures/demo');

function copyDemo(): string {
  const dir = mkdtempSync(join(tmpdir(), 'sorbshare-load-'));
  cpSync(demoDir, dir, { recursive: true });
  return dir;
}

function errorOf(f: () => unknown): InputError {
  try { f(); } catch (e) { if (e instanceof InputError) return e; throw e; }
  throw new Error('expected an InputError');
}

describe('loadProject', () => {
  it('reads the demo and every referenced file, with SHA-256 for run.json', () => {
    const input = loadProject(join(demoDir, 'project.json'));
    expect(input.isotherm?.rowNumbers.length).toBe(8);
    expect(Object.keys(input.jarTests)).toEqual(['CBZ']);
    expect(input.series?.dates.length).toBe(365);
    expect(input.series?.flowFromDesign).toBe(false);
    expect(input.provenance.files.map((f) => f.role)).toEqual(['project', 'DOC isotherm', 'jar tests CBZ', 'column test HCT (GAC C (coal-based))', 'site DOC series', 'pilot pairs']);
    for (const f of input.provenance.files) expect(f.sha256).toMatch(/^[0-9a-f]{64}$/);
  });

  it('a missing referenced CSV names the path and the field that referenced it', () => {
    const dir = copyDemo();
    try {
      rmSync(join(dir, 'site_series.csv'));
      const e = errorOf(() => loadProject(join(dir, 'project.json')));
      expect(e.location.file).toBe(join(dir, 'site_series.csv'));
      expect(e.message).toContain('site_series.csv');
      expect(e.message).toContain('field site.series');
      expect(e.message).toMatch(/not found/);
    } finally { rmSync(dir, { recursive: true, force: true }); }
  });

  it('a bad cell in a referenced CSV names file, row and column', () => {
    const dir = copyDemo();
    try {
      const p = join(dir, 'site_series.csv');
      const lines = readFileSync(p, 'utf8').split('\n');
      lines[5] = lines[5]!.replace(/,([\d.]+),/, ',7 mg,'); // 6th line of the file
      writeFileSync(p, lines.join('\n'));
      const e = errorOf(() => loadProject(join(dir, 'project.json')));
      expect(e.location.file).toBe(p);
      expect(e.location.row).toBe(6);
      expect(e.location.column).toBe('DOC (mg/L)');
      expect(e.message).toMatch(/"7 mg" is not a number/);
    } finally { rmSync(dir, { recursive: true, force: true }); }
  });

  it('a gap in the DOC series ("n.a." or "-") leaves the day out and counts it in the warnings', () => {
    const dir = copyDemo();
    try {
      const p = join(dir, 'site_series.csv');
      const lines = readFileSync(p, 'utf8').split('\n');
      const days = lines.filter((l) => /^\d{4}-/.test(l)).length;
      lines[5] = lines[5]!.replace(/,([\d.]+),/, ',n.a.,');
      lines[7] = lines[7]!.replace(/,([\d.]+),/, ',-,');
      writeFileSync(p, lines.join('\n'));
      const input = loadProject(join(dir, 'project.json'));
      expect(input.series!.dates.length).toBe(days - 2);
      expect(input.provenance.notes!.join('\n')).toMatch(/2 day\(s\) with a gap .* left out \(rows 6, 8\)/);
    } finally { rmSync(dir, { recursive: true, force: true }); }
  });

  it('a bad date and dates out of order are named by row', () => {
    const dir = copyDemo();
    try {
      const p = join(dir, 'site_series.csv');
      const lines = readFileSync(p, 'utf8').split('\n');
      const good = lines.slice();
      lines[3] = lines[3]!.replace(/^2025-01-02/, '2025-13-02');
      writeFileSync(p, lines.join('\n'));
      let e = errorOf(() => loadProject(join(dir, 'project.json')));
      expect(e.location.row).toBe(4);
      expect(e.message).toMatch(/"2025-13-02" is not a date; expected YYYY-MM-DD/);
      [good[3], good[4]] = [good[4]!, good[3]!];
      writeFileSync(p, good.join('\n'));
      e = errorOf(() => loadProject(join(dir, 'project.json')));
      expect(e.message).toMatch(/does not follow/);
    } finally { rmSync(dir, { recursive: true, force: true }); }
  });

  it('a schema violation in the project names the project file and the JSON path', () => {
    const dir = copyDemo();
    try {
      const p = join(dir, 'project.json');
      const raw = JSON.parse(readFileSync(p, 'utf8'));
      raw.compounds[5].c0 = 'lots';
      writeFileSync(p, JSON.stringify(raw));
      const e = errorOf(() => loadProject(p));
      expect(e.location.file).toBe(p);
      expect(e.location.path).toBe('compounds[5].c0');
    } finally { rmSync(dir, { recursive: true, force: true }); }
  });
});
