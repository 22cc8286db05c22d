/** `sorbshare check` end to end: every case printed with its source and the provenance of its expected value. */
import { beforeAll, describe, expect, it } from 'vitest';
import { readdirSync } from 'node:fs';
import { requireBuild, runBin } from '../helpers/cliHarness.js';

beforeAll(() => requireBuild());

describe('sorbshare check', () => {
  const folders = readdirSync('fixtures/checks', { withFileTypes: true }).filter((d) => d.isDirectory());
  it('--json gives each case its provenance, one of the three labels', () => {
    const r = runBin('check', '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.cases).toHaveLength(folders.length);
    for (const c of j.cases) expect(['published table', 'closed form', 'computed from a published rule']).toContain(c.provenance);
    expect(j.cases.find((c: { id: string }) => c.id === 'k-conversion-ug').provenance).toBe('computed from a published rule');
  });
  it('the text names source and provenance under every case and counts the labels', () => {
    const r = runBin('check');
    expect(r.code).toBe(0);
    expect(r.out.match(/^ {6}source: /gm)).toHaveLength(folders.length);
    expect(r.out.match(/^ {6}provenance: (closed form|computed from a published rule|published table)$/gm)).toHaveLength(folders.length);
    expect(r.out).toMatch(/11 of 11 check cases agree \(3 closed form, 8 computed from a published rule\)\./);
    expect(r.out).not.toMatch(/published check cases/);
  });
});
