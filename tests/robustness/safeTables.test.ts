/**
 * Formula neutralisation in every CSV the tool writes (OWASP, "CSV Injection", common practice:
 * a text cell starting with =, +, -, @, tab or carriage return gets a leading single quote;
 * plain numbers stay numbers), and names cleaned of control and direction characters at input.
 */
import { describe, expect, it } from 'vitest';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { neutraliseCsvCell } from '../../src/tables/safeCsvCell.js';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipeline } from '../../src/pipeline/runPipeline.js';
import { pipelineOutputs } from '../../src/outputFiles/pipelineOutputs.js';

const DANGEROUS = /^[=+\-@\t\r]/;
const NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?$/;

describe('neutraliseCsvCell', () => {
  it.each([
    ['=HYPERLINK("http://x","y")', `'=HYPERLINK("http://x","y")`],
    ['+cmd', "'+cmd"],
    ['-2+3', "'-2+3"],
    ['@SUM(A1)', "'@SUM(A1)"],
    ['\tx', "'\tx"],
    ['\rx', "'\rx"],
    ['-3.5', '-3.5'],
    ['+2', '+2'],
    ['1e-6', '1e-6'],
    ['carbamazepine', 'carbamazepine'],
    ['', ''],
  ])('%j → %j', (input, expected) => {
    expect(neutraliseCsvCell(input)).toBe(expected);
  });
});

describe('every CSV of a run with hostile names', () => {
  it('has no cell a spreadsheet would run as a formula, and no hidden characters', () => {
    const dir = mkdtempSync(join(tmpdir(), 'sorbshare-safe-'));
    try {
      cpSync(join(process.cwd(), 'fixtures/demo'), dir, { recursive: true });
      const p = JSON.parse(readFileSync(join(dir, 'project.json'), 'utf8'));
      p.name = '=cmd|" /C calc"!A0';
      p.carbons[0].name = '@SUM(1+1)*cmd|" /C calc"!A0';
      p.carbons[1].name = '+Carbon\u202eB';
      p.carbons[2].name = '-GAC\tC';
      p.pilot.carbon = p.carbons[0].name;
      p.compounds[3].id = '=CLA';
      p.compounds[4].id = '-VEN';
      for (const m of [p.carbons[2].kinetics.Ds, p.carbons[2].kinetics.DL]) { m['=CLA'] = m.CLA; m['-VEN'] = m.VEN; delete m.CLA; delete m.VEN; } // the GAC's fixed-bed inputs follow the renamed ids
      p.compounds[5].name = '\u2066@hydrochlorothiazide\u2069';
      writeFileSync(join(dir, 'project.json'), JSON.stringify(p));
      writeFileSync(join(dir, 'pilot_pairs.csv'), readFileSync(join(dir, 'pilot_pairs.csv'), 'utf8').replace(/\nP1,/, '\n=P1,').replace(/\nP2,/, '\n"+P2",'));
      const input = loadProject(join(dir, 'project.json'));
      expect(input.project.carbons[1]!.name).toBe('+CarbonB'); // direction override removed at input
      expect(input.project.carbons[2]!.name).toBe('-GAC C'); // tab inside a name becomes a space
      const files = pipelineOutputs(runPipeline(input, { now: new Date('2026-01-01T00:00:00Z') }), { toolVersion: 'test', nodeVersion: 'test' });
      const csvs = Object.entries(files).filter(([n]) => n.endsWith('.csv'));
      expect(csvs.length).toBeGreaterThanOrEqual(10);
      let hostileSeen = 0;
      for (const [name, text] of csvs) {
        const rows = parse(text) as string[][];
        for (const row of rows) {
          for (const cell of row) {
            if (cell.startsWith("'")) hostileSeen++;
            expect(DANGEROUS.test(cell) && !NUMBER.test(cell), `${name}: ${JSON.stringify(cell)}`).toBe(false);
            expect(cell, `${name}: hidden characters`).not.toMatch(/[\u202a-\u202e\u2066-\u2069]/);
          }
        }
      }
      expect(hostileSeen).toBeGreaterThan(10); // the hostile names did reach the tables, neutralised
      expect(files['carbons.csv']).toContain(`'@SUM(1+1)`);
      expect(files['compounds.csv']).toContain(`'=CLA`);
    } finally { rmSync(dir, { recursive: true, force: true }); }
  }, 120_000);
});
