/**
 * `npm run bench`: runs every tests/bench/*.bench.ts and prints its figures beside the targets.
 * Benchmarks print figures; they are not pass/fail tests.
 */
import { readdirSync } from 'node:fs';
import { join, dirname } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export interface BenchFigure {
  name: string;
  value: number;
  unit: string;
  target?: string;
}

const here = dirname(fileURLToPath(import.meta.url));
const only = process.argv.slice(2);
const files = readdirSync(here).filter((f) => f.endsWith('.bench.ts') && (only.length === 0 || only.some((o) => f.includes(o)))).sort();
const rows: Array<BenchFigure & { file: string }> = [];
for (const f of files) {
  const mod = (await import(pathToFileURL(join(here, f)).href)) as { bench: () => Promise<BenchFigure[]> };
  process.stderr.write(`bench: ${f} …\n`);
  for (const fig of await mod.bench()) rows.push({ ...fig, file: f });
}
const fmt = (v: number) => (Math.abs(v) >= 100 ? v.toFixed(0) : Math.abs(v) >= 1 ? v.toFixed(2) : v.toPrecision(3));
const w = Math.max(...rows.map((r) => r.name.length), 10);
console.log(`${'figure'.padEnd(w)}  ${'value'.padStart(12)}  unit        target`);
for (const r of rows) console.log(`${r.name.padEnd(w)}  ${fmt(r.value).padStart(12)}  ${r.unit.padEnd(10)}  ${r.target ?? ''}`);
console.log(`\nnode ${process.version}, ${process.platform}/${process.arch}; one core unless stated`);
