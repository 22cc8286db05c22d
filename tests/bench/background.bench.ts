/**
 * Figures for issue 3: fractionation (M = 3, 10 points), `--components auto`, and an EBC
 * calibration on 24 jar tests, on the invented fixtures. Each figure is the first (cold) run and
 * the median of 7 further runs in the same process.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fractionate } from '../../src/fractionation/fractionate.js';
import { calibrate } from '../../src/calibration/calibrate.js';
import type { BenchFigure } from './run.js';

function timed(f: () => unknown): { first: number; median: number } {
  let t = performance.now();
  f();
  const first = performance.now() - t;
  const times: number[] = [];
  for (let k = 0; k < 7; k++) {
    t = performance.now();
    f();
    times.push(performance.now() - t);
  }
  times.sort((a, b) => a - b);
  return { first, median: times[3]! };
}

export async function bench(): Promise<BenchFigure[]> {
  const root = process.cwd();
  const iso = readFileSync(join(root, 'fixtures/fractionation/site-effluent-isotherm.csv'), 'utf8');
  const jar = readFileSync(join(root, 'fixtures/calibration/site-jartests.csv'), 'utf8');
  const compound = JSON.parse(readFileSync(join(root, 'fixtures/calibration/target-compound.json'), 'utf8'));
  const m3 = timed(() => fractionate(iso, { components: 3 }));
  const auto = timed(() => fractionate(iso, { components: 'auto' }));
  const ebc = timed(() => calibrate(jar, { model: 'ebc', compound, docMgPerL: 8.2 }));
  return [
    { name: 'fractionate M=3, 10 points (first run)', value: m3.first, unit: 'ms', target: '< 100 ms' },
    { name: 'fractionate M=3, 10 points (median)', value: m3.median, unit: 'ms', target: '< 100 ms' },
    { name: 'fractionate --components auto (first run)', value: auto.first, unit: 'ms', target: '< 1000 ms' },
    { name: 'fractionate --components auto (median)', value: auto.median, unit: 'ms', target: '< 1000 ms' },
    { name: 'calibrate ebc, 24 rows (first run)', value: ebc.first, unit: 'ms', target: '< 300 ms' },
    { name: 'calibrate ebc, 24 rows (median)', value: ebc.median, unit: 'ms', target: '< 300 ms' },
  ];
}
