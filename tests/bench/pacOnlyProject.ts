/**
 * A copy of a project without its GAC carbons (and without the GAC draws of its uncertainty
 * block): the PAC-only demo project that issue 8's speed targets were set on, before the GAC
 * fixed bed, its column fit and its draws entered the demo (issue 10). The benches print the
 * figures with and without the GAC carbon side by side. Demo data invented.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';

/** Write `project-pac-only.json` beside `projectPath` (same folder, so its tables resolve) and return its path. */
export function pacOnlyProject(projectPath: string): string {
  const project = JSON.parse(readFileSync(projectPath, 'utf8')) as { carbons: Array<{ type: string }>; uncertainty?: Record<string, unknown> };
  project.carbons = project.carbons.filter((c) => c.type !== 'GAC');
  if (project.uncertainty) delete project.uncertainty.gac_draws;
  const out = join(dirname(projectPath), 'project-pac-only.json');
  writeFileSync(out, JSON.stringify(project, null, 2));
  return out;
}
