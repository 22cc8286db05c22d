/**
 * The plain splitter of quote-free CSV text (src/tables/csvTable.ts) against the full parser
 * (csv-parse with the reader's options, the reference): on random texts built from separators,
 * blanks, tabs, comment marks and both line ends, wherever the splitter answers, its records,
 * cells and line numbers are the parser's; where the parser rejects the text, the splitter leaves
 * it to the parser.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parse } from 'csv-parse/sync';
import { splitPlainCsv } from '../../src/tables/csvTable.js';

function full(text: string, delimiter: string): Array<{ cells: string[]; row: number }> | 'error' {
  try {
    const recs = parse(text, { delimiter, skip_empty_lines: true, trim: true, info: true, comment: '#', comment_no_infix: true, relax_quotes: false }) as unknown as Array<{ record: string[]; info: { lines: number } }>;
    return recs.map((r) => ({ cells: r.record, row: r.info.lines }));
  } catch {
    return 'error';
  }
}

const piece = fc.constantFrom('a', '1.5', '2,5', 'x y', ',', ';', ' ', '\t', '#', '\n', '\n', '\r\n', '-', 'n.a.', '"', '\u00a0');

describe('splitPlainCsv', () => {
  it('gives the parser\'s records and line numbers wherever it answers', () => {
    let answered = 0;
    fc.assert(fc.property(fc.array(piece, { maxLength: 40 }), fc.constantFrom(',', ';'), (parts, sep) => {
      const text = parts.join('');
      const mine = splitPlainCsv(text, sep);
      const ref = full(text, sep);
      if (mine === undefined) return;
      answered++;
      expect(ref, JSON.stringify(text)).not.toBe('error');
      expect(mine, JSON.stringify(text)).toEqual(ref);
    }), { numRuns: 1500 });
    expect(answered).toBeGreaterThan(100);
  });

  it('reads a plain table with comments, blank lines and CRLF line ends like the parser', () => {
    const text = '# invented\r\ndate,DOC (mg/L)\r\n\r\n2024-01-01, 5.1\r\n# note\r\n2024-01-02,5.3 \r\n';
    expect(splitPlainCsv(text, ',')).toEqual(full(text, ','));
    expect(splitPlainCsv(text, ',')!.map((r) => r.row)).toEqual([2, 4, 6]);
  });
});
