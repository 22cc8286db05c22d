/**
 * run.json is snake_case throughout (src/output/snakeCaseJson.ts): walking the whole record of
 * the invented demo (a year of DOC, GAC, pilot check, Monte Carlo with a few draws) finds no
 * camelCase key except user ids. Two invented compounds carry camelCase ids, one of them equal to
 * a core field name (`docMgPerL`), to show that user ids used as map keys are never renamed.
 * Properties only; no value here is a check value from outside the project.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { loadProject } from '../../src/io/loadProject.js';
import { runPipelineWithUncertainty } from '../../src/pipeline/runWithUncertainty.js';
import { runRecord } from '../../src/output/runRecord.js';
import { SNAKE_CASE_KEYS, toSnakeCaseJson, userIdMap } from '../../src/output/snakeCaseJson.js';

const USER_IDS = ['newDrug', 'docMgPerL'];
let record: Record<string, unknown>;
let compoundIds: Set<string>;

/** Every key with a lower-case letter or digit followed by a capital (camelCase), with its path. */
function camelKeys(value: unknown, path: string, out: string[], keep: (path: string, key: string) => boolean): string[] {
  if (Array.isArray(value)) value.forEach((v) => camelKeys(v, `${path}[]`, out, keep));
  else if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (/[a-z0-9][A-Z]/.test(k) && !keep(path, k)) out.push(`${path}.${k}`);
      camelKeys(v, `${path}.${k}`, out, keep);
    }
  }
  return out;
}

beforeAll(async () => {
  const input = loadProject(join(__dirname, '../../fixtures/demo/project.json'), { demo: true });
  const p = input.project;
  for (const id of USER_IDS) {
    const c = { ...p.compounds[2]!, id, name: `invented: ${id}` };
    delete (c as { indicatorCategory?: unknown }).indicatorCategory;
    delete (c as { jarTests?: unknown }).jarTests;
    p.compounds.push(c);
  }
  // the GAC carbon's fixed-bed inputs need the added compounds too: they take compounds[2]'s (invented)
  for (const c of p.carbons) if (c.bedKinetics) for (const id of USER_IDS) c.bedKinetics.compounds[id] = { ...c.bedKinetics.compounds[p.compounds[2]!.id]! };
  compoundIds = new Set(p.compounds.map((c) => c.id));
  // two GAC run-length draws (the demo has 5; each integrates every compound again) give the same keys
  p.uncertainty = { ...p.uncertainty!, gacDraws: 2 };
  const r = await runPipelineWithUncertainty(input, { now: new Date('2026-01-01T00:00:00Z'), draws: 8, seed: 5, workers: 0 });
  record = JSON.parse(JSON.stringify(runRecord(r, { toolVersion: '0.0.0', nodeVersion: 'v0' }))) as Record<string, unknown>;
}, 120_000);

describe('run.json keys', () => {
  it('has no camelCase key anywhere except user ids (compound ids as map keys)', () => {
    const keys = camelKeys(record, '', [], (_path, k) => compoundIds.has(k));
    expect(keys).toEqual([]);
    // and the record holds the parts that carry core objects (so the walk saw them)
    const results = record.results as { carbons: Array<Record<string, unknown>> };
    expect(results.carbons[0]!.required_dose).toHaveProperty('dose_mg_per_L');
    expect(results.carbons[0]!.monte_carlo).toHaveProperty('result.quantities');
    expect((results.carbons[0]!.daily as Array<Record<string, unknown>>)[0]).toHaveProperty('governed_by');
  });

  it('keeps user ids as map keys, even one equal to a mapped core field name', () => {
    const results = record.results as { goals: Record<string, unknown>; carbons: Array<{ removal_curves: { removal_percent: Record<string, unknown> } }> };
    for (const id of USER_IDS) {
      expect(results.goals).toHaveProperty([id]);
      expect(results.carbons[0]!.removal_curves.removal_percent).toHaveProperty([id]);
    }
    expect(results.goals).not.toHaveProperty(['doc_mg_per_L']);
  });

  it('keeps the existing snake_case names of run.json', () => {
    const inputs = record.inputs as { site: Record<string, unknown>; uncertainty: Record<string, unknown> };
    expect(Object.keys(inputs.site)).toEqual(['name', 'flow_m3_per_d', 'doc_mg_per_L', 'uv254_per_m', 'series_file']);
    expect(inputs.uncertainty).toHaveProperty('K_rel_sd');
    expect(record).toHaveProperty('timing_ms');
    expect(record).toHaveProperty('results.carbons.0.daily_summary.dose_table.doc_nodes_mg_per_L');
  });
});

describe('toSnakeCaseJson', () => {
  it('renames mapped fields, keeps user-id maps and snake_case keys, turns typed arrays into arrays', () => {
    const out = toSnakeCaseJson({
      doseMgPerL: 1, already_snake: 2, removalPercent: { myDrug: [1] },
      byId: userIdMap({ oneOverN: { oneOverN: 0.2 } }), values: Float64Array.of(1, 2),
    });
    expect(out).toEqual({ dose_mg_per_L: 1, already_snake: 2, removal_percent: { myDrug: [1] }, byId: { oneOverN: { one_over_n: 0.2 } }, values: [1, 2] });
  });

  it('maps every listed field to a snake_case name (no capital after a lower-case letter)', () => {
    for (const [camel, snake] of Object.entries(SNAKE_CASE_KEYS)) {
      expect(snake, camel).not.toMatch(/[a-z0-9][A-Z]/);
      expect(snake, camel).toMatch(/^[A-Za-z0-9_]+$/);
    }
  });
});
