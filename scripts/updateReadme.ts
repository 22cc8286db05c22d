/** `npm run readme`: regenerate the command reference in README.md from the command specs. */
import { readFileSync, writeFileSync } from 'node:fs';
import { withCommandReference } from '../src/cli/commandTable.js';

const text = readFileSync('README.md', 'utf8');
const next = withCommandReference(text);
if (next !== text) {
  writeFileSync('README.md', next);
  console.log('README.md: command reference updated');
} else console.log('README.md: command reference already up to date');
