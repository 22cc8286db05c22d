/**
 * The self-contained HTML report: one file with inline CSS and inline SVG plots; no scripts,
 * fonts, images or any other external reference (a Content-Security-Policy forbids them too).
 * Every piece of text from the model is HTML-escaped.
 */
import { cautionsOf } from './defaultCautions.js';
import { escapeHtml } from './escapeHtml.js';
import { formatNumber } from '../output/formatNumber.js';
import { formatRunDate } from './formatRunDate.js';
import type { PlotSpec, ReportModel, ReportSection, ReportTable } from '../output/reportModel.js';
import { REPORT_CSS } from './reportStyles.js';
import { SlugRegistry } from './slug.js';
import { renderPlot } from './svg/renderPlot.js';

const CSP = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";

/** Running numbers of tables and figures across the document. */
interface Counters {
  table: number;
  figure: number;
  ids: SlugRegistry;
}

/** A table cell as text: numbers through `formatNumber`, strings as given. */
export function cellText(cell: string | number | null | undefined): string {
  if (typeof cell === 'number') return formatNumber(cell);
  return cell === null || cell === undefined ? '' : String(cell);
}

/** Whether a column reads as numbers (all non-empty cells numeric or numeric-looking text). */
export function isNumericColumn(rows: ReportTable['rows'], j: number): boolean {
  let seen = 0;
  for (const r of rows) {
    const c = r[j];
    if (c === undefined || c === null || c === '') continue;
    if (typeof c !== 'number' && !/^\s*[-+−]?(\d|\.\d|∞|—\s*$)/.test(String(c))) return false;
    seen++;
  }
  return seen > 0;
}

function renderTable(t: ReportTable, n: Counters): string {
  n.table++;
  const width = Math.max(t.columns.length, ...t.rows.map((r) => r.length));
  const numeric = Array.from({ length: width }, (_, j) => isNumericColumn(t.rows, j));
  const cls = (j: number) => (numeric[j] ? ' class="n"' : '');
  const head = Array.from({ length: width }, (_, j) => `<th scope="col"${cls(j)}>${escapeHtml(t.columns[j] ?? '')}</th>`).join('');
  const body = t.rows.length
    ? t.rows.map((r) => `<tr>${Array.from({ length: width }, (_, j) => `<td${cls(j)}>${escapeHtml(cellText(r[j]))}</td>`).join('')}</tr>`).join('\n')
    : `<tr><td class="empty" colspan="${Math.max(1, width)}">No rows.</td></tr>`;
  return (
    `<div class="table-wrap"><table${width >= 10 ? ' class="wide very-wide"' : width >= 7 ? ' class="wide"' : ''}>` +
    `<caption><span class="num">Table ${n.table}.</span> ${escapeHtml(t.caption)}</caption>` +
    `<thead><tr>${head}</tr></thead><tbody>\n${body}\n</tbody></table></div>`
  );
}

function renderFigure(p: PlotSpec, n: Counters): string {
  n.figure++;
  const id = n.ids.id(p.id, 'fig-');
  return (
    `<figure id="${id}"${p.kind === 'bars' && p.compact ? ' class="compact"' : ''}>${renderPlot(p, { uid: id })}` +
    `<figcaption><span class="num">Figure ${n.figure}.</span> ${escapeHtml(p.title)}</figcaption></figure>`
  );
}

function renderSection(s: ReportSection, index: number, anchor: string, n: Counters): string {
  const parts: string[] = [`<h2><span class="num">${index + 1}</span>${escapeHtml(s.heading)}</h2>`];
  for (const w of s.warnings ?? []) parts.push(`<div class="warning" role="note"><strong>Warning</strong>${escapeHtml(w)}</div>`);
  if (s.referenceList) parts.push(`<ol class="references">${(s.paragraphs ?? []).map((para) => `<li>${escapeHtml(para)}</li>`).join('')}</ol>`);
  else for (const para of s.paragraphs ?? []) parts.push(`<p>${escapeHtml(para)}</p>`);
  for (const t of s.tables ?? []) parts.push(renderTable(t, n));
  for (const p of s.plots ?? []) parts.push(renderFigure(p, n));
  for (const note of s.notes ?? []) parts.push(`<p class="method-note">${escapeHtml(note)}</p>`);
  return `<section class="report-section" id="${anchor}">\n${parts.join('\n')}\n</section>`;
}

function counts(s: ReportSection): string {
  const f = s.plots?.length ?? 0;
  const t = s.tables?.length ?? 0;
  const bits = [t ? `${t} table${t === 1 ? '' : 's'}` : '', f ? `${f} figure${f === 1 ? '' : 's'}` : ''].filter(Boolean);
  return bits.length ? ` <span class="count">(${bits.join(', ')})</span>` : '';
}

/** The whole report as one HTML document (UTF-8 text). Deterministic for a given model. */
export function renderHtmlReport(model: ReportModel): string {
  const n: Counters = { table: 0, figure: 0, ids: new SlugRegistry() };
  const anchors = model.sections.map((s) => n.ids.id(s.id, 'sec-'));
  const date = formatRunDate(model.generatedAt);
  const title = escapeHtml(model.title);
  const header = [
    `<header class="report-header">`,
    `<p class="kicker">Activated-carbon planning report</p>`,
    `<h1>${title}</h1>`,
    model.subtitle ? `<p class="subtitle">${escapeHtml(model.subtitle)}</p>` : '',
    `<p class="meta"><span>sorbshare ${escapeHtml(model.version)}</span><span>Generated <time datetime="${escapeHtml(model.generatedAt)}">${escapeHtml(date)}</time></span></p>`,
    model.cover?.length ? `<dl class="cover">${model.cover.map((c) => `<div><dt>${escapeHtml(c.label)}</dt><dd>${escapeHtml(c.value)}</dd></div>`).join('')}</dl>` : '',
    `</header>`,
  ].join('\n');
  const cautions = `<aside class="cautions" role="note" aria-labelledby="cautions-h"><h2 id="cautions-h">Before you use these numbers</h2><ul>${cautionsOf(model.cautions)
    .map((c) => `<li>${escapeHtml(c)}</li>`)
    .join('')}</ul></aside>`;
  const cards = model.keyFigures.length
    ? `<ul class="key-figures" aria-label="Key figures">${model.keyFigures
        .map(
          (k) =>
            `<li class="card"><div class="label">${escapeHtml(k.label)}</div><div class="value${k.value.length > 22 ? ' long' : ''}">${escapeHtml(keepUnitWithNumber(k.value))}</div>${
              k.note ? `<div class="note">${escapeHtml(k.note)}</div>` : ''
            }</li>`,
        )
        .join('')}</ul>`
    : '';
  const toc = model.sections.length
    ? `<nav class="toc" aria-labelledby="toc-h"><h2 id="toc-h">Contents</h2><ol>${model.sections
        .map((s, i) => `<li><a href="#${anchors[i]}">${escapeHtml(s.heading)}</a>${counts(s)}</li>`)
        .join('')}</ol></nav>`
    : '';
  const sections = model.sections.map((s, i) => renderSection(s, i, anchors[i]!, n)).join('\n');
  const footer = [
    `<footer>`,
    `<p>${title} — generated by sorbshare ${escapeHtml(model.version)} on ${escapeHtml(date)}.</p>`,
    `<p>Planning estimates from adsorption models (equilibrium and, where given, contact and fixed-bed kinetics); see the cautions at the top of this report.</p>`,
    `</footer>`,
  ].join('\n');
  return [
    '<!DOCTYPE html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="${CSP}">`,
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<meta name="generator" content="sorbshare ${escapeHtml(model.version)}">`,
    `<title>${title}</title>`,
    `<style>${REPORT_CSS}</style>`,
    '</head>',
    '<body>',
    '<div class="page">',
    header,
    '<main>',
    cautions,
    cards,
    toc,
    sections,
    '</main>',
    footer,
    '</div>',
    '</body>',
    '</html>',
    '',
  ].join('\n');
}

/** A key figure's number and its unit on one line: "23.6 mg/L" → "23.6\u00a0mg/L" (a no-break space), so a narrow card never puts the unit alone on the next line. */
export function keepUnitWithNumber(value: string): string {
  return value.replace(/(\d) (?=[^\s\d])/g, '$1\u00a0');
}
