/** The README's command reference is generated from the command specs and kept in step. */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { withCommandReference } from '../../src/cli/commandTable.js';
import { COMMANDS } from '../../src/cli/commands/index.js';

describe('README', () => {
  const readme = readFileSync('README.md', 'utf8');
  it('command reference matches the specs (run `npm run readme` after changing an option)', () => {
    expect(withCommandReference(readme)).toBe(readme);
    for (const c of COMMANDS) expect(readme).toContain(`sorbshare ${c.name}`);
  });
  it('starts with the job paragraph, then the demo and test commands, and shows the cautions', () => {
    const lines = readme.split('\n');
    expect(lines[0]).toBe('# sorbshare');
    const firstCode = readme.indexOf('```sh');
    const block = readme.slice(firstCode, readme.indexOf('```', firstCode + 5));
    expect(block).toMatch(/npm install && npm run demo/);
    expect(block).toMatch(/npm test/);
    expect(readme).toMatch(/licensed engineer/);
    expect(readme).toMatch(/pilot tests/);
    expect(readme).toMatch(/combustible/);
  });
  it('.ci/run calls exactly the README test command after npm ci', () => {
    const ci = readFileSync('.ci/run', 'utf8').trim().split('\n').filter((l) => !l.startsWith('#') && l.trim());
    expect(ci.slice(-2)).toEqual(['npm ci', 'npm test']);
  });
});
