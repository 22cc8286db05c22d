/**
 * The synthetic report model of the rendering tests: fixtures/report/synthetic-model.json (smooth
 * invented curves and hostile text; a rendering test, not check values) plus one section that JSON
 * cannot hold (NaN and infinite values).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { ReportModel } from '../../src/output/reportModel.js';

export const FIXTURE = fileURLToPath(new URL('../../fixtures/report/synthetic-model.json', import.meta.url));

export function syntheticModel(): ReportModel {
  const model = JSON.parse(readFileSync(FIXTURE, 'utf8')) as ReportModel;
  model.sections.push({
    id: 'non-finite',
    heading: 'Non-finite values (synthetic)',
    plots: [
      {
        kind: 'xy', id: 'nan-values', title: 'Series with NaN and infinite values', xLabel: 'x (–)', yLabel: 'y (–)',
        series: [
          { name: 'gappy', points: [[0, 1], [1, NaN], [2, 3], [3, Infinity], [4, 2], [5, 2.5]] },
          { name: 'all NaN', style: 'points', points: [[NaN, NaN]] },
        ],
      },
    ],
  });
  return model;
}
