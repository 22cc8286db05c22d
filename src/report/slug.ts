/**
 * Ids safe for HTML `id`/`href="#…"` and SVG `url(#…)`: letters, digits, `-` and `_` only, derived
 * deterministically from user text (never random), so two renders of a model are identical.
 */

/** `text` reduced to [A-Za-z0-9_-] (other runs become one `-`), or `fallback` when nothing is left. */
export function slug(text: string, fallback = 'x'): string {
  const s = String(text)
    .normalize('NFKD')
    .replace(/[^A-Za-z0-9_-]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 48);
  return s || fallback;
}

/** Makes slugs unique within one document by appending -2, -3 … to repeats. */
export class SlugRegistry {
  private readonly used = new Map<string, number>();

  /** A unique id built from `text` with an optional `prefix`. */
  id(text: string, prefix = ''): string {
    const base = `${prefix}${slug(text)}`;
    const n = (this.used.get(base) ?? 0) + 1;
    this.used.set(base, n);
    return n === 1 ? base : `${base}-${n}`;
  }
}
