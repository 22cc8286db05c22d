/**
 * The References section of a report: every source cited anywhere in the model's text (inline
 * author–year), with its full citation, alphabetically; then the method notes on how firmly the
 * citation details were checked (kept out of the client sentences).
 */
import { REFERENCES, type Reference } from './referenceList.js';
import type { ReportModel, ReportSection } from './reportModel.js';

/** All text of the model a reader sees (paragraphs, captions, cells, warnings, key figures, plot titles). */
export function modelText(model: ReportModel): string {
  const parts: string[] = [model.title, model.subtitle ?? '', ...model.cautions];
  for (const k of model.keyFigures) parts.push(k.label, k.value, k.note ?? '');
  for (const s of model.sections) {
    parts.push(s.heading, ...(s.paragraphs ?? []), ...(s.warnings ?? []));
    for (const t of s.tables ?? []) parts.push(t.caption, ...t.columns, ...t.rows.flat().map(String));
    for (const p of s.plots ?? []) parts.push(p.title);
  }
  return parts.join('\n');
}

/** The sources cited in `text`, alphabetically by inline form. */
export function citedReferences(text: string): Reference[] {
  return REFERENCES.filter((r) => r.patterns.some((p) => p.test(text))).sort((a, b) => a.inline.localeCompare(b.inline));
}

export function referencesSection(model: ReportModel): ReportSection {
  const cited = citedReferences(modelText(model));
  const toConfirm = cited.filter((r) => r.firmness === 'details to confirm');
  return {
    id: 'references', heading: 'References', referenceList: true,
    paragraphs: cited.map((r) => r.full),
    tables: [],
    warnings: [],
    ...(toConfirm.length
      ? { notes: [`Method notes: the bibliographic details of ${toConfirm.map((r) => r.inline).join(', ')} were compiled without the original at hand; confirm volume, pages and authors before quoting them. The methods are used as the tool implements and tests them.`] }
      : {}),
  };
}
