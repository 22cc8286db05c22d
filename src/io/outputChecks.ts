/**
 * Checks on `--out` before anything is computed or written: the output never names an input, an
 * output folder never holds an input (it is replaced as a whole), an existing folder is replaced
 * only when it is empty or holds an earlier run (its `run.json`), an output file is not a folder,
 * and the place is writable. Problems are InputError naming the option (exit 2).
 */
import { accessSync, constants, existsSync, readdirSync, realpathSync, statSync } from 'node:fs';
import { dirname, relative, resolve, isAbsolute, sep } from 'node:path';
import { InputError } from '../core/errors.js';
import { isXlsxPath, splitSheetPath } from './xlsxSheet.js';

/** The file every output folder holds; its presence marks a folder that may be replaced. */
export const OUTPUT_FOLDER_MARK = 'run.json';

function real(path: string): string {
  const p = isXlsxPath(path) ? splitSheetPath(path).file : path;
  const abs = resolve(p);
  try { return realpathSync(abs); } catch { /* not there yet: resolve the nearest existing parent */ }
  const parent = dirname(abs);
  if (parent === abs) return abs;
  return resolve(real(parent), abs.slice(parent.length + (parent.endsWith(sep) ? 0 : 1)));
}

function inside(child: string, parent: string): boolean {
  const rel = relative(parent, child);
  return rel === '' || (!rel.startsWith('..') && !isAbsolute(rel));
}

/** The nearest existing folder at or above `p`. */
function existingAncestor(p: string): string {
  let d = resolve(p);
  while (!existsSync(d)) { const up = dirname(d); if (up === d) break; d = up; }
  return d;
}

function writable(dir: string, option: string): void {
  try { accessSync(dir, constants.W_OK | constants.X_OK); } catch {
    throw new InputError(`cannot write into the folder "${dir}" (no write permission); expected a writable place`, { option });
  }
}

/**
 * Check an output folder. @param inputs paths of every input file of the run
 * @throws InputError naming `option`
 */
export function checkOutputFolder(outDir: string, inputs: readonly string[], option = '--out'): void {
  if (outDir.trim() === '') throw new InputError('empty path; expected an output folder', { option });
  const target = real(outDir);
  for (const input of inputs) {
    const inp = real(input);
    if (inside(inp, target)) {
      throw new InputError(`the output folder "${outDir}" ${inp === target ? 'is' : 'holds'} the input ${input}; it is replaced as a whole, so expected a folder apart from the inputs`, { option });
    }
  }
  if (existsSync(target)) {
    const st = statSync(target);
    if (!st.isDirectory()) throw new InputError(`"${outDir}" is an existing file; expected a folder (new, empty, or an earlier output folder)`, { option });
    const entries = readdirSync(target);
    if (entries.length > 0 && !entries.includes(OUTPUT_FOLDER_MARK)) {
      throw new InputError(`the folder "${outDir}" exists and holds files that are not sorbshare results (no ${OUTPUT_FOLDER_MARK}); it would be replaced as a whole, so expected a new or empty folder or an earlier output folder`, { option });
    }
  }
  const ancestor = existingAncestor(dirname(target));
  if (!statSync(ancestor).isDirectory()) throw new InputError(`"${ancestor}" is a file; expected a folder path`, { option });
  writable(ancestor, option);
}

/**
 * Check an output file. @param inputs paths of every input file of the command
 * @throws InputError naming `option`
 */
export function checkOutputFile(outFile: string, inputs: readonly string[], option = '--out'): void {
  if (outFile.trim() === '') throw new InputError('empty path; expected an output file', { option });
  const target = real(outFile);
  for (const input of inputs) {
    if (real(input) === target) throw new InputError(`"${outFile}" is an input of this command; expected a new file name (the input would be overwritten)`, { option });
  }
  if (existsSync(target) && statSync(target).isDirectory()) throw new InputError(`"${outFile}" is a folder; expected a file name`, { option });
  const ancestor = existingAncestor(dirname(target));
  if (!statSync(ancestor).isDirectory()) throw new InputError(`"${ancestor}" is a file; expected a folder path`, { option });
  writable(ancestor, option);
}
