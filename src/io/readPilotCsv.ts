/**
 * Read a pilot CSV file (file access through readFiles.ts) and parse it with `parsePilotCsv`
 * (src/surrogates/pilotCsv.ts). @throws InputError naming the file (and row and column).
 */
import { parsePilotCsv, type PilotData } from '../surrogates/pilotCsv.js';
import { readTextFile } from './readFiles.js';

export function readPilotCsv(path: string, knownCompoundIds?: readonly string[]): PilotData {
  return parsePilotCsv(readTextFile(path, 'pilot CSV file'), path, knownCompoundIds);
}
