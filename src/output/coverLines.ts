/** The report's cover block from the project file's optional cover keys, in a fixed order. */
import type { CoverLine } from './reportModel.js';
import type { ProjectCover } from '../project/projectTypes.js';

const ORDER: ReadonlyArray<[keyof ProjectCover, string]> = [
  ['client', 'Client'], ['projectNumber', 'Project number'], ['author', 'Author'], ['checker', 'Checked by'], ['revision', 'Revision'], ['date', 'Date'],
];

export function coverLines(cover: ProjectCover | undefined): CoverLine[] {
  if (!cover) return [];
  return ORDER.flatMap(([k, label]) => (cover[k] !== undefined ? [{ label, value: cover[k]! }] : []));
}
