/**
 * The report's stylesheet, inlined into the HTML file: system fonts only, sober colours of our
 * own (deep slate-teal headings, amber cautions), and an A4 print layout.
 */

export const REPORT_CSS = `
:root {
  --ink: #1f2a30; --muted: #5b6870; --line: #d8dee2; --paper: #ffffff; --desk: #eef1f3;
  --brand: #18424f; --brand-2: #2c7a7b; --accent-bg: #e8f2f2;
  --caution: #9a5b00; --caution-bg: #fff6e5; --warn: #a1261d; --warn-bg: #fdf0ee;
}
* { box-sizing: border-box; }
html { -webkit-text-size-adjust: 100%; }
body {
  margin: 0; background: var(--desk); color: var(--ink);
  font: 15px/1.55 system-ui, 'Segoe UI', 'Helvetica Neue', 'DejaVu Sans', Arial, sans-serif;
}
.page { max-width: 920px; margin: 24px auto; background: var(--paper); box-shadow: 0 1px 4px rgba(20, 40, 50, .12); }
.report-header { background: var(--brand); color: #fff; padding: 28px 40px 22px; border-bottom: 4px solid var(--brand-2); }
.report-header .kicker { margin: 0 0 6px; font-size: 12px; letter-spacing: .08em; text-transform: uppercase; color: #b9d8d8; }
.report-header h1 { margin: 0; font-size: 28px; line-height: 1.2; font-weight: 650; }
.report-header .subtitle { margin: 6px 0 0; font-size: 17px; color: #dbe9ea; }
.report-header .meta { margin: 14px 0 0; font-size: 13px; color: #b9d8d8; }
.report-header .meta span + span::before { content: '·'; margin: 0 8px; color: #7fa9ab; }
main { padding: 8px 40px 24px; }
.cautions { margin: 22px 0; padding: 14px 18px 12px 20px; background: var(--caution-bg); border: 1px solid #f0d9a8; border-left: 6px solid var(--caution); border-radius: 4px; }
.cautions h2 { margin: 0 0 6px; font-size: 15px; color: var(--caution); text-transform: uppercase; letter-spacing: .05em; border: 0; padding: 0; }
.cautions ul { margin: 0; padding-left: 20px; }
.cautions li { margin: 3px 0; }
.key-figures { display: grid; grid-template-columns: repeat(auto-fit, minmax(190px, 1fr)); gap: 12px; margin: 22px 0; padding: 0; list-style: none; }
.card { background: var(--accent-bg); border: 1px solid #cfe2e2; border-top: 3px solid var(--brand-2); border-radius: 4px; padding: 12px 14px; }
.card .label { font-size: 13px; color: var(--muted); line-height: 1.35; }
.card .value { font-size: 21px; font-weight: 650; color: var(--brand); margin-top: 2px; font-variant-numeric: tabular-nums; overflow-wrap: break-word; }
.card .value.long { font-size: 17px; }
.card .note { font-size: 12.5px; color: var(--muted); margin-top: 3px; }
nav.toc { margin: 22px 0 10px; padding: 12px 18px; border: 1px solid var(--line); border-radius: 4px; }
nav.toc h2 { margin: 0 0 4px; font-size: 15px; border: 0; padding: 0; color: var(--brand); }
nav.toc ol { margin: 0; padding-left: 22px; columns: 2; column-gap: 32px; }
nav.toc li { margin: 2px 0; break-inside: avoid; }
nav.toc a { color: var(--ink); text-decoration: none; }
nav.toc a:hover { text-decoration: underline; }
nav.toc .count { color: var(--muted); font-size: 12.5px; }
section.report-section { margin-top: 30px; }
section.report-section > h2 { font-size: 21px; color: var(--brand); margin: 0 0 10px; padding-bottom: 5px; border-bottom: 2px solid var(--line); }
section.report-section > h2 .num { color: var(--brand-2); margin-right: 10px; }
p { margin: 8px 0; }
.warning { margin: 12px 0; padding: 9px 14px; background: var(--warn-bg); border-left: 5px solid var(--warn); border-radius: 3px; }
.warning strong { color: var(--warn); margin-right: 6px; }
.table-wrap { margin: 16px 0; overflow-x: auto; }
table { border-collapse: collapse; width: auto; min-width: 60%; max-width: 100%; font-size: 13.5px; }
caption { caption-side: top; text-align: left; font-weight: 600; color: var(--ink); padding: 0 0 6px; }
caption .num, figcaption .num { color: var(--brand-2); }
th, td { padding: 5px 10px; border-bottom: 1px solid var(--line); vertical-align: top; text-align: left; }
thead th { background: #f1f5f6; border-bottom: 2px solid #b9c6cc; font-weight: 600; }
tbody tr:nth-child(even) td { background: #fafbfc; }
td.n, th.n { text-align: right; font-variant-numeric: tabular-nums; }
td.n { white-space: nowrap; }
table.wide { width: 100%; font-size: 12px; }
table.wide th, table.wide td { padding: 4px 6px; }
table.very-wide { font-size: 11px; }
table.very-wide th, table.very-wide td { padding: 3px 4px; }
td.empty { color: var(--muted); font-style: italic; }
figure { margin: 18px 0; padding: 12px 12px 6px; border: 1px solid var(--line); border-radius: 4px; }
figure svg.plot { display: block; width: 100%; height: auto; max-width: 720px; margin: 0 auto; }
.cover { display: grid; grid-template-columns: repeat(auto-fit, minmax(200px, 1fr)); gap: 4px 18px; margin: 12px 0 0; font-size: 0.92em; }
.cover div { display: flex; gap: 8px; border-bottom: 1px solid var(--line); padding: 3px 0; }
.cover dt { font-weight: 600; min-width: 8.5em; }
.cover dd { margin: 0; }
ol.references li { margin: 0 0 6px; }
.method-note { font-size: 0.88em; color: #5b6870; }
figure.compact { display: inline-block; vertical-align: top; width: calc(33.3% - 10px); min-width: 220px; margin: 10px 10px 10px 0; box-sizing: border-box; }
figure.compact svg.plot { max-width: 300px; }
figcaption { font-size: 13.5px; margin: 8px 4px 4px; }
footer { padding: 16px 40px 24px; border-top: 1px solid var(--line); font-size: 12.5px; color: var(--muted); }
footer p { margin: 3px 0; }
@media (max-width: 640px) {
  .report-header, main, footer { padding-left: 16px; padding-right: 16px; }
  nav.toc ol { columns: 1; }
}
@page { size: A4; margin: 14mm 13mm 16mm; }
@media print {
  body { background: #fff; font-size: 10.5pt; }
  .page { max-width: none; margin: 0; box-shadow: none; }
  .report-header, .card, .cautions, .warning, thead th { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
  .report-header { padding: 16px 20px 14px; }
  .key-figures { grid-template-columns: repeat(auto-fit, minmax(150px, 1fr)); gap: 8px; }
  .card .value { font-size: 14pt; }
  .card .value.long { font-size: 12pt; }
  main, footer { padding-left: 0; padding-right: 0; }
  nav.toc a { color: inherit; }
  figure, .card, .cautions, .warning, tr, caption { break-inside: avoid; page-break-inside: avoid; }
  .report-section { break-before: page; page-break-before: always; }
  figure.compact { width: 31%; min-width: 0; }
  h2, caption { break-after: avoid; page-break-after: avoid; }
  thead { display: table-header-group; }
  .table-wrap { overflow: visible; }
}
`;
