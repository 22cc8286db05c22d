/**
 * An error thrown in a worker thread, as plain data for postMessage, and the same error type
 * rebuilt in the thread that receives it: InputError (with what was expected and where) and
 * ComputationError keep their type, anything else is "other" with its stack.
 */
import { ComputationError, InputError } from '../core/errors.js';

export interface WorkerErrorMessage {
  type: 'error';
  kind: 'input' | 'computation' | 'other';
  message: string;
  expected?: string;
  location?: InputError['location'];
}

/** `e` as a message. */
export function workerErrorMessage(e: unknown): WorkerErrorMessage {
  if (e instanceof InputError) return { type: 'error', kind: 'input', message: e.message, expected: e.expected, location: e.location };
  if (e instanceof ComputationError) return { type: 'error', kind: 'computation', message: e.reason };
  return { type: 'error', kind: 'other', message: (e as Error)?.stack ?? String(e) };
}

/** The InputError or ComputationError of a message; undefined for another kind (the caller decides). */
export function errorFromWorker(m: WorkerErrorMessage): InputError | ComputationError | undefined {
  if (m.kind === 'input') return new InputError(m.expected ?? m.message, m.location ?? {});
  if (m.kind === 'computation') return new ComputationError(m.message);
  return undefined;
}
