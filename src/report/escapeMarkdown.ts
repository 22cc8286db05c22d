/**
 * Escaping of model text for the Markdown summary (CommonMark: any ASCII punctuation may be
 * backslash-escaped). Raw HTML can never start (`<` is escaped) nor an entity (`&name;`), and
 * emphasis, links, code spans and table pipes are neutralised; plain text stays readable.
 */

/** Text for inline Markdown (paragraphs, list items, headings): one line, no live markup. */
export function escapeMarkdown(text: string): string {
  return (
    String(text)
      .replace(/\r?\n|\r/g, ' ')
      // eslint-disable-next-line no-control-regex
      .replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/g, '')
      .replace(/[\\`*[\]<>|~]/g, (c) => `\\${c}`)
      // entity-like "&amp;" or "&#60;" would be decoded by a Markdown renderer
      .replace(/&(?=#?[A-Za-z0-9]+;)/g, '\\&')
      // underscores only matter at word edges (intraword _ is literal in CommonMark)
      .replace(/(^|[^A-Za-z0-9])_|_(?=$|[^A-Za-z0-9])/g, (m) => m.replace('_', '\\_'))
      // a line start that would open a heading, list, quote or ordered list
      .replace(/^(\s*)([#+\-=])(?=\s|$)/, '$1\\$2')
      .replace(/^(\s*\d+)([.)])(?=\s|$)/, '$1\\$2')
  );
}

/** A Markdown table: header, alignment row (right for numeric columns) and rows, all escaped. */
export function markdownTable(columns: readonly string[], rows: ReadonlyArray<readonly string[]>, numeric: readonly boolean[]): string {
  const width = Math.max(columns.length, ...rows.map((r) => r.length), 1);
  const cell = (t: string | undefined) => escapeMarkdown(t ?? '').trim() || ' ';
  const line = (cells: ReadonlyArray<string | undefined>) => `| ${Array.from({ length: width }, (_, j) => cell(cells[j])).join(' | ')} |`;
  const align = `| ${Array.from({ length: width }, (_, j) => (numeric[j] ? '---:' : '---')).join(' | ')} |`;
  return [line(columns), align, ...rows.map(line)].join('\n');
}
