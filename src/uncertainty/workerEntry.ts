/**
 * Which file a worker thread of this folder loads. From the compiled library
 * (`dist/uncertainty/*.js`) the worker is the sibling `<name>.js`. From the TypeScript sources
 * (vitest, tsx) it is the sibling `<name>.ts`, loaded by a bootstrap that registers tsx's ESM
 * loader when tsx resolves; otherwise undefined, and the caller runs in its own thread (the
 * result is the same). A bootstrap that fails posts `{ type: 'error', kind: 'other', message }`.
 */
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath, pathToFileURL } from 'node:url';

/** A worker file to start directly, or a bootstrap script (eval) that registers tsx first. */
export type WorkerEntry = { kind: 'file'; url: URL } | { kind: 'eval'; code: string };

/** Locate the worker `name` (without extension, a sibling of this file); undefined when none can run. */
export function workerEntry(name: string): WorkerEntry | undefined {
  const self = import.meta.url;
  if (self.endsWith('.js')) {
    const url = new URL(`./${name}.js`, self);
    return existsSync(fileURLToPath(url)) ? { kind: 'file', url } : undefined;
  }
  const url = new URL(`./${name}.ts`, self);
  if (!existsSync(fileURLToPath(url))) return undefined;
  try {
    // tsx's ESM API (`tsx/esm/api` → dist/esm/api/index.mjs) registers its loader in the worker.
    const pkg = createRequire(self).resolve('tsx/package.json');
    const api = pathToFileURL(pkg.replace(/package\.json$/, 'dist/esm/api/index.mjs'));
    if (!existsSync(fileURLToPath(api))) return undefined;
    const code = `import(${JSON.stringify(api.href)}).then((m) => { m.register(); return import(${JSON.stringify(url.href)}); })` +
      `.catch((e) => { require('node:worker_threads').parentPort.postMessage({ type: 'error', kind: 'other', message: String(e && e.stack || e) }); });`;
    return { kind: 'eval', code };
  } catch {
    return undefined;
  }
}
