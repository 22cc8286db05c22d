/**
 * Writing outputs whole or not at all: everything goes to a temporary sibling first and is
 * renamed into place only when all of it was written.
 */
import { mkdirSync, renameSync, rmSync, writeFileSync, existsSync, readdirSync, mkdtempSync } from 'node:fs';
import { dirname, join, basename, resolve } from 'node:path';

/** Write one file atomically (temp file in the same folder, then rename). */
export function writeFileAtomic(path: string, content: string | Uint8Array): void {
  const dir = dirname(resolve(path));
  mkdirSync(dir, { recursive: true });
  const tmp = join(dir, `.${basename(path)}.${process.pid}.tmp`);
  try {
    writeFileSync(tmp, content);
    renameSync(tmp, path);
  } catch (e) {
    rmSync(tmp, { force: true });
    throw e;
  }
}

/**
 * Write a set of files into `outDir` (relative names, may contain sub-folders). The files are
 * written to a staging folder beside `outDir` and moved in only when all succeeded; files already
 * in `outDir` with other names are left alone.
 */
export function writeOutputDir(outDir: string, files: Record<string, string | Uint8Array>): string[] {
  const target = resolve(outDir);
  const parent = dirname(target);
  mkdirSync(parent, { recursive: true });
  const stage = mkdtempSync(join(parent, `.${basename(target)}.staging-`));
  const written: string[] = [];
  try {
    for (const [name, content] of Object.entries(files)) {
      const p = join(stage, name);
      mkdirSync(dirname(p), { recursive: true });
      writeFileSync(p, content);
    }
    if (!existsSync(target)) {
      renameSync(stage, target);
    } else {
      for (const name of Object.keys(files)) {
        const dest = join(target, name);
        mkdirSync(dirname(dest), { recursive: true });
        renameSync(join(stage, name), dest);
      }
      rmSync(stage, { recursive: true, force: true });
    }
    for (const name of Object.keys(files)) written.push(join(target, name));
    return written;
  } catch (e) {
    rmSync(stage, { recursive: true, force: true });
    throw e;
  }
}

export function listDir(dir: string): string[] {
  return existsSync(dir) ? readdirSync(dir) : [];
}
