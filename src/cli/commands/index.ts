/** Every CLI command, in the order `--help` lists them. Add a new command's spec here. */
import type { CommandSpec } from '../commandSpec.js';
import { equilibriumCommand } from './equilibriumCommand.js';
import { doseCommand } from './doseCommand.js';
import { fractionateCommand } from './fractionateCommand.js';
import { calibrateCommand } from './calibrateCommand.js';
import { runCommand } from './runCommand.js';
import { demoCommand } from './demoCommand.js';
import { checkCommand } from './checkCommand.js';
import { contactCommand } from './contactCommand.js';
import { columnCommand } from './columnCommand.js';

export const COMMANDS: CommandSpec[] = [
  equilibriumCommand,
  doseCommand,
  contactCommand,
  columnCommand,
  fractionateCommand,
  calibrateCommand,
  runCommand,
  demoCommand,
  checkCommand,
];
