/**
 * Validation against schema/project.schema.json with Ajv (a general-purpose JSON Schema
 * 2020-12 validator from the npm registry), reported as short path-named messages.
 */
import { createRequire } from 'node:module';
import type { ErrorObject, ValidateFunction } from 'ajv';

// Ajv ships CommonJS; require it so that the class (not a namespace) comes back under ESM.
const Ajv2020 = createRequire(import.meta.url)('ajv/dist/2020') as typeof import('ajv/dist/2020.js').default;

type Schema = Record<string, unknown>;
const cache = new WeakMap<Schema, ValidateFunction>();

function jsonPath(instancePath: string): string {
  return '$' + instancePath.split('/').slice(1).map((k) => (/^\d+$/.test(k) ? `[${k}]` : `.${k.replace(/~1/g, '/').replace(/~0/g, '~')}`)).join('');
}

function describe(e: ErrorObject): string {
  if (e.keyword === 'additionalProperties') return `${jsonPath(e.instancePath)}.${(e.params as { additionalProperty: string }).additionalProperty}: additional property`;
  return `${jsonPath(e.instancePath)}: ${e.message ?? e.keyword}`;
}

/** Messages for every way `value` violates `schema` ([] when valid). */
export function validateAgainstSchema(schema: Schema, value: unknown): string[] {
  let validate = cache.get(schema);
  if (!validate) {
    const ajv = new Ajv2020({ allErrors: true, strict: true, strictRequired: false });
    validate = ajv.compile(schema);
    cache.set(schema, validate);
  }
  return validate(value) ? [] : (validate.errors ?? []).map(describe);
}
