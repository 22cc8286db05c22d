import { describe, expect, it } from 'vitest';
import { createProgressBar } from '../../src/cli/progressBar.js';

describe('progress bar (stderr only)', () => {
  it('redraws one line in place on a terminal, throttled, and ends the line', () => {
    const out: string[] = [];
    let t = 0;
    const bar = createProgressBar({ total: 1000, label: 'Monte Carlo', write: (s) => out.push(s), isTTY: true, width: 10, now: () => t });
    bar.update(100); t += 10; bar.update(200); t += 200; bar.update(500);
    bar.finish(); bar.finish();
    expect(out).toEqual([
      '\rMonte Carlo [#.........]  10 % 100/1000',
      '\rMonte Carlo [#####.....]  50 % 500/1000',
      '\rMonte Carlo [##########] 100 % 1000/1000\n',
    ]);
  });

  it('prints an occasional plain line (each quarter) when not a terminal', () => {
    const out: string[] = [];
    const bar = createProgressBar({ total: 100, label: 'MC', write: (s) => out.push(s), isTTY: false, width: 4 });
    for (let d = 10; d <= 100; d += 10) bar.update(d);
    bar.finish();
    expect(out).toEqual(['MC [#...]  30 % 30/100\n', 'MC [##..]  50 % 50/100\n', 'MC [###.]  80 % 80/100\n', 'MC [####] 100 % 100/100\n']);
    expect(out.every((l) => !l.includes('\r'))).toBe(true);
  });
});
