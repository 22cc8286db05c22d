/**
 * `sorbshare demo --contact` runs the demo plant under PAC contact conditions: the project it
 * loads is fixtures/demo/project-contact.json (a 30-minute stirred contact tank, 3 days of carbon
 * age, kinetic data on the PAC carbons), marked as the demo. The full contact run takes minutes
 * of CPU, so it is not run here; tests/pipeline/pacContactRun.test.ts runs the contact pipeline.
 * Demo data invented; no check values.
 */
import { describe, expect, it } from 'vitest';
import { basename } from 'node:path';
import { demoCommand, demoProjectPath } from '../../src/cli/commands/demoCommand.js';
import { loadProject } from '../../src/io/loadProject.js';

describe('demo --contact', () => {
  it('is a switch of the demo command', () => {
    const o = demoCommand.options.find((x) => x.flags === '--contact');
    expect(o).toBeDefined();
    expect(o!.parse ?? o!.default).toBeUndefined();
  });

  it('loads the contact variant of the demo plant (stirred tank 30 min, carbon age 3 d, PAC kinetics), marked as the demo; without it the equilibrium demo', () => {
    expect(basename(demoProjectPath())).toBe('project.json');
    expect(basename(demoProjectPath(true))).toBe('project-contact.json');
    const plain = loadProject(demoProjectPath(), { demo: true });
    expect(plain.project.site.pacContact).toBeUndefined();
    const contact = loadProject(demoProjectPath(true), { demo: true });
    expect(contact.provenance.demo).toBe(true);
    expect(contact.project.site.pacContact).toEqual({ kind: 'stirred', contactTimeS: 1800, carbonAgeS: 3 * 86400 });
    const pac = contact.project.carbons.filter((c) => c.type === 'PAC' && c.kinetics?.particleRadiusM !== undefined);
    expect(pac.length).toBe(2);
  });
});
