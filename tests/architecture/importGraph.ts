/**
 * The folder import graph of src/: every relative import (static `import … from`, `export … from`
 * and dynamic `import()`), type-only imports included, folded to the first folder under src/.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { dirname, join, relative, resolve, sep } from 'node:path';

export const SRC = resolve(import.meta.dirname, '../../src');

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((f) => {
    const p = join(dir, f);
    return statSync(p).isDirectory() ? files(p) : p.endsWith('.ts') ? [p] : [];
  });
}

/** Folder of a file under src/ ('.' for files directly in src/). */
export function folderOf(file: string): string {
  const rel = relative(SRC, file).split(sep);
  return rel.length > 1 ? rel[0]! : '.';
}

const IMPORT = /(?:import|export)\s[^'"]*?from\s*['"](\.{1,2}\/[^'"]+)['"]|import\(\s*['"](\.{1,2}\/[^'"]+)['"]\s*\)/g;

/** Edges folder → folder with the files that make each one. */
export function folderGraph(): Map<string, Map<string, string[]>> {
  const graph = new Map<string, Map<string, string[]>>();
  for (const file of files(SRC)) {
    const from = folderOf(file);
    const text = readFileSync(file, 'utf8');
    for (const m of text.matchAll(IMPORT)) {
      const spec = m[1] ?? m[2]!;
      const to = folderOf(resolve(dirname(file), spec));
      if (to === from) continue;
      const edges = graph.get(from) ?? new Map<string, string[]>();
      graph.set(from, edges);
      const list = edges.get(to) ?? [];
      list.push(relative(SRC, file));
      edges.set(to, list);
    }
  }
  return graph;
}

/** Every elementary cycle found by depth-first search (each as folder list). */
export function folderCycles(graph: Map<string, Map<string, string[]>>): string[][] {
  const cycles: string[][] = [];
  const seen = new Set<string>();
  const nodes = [...graph.keys()].sort();
  for (const start of nodes) {
    const stack: string[] = [];
    const visit = (n: string) => {
      stack.push(n);
      for (const next of [...(graph.get(n)?.keys() ?? [])].sort()) {
        if (next === start) {
          const key = [...stack].sort().join('>');
          if (!seen.has(key)) { seen.add(key); cycles.push([...stack, start]); }
        } else if (next > start && !stack.includes(next)) visit(next);
      }
      stack.pop();
    };
    visit(start);
  }
  return cycles;
}
