/**
 * Bar figures: rotated category labels stay inside the figure (the PAC/GAC comparison has long
 * carbon names in a compact figure), and value labels of yearly costs are grouped numbers, not
 * exponents. Expected strings written out by hand; the label reach is the layout's own text-width
 * estimate times cos 35° (the rotation of the labels).
 */
import { describe, expect, it } from 'vitest';
import { formatSegmentValue, renderBarPlot } from '../../src/report/svg/barPlot.js';
import { textWidth } from '../../src/report/svg/textWidth.js';
import { FONT } from '../../src/report/svg/plotStyle.js';

describe('bar figures', () => {
  it('keep every rotated category label inside the figure', () => {
    for (const n of [3, 4, 5]) {
      const categories = Array.from({ length: n }, (_, i) => `Carbon ${String.fromCharCode(65 + i)} (coal-based, reactivated)`);
      const svg = renderBarPlot({ kind: 'bars', id: 'b', title: 't', yLabel: 'carbon (t/a)', compact: true, categories, stacks: [{ name: 'carbon (t/a)', values: categories.map((_, i) => 100 + i) }] });
      const labels = [...svg.matchAll(/<text x="([\d.]+)" y="[\d.]+" text-anchor="end" transform="rotate\(-35[^"]*\)">([^<]*)<\/text>/g)];
      expect(labels.length).toBe(n);
      for (const m of labels) {
        const reach = textWidth(m[2]!, FONT.tick) * Math.cos((35 * Math.PI) / 180);
        expect(Number(m[1]) - reach).toBeGreaterThanOrEqual(0);
      }
    }
  });
  it('label yearly costs as grouped numbers to 3 significant digits', () => {
    expect(formatSegmentValue(297669)).toBe('298,000');
    expect(formatSegmentValue(124)).toBe('124');
    expect(formatSegmentValue(0.05657)).toBe('0.0566');
  });
});

describe('key figure cards', () => {
  it('keep a number and its unit together (no-break space) and leave other spaces alone', async () => {
    const { keepUnitWithNumber } = await import('../../src/report/htmlReport.js');
    expect(keepUnitWithNumber('23.6 mg/L')).toBe('23.6\u00a0mg/L');
    expect(keepUnitWithNumber('0.0566 EUR')).toBe('0.0566\u00a0EUR');
    expect(keepUnitWithNumber('Carbon B (wood-based)')).toBe('Carbon B (wood-based)');
    expect(keepUnitWithNumber('1 goal not met')).toBe('1\u00a0goal not met');
  });
});
