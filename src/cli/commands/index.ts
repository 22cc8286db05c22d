/** Every CLI command, in the order `--help` lists them. Add a new command's spec here. */
import type { CommandSpec } from '../commandSpec.js';
import { equilibriumCommand } from './equilibriumCommand.js';
import { doseCommand } from './doseCommand.js';

export const COMMANDS: CommandSpec[] = [
  equilibriumCommand,
  doseCommand,
];
