/**
 * A small validator for the subset of JSON Schema 2020-12 (https://json-schema.org/draft/2020-12)
 * that schema/project.schema.json uses: type, properties, required, additionalProperties,
 * enum, const, items, minItems, oneOf, minimum, maximum, exclusiveMinimum, exclusiveMaximum,
 * minLength, pattern, $ref to #/$defs, if/then. Semantics follow the 2020-12 validation
 * vocabulary (json-schema-validation §6). An unknown keyword throws, so the schema cannot
 * silently rely on something this checker ignores. Test helper only (no JSON Schema package is
 * installed).
 */
type Schema = Record<string, unknown>;

const ANNOTATIONS = new Set(['$schema', '$id', 'title', 'description', '$defs']);
const KNOWN = new Set(['type', 'properties', 'required', 'additionalProperties', 'enum', 'const', 'items', 'minItems', 'oneOf', 'minimum', 'maximum', 'exclusiveMinimum', 'exclusiveMaximum', 'minLength', 'pattern', '$ref', 'if', 'then']);

function typeOf(v: unknown): string {
  if (v === null) return 'null';
  if (Array.isArray(v)) return 'array';
  if (typeof v === 'number') return Number.isInteger(v) ? 'integer' : 'number';
  return typeof v;
}

export function validateAgainstSchema(root: Schema, value: unknown): string[] {
  const errors: string[] = [];
  const resolve = (ref: string): Schema => {
    const m = /^#\/\$defs\/(.+)$/.exec(ref);
    if (!m) throw new Error(`unsupported $ref ${ref}`);
    const s = (root.$defs as Record<string, Schema>)[m[1]!];
    if (!s) throw new Error(`unknown $ref ${ref}`);
    return s;
  };
  const check = (s: Schema, v: unknown, path: string, out: string[]): void => {
    for (const k of Object.keys(s)) if (!KNOWN.has(k) && !ANNOTATIONS.has(k)) throw new Error(`schema keyword "${k}" not supported by the test validator`);
    if (s.$ref) check(resolve(s.$ref as string), v, path, out);
    const t = typeOf(v);
    if (s.type !== undefined) {
      const ok = s.type === t || (s.type === 'number' && t === 'integer');
      if (!ok) { out.push(`${path}: expected ${String(s.type)}, got ${t}`); return; }
    }
    if (s.enum && !(s.enum as unknown[]).includes(v)) out.push(`${path}: not in enum`);
    if (s.const !== undefined && s.const !== v) out.push(`${path}: not the constant`);
    if (typeof v === 'number') {
      if (typeof s.minimum === 'number' && v < s.minimum) out.push(`${path}: below minimum`);
      if (typeof s.maximum === 'number' && v > s.maximum) out.push(`${path}: above maximum`);
      if (typeof s.exclusiveMinimum === 'number' && v <= s.exclusiveMinimum) out.push(`${path}: not above exclusiveMinimum`);
      if (typeof s.exclusiveMaximum === 'number' && v >= s.exclusiveMaximum) out.push(`${path}: not below exclusiveMaximum`);
    }
    if (typeof v === 'string') {
      if (typeof s.minLength === 'number' && v.length < s.minLength) out.push(`${path}: shorter than minLength`);
      if (typeof s.pattern === 'string' && !new RegExp(s.pattern, 'u').test(v)) out.push(`${path}: does not match pattern`);
    }
    if (Array.isArray(v)) {
      if (typeof s.minItems === 'number' && v.length < s.minItems) out.push(`${path}: fewer than minItems`);
      if (s.items) v.forEach((x, i) => check(s.items as Schema, x, `${path}[${i}]`, out));
    }
    if (t === 'object') {
      const o = v as Record<string, unknown>;
      const props = (s.properties ?? {}) as Record<string, Schema>;
      for (const r of (s.required ?? []) as string[]) if (!(r in o)) out.push(`${path}.${r}: required`);
      for (const [k, x] of Object.entries(o)) {
        if (props[k]) check(props[k]!, x, `${path}.${k}`, out);
        else if (s.additionalProperties === false) out.push(`${path}.${k}: additional property`);
        else if (typeof s.additionalProperties === 'object') check(s.additionalProperties as Schema, x, `${path}.${k}`, out);
      }
    }
    if (s.oneOf) {
      const passing = (s.oneOf as Schema[]).filter((sub) => { const e: string[] = []; check(sub, v, path, e); return e.length === 0; }).length;
      if (passing !== 1) out.push(`${path}: matches ${passing} of oneOf`);
    }
    if (s.if) {
      const e: string[] = [];
      check(s.if as Schema, v, path, e);
      if (e.length === 0 && s.then) check(s.then as Schema, v, path, out);
    }
  };
  check(root, value, '$', errors);
  return errors;
}
