/**
 * The layers of src/ as an import graph (DEVELOPERS.md "Architecture"): no folder imports another
 * in a circle, and the core folders (models and numerics) and the scenario layer import nothing
 * from the edges (io, output, outputFiles, report, pipeline, cli). Type-only imports count.
 */
import { describe, expect, it } from 'vitest';
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { folderCycles, folderGraph, SRC } from './importGraph.js';

const CORE = ['core', 'units', 'numerics', 'text', 'tables', 'equilibrium', 'design', 'fractionation', 'calibration', 'surrogates', 'gac', 'uncertainty', 'indicators', 'siteSeries'];
const SCENARIO = ['scenario', 'project', 'api', 'checks'];
const EDGE = ['io', 'output', 'outputFiles', 'report', 'pipeline', 'cli'];

describe('import graph of src/', () => {
  const graph = folderGraph();

  it('every folder of src/ is placed in a layer', () => {
    const folders = readdirSync(SRC).filter((f) => statSync(join(SRC, f)).isDirectory()).sort();
    const placed = new Set([...CORE, ...SCENARIO, ...EDGE, 'kinetics']);
    expect(folders.filter((f) => !placed.has(f))).toEqual([]);
  });

  it('has no folder cycles', () => {
    expect(folderCycles(graph).map((c) => c.join(' → '))).toEqual([]);
  });

  it('the core and scenario folders import nothing from io, output, outputFiles, report, pipeline or cli', () => {
    const bad: string[] = [];
    for (const from of [...CORE, ...SCENARIO, 'kinetics']) {
      for (const [to, files] of graph.get(from) ?? []) if (EDGE.includes(to)) bad.push(`${from} → ${to} (${files.join(', ')})`);
    }
    expect(bad).toEqual([]);
  });

  it('output never imports report, outputFiles or cli; report imports only output among the edges', () => {
    const edges = (f: string) => [...(graph.get(f)?.keys() ?? [])];
    expect(edges('output').filter((t) => ['report', 'outputFiles', 'cli'].includes(t))).toEqual([]);
    expect(edges('report').filter((t) => EDGE.includes(t))).toEqual(['output']);
  });

  it('the checker finds a cycle when there is one (a graph built by hand)', () => {
    const g = new Map([['a', new Map([['b', ['a/x.ts']]])], ['b', new Map([['a', ['b/y.ts']]])]]);
    expect(folderCycles(g)).toEqual([['a', 'b', 'a']]);
  });
});
