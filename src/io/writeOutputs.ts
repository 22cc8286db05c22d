/**
 * Writing outputs whole or not at all.
 *
 * A file goes to a temporary sibling and is renamed into place. A folder is written as a new
 * folder beside the old one (`.NAME.staging-PID-…`), marked complete by a rename
 * (`.NAME.ready-PID-…`), and swapped in with two renames (old → `.NAME.old-PID-…`, new → NAME):
 * a killed or concurrent run leaves the old set or the new set, never a mix. The only moment
 * without a folder at NAME lies between the two renames (two system calls); the next run puts the
 * complete set back (a ready folder first, else the old one). Leftovers of runs that are no longer
 * alive are removed by the next run; those of live runs are left alone.
 *
 * File-system failures are InputError naming the option (`--out`), never a stack trace.
 */
import { mkdirSync, renameSync, rmSync, writeFileSync, existsSync, readdirSync, mkdtempSync } from 'node:fs';
import { dirname, join, basename, resolve } from 'node:path';
import { randomBytes } from 'node:crypto';
import { InputError } from '../core/errors.js';

function fsError(e: unknown, what: string, option: string): InputError {
  const err = e as NodeJS.ErrnoException;
  const reason = err.code === 'EACCES' || err.code === 'EPERM' ? 'no write permission' : err.code === 'ENOSPC' ? 'the disk is full' : err.code === 'EROFS' ? 'read-only file system' : err.code === 'ENOTDIR' ? 'a part of the path is a file' : err.code === 'EISDIR' ? 'it is a folder' : (err.code ?? err.message);
  return new InputError(`cannot write ${what} (${reason}); expected a writable place`, { option });
}

/** Write one file atomically (temp file in the same folder, then rename). @throws InputError naming `option` */
export function writeFileAtomic(path: string, content: string | Uint8Array, option = '--out'): void {
  const target = resolve(path);
  const dir = dirname(target);
  const tmp = join(dir, `.${basename(target)}.${process.pid}.${randomBytes(4).toString('hex')}.tmp`);
  try {
    mkdirSync(dir, { recursive: true });
    writeFileSync(tmp, content);
    renameSync(tmp, target);
  } catch (e) {
    rmSync(tmp, { force: true });
    throw fsError(e, `"${path}"`, option);
  }
}

function alive(pid: number): boolean {
  if (pid === process.pid) return true;
  try { process.kill(pid, 0); return true; } catch (e) { return (e as NodeJS.ErrnoException).code === 'EPERM'; }
}

const LEFTOVER = /^\.(.+)\.(staging|ready|old)-(\d+)-[^/]*$/;

/**
 * Put back a folder a killed run left missing (its ready set, else its old set) and remove the
 * staging, ready and old folders of `outDir` left by runs that are no longer alive.
 */
export function recoverOutputDir(outDir: string): void {
  const target = resolve(outDir);
  const parent = dirname(target);
  const base = basename(target);
  if (!existsSync(parent)) return;
  const dead = readdirSync(parent).flatMap((name) => {
    const m = LEFTOVER.exec(name);
    return m && m[1] === base && !alive(Number(m[3])) ? [{ name, kind: m[2]! }] : [];
  });
  if (!existsSync(target)) {
    const back = dead.find((d) => d.kind === 'ready') ?? dead.find((d) => d.kind === 'old');
    if (back) {
      try { renameSync(join(parent, back.name), target); dead.splice(dead.indexOf(back), 1); } catch { /* another run got there first */ }
    }
  }
  for (const d of dead) rmSync(join(parent, d.name), { recursive: true, force: true });
}

/**
 * Write a set of files as the whole content of `outDir` (relative names, may contain
 * sub-folders), replacing an existing folder as a whole. Check the place first with
 * `checkOutputFolder` (it never replaces a folder that holds inputs or other files).
 * @returns the paths written
 * @throws InputError naming `option` when the folder cannot be written
 */
export function writeOutputDir(outDir: string, files: Record<string, string | Uint8Array>, option = '--out'): string[] {
  const target = resolve(outDir);
  const parent = dirname(target);
  const base = basename(target);
  const tag = () => `${process.pid}-${randomBytes(4).toString('hex')}`;
  let stage: string | undefined;
  try {
    mkdirSync(parent, { recursive: true });
    recoverOutputDir(target);
    stage = mkdtempSync(join(parent, `.${base}.staging-${process.pid}-`));
    for (const [name, content] of Object.entries(files)) {
      const p = join(stage, name);
      mkdirSync(dirname(p), { recursive: true });
      writeFileSync(p, content);
    }
    const ready = join(parent, `.${base}.ready-${tag()}`);
    renameSync(stage, ready); // the new set is complete
    stage = ready;
    swapIn(ready, target, () => join(parent, `.${base}.old-${tag()}`));
    stage = undefined;
  } catch (e) {
    if (stage) rmSync(stage, { recursive: true, force: true });
    throw e instanceof InputError ? e : fsError(e, `the output folder "${outDir}"`, option);
  }
  return Object.keys(files).map((name) => join(target, name));
}

/** Rename `ready` to `target`, moving an existing `target` aside first (retried when a concurrent run swaps in between). */
function swapIn(ready: string, target: string, oldName: () => string): void {
  for (let attempt = 0; attempt < 20; attempt++) {
    try {
      renameSync(ready, target); // succeeds when target is absent or an empty folder
      return;
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      if (code !== 'ENOTEMPTY' && code !== 'EEXIST') throw e;
    }
    const old = oldName();
    try {
      renameSync(target, old);
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== 'ENOENT') throw e;
      continue; // a concurrent run moved it first
    }
    try {
      renameSync(ready, target);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      if (code !== 'ENOTEMPTY' && code !== 'EEXIST') { renameSync(old, target); throw e; }
      rmSync(old, { recursive: true, force: true });
      continue; // a concurrent run swapped its set in between: go round again
    }
    rmSync(old, { recursive: true, force: true });
    return;
  }
  throw new Error('the output folder kept changing under a concurrent run');
}

export function listDir(dir: string): string[] {
  return existsSync(dir) ? readdirSync(dir) : [];
}
