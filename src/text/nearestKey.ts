/**
 * The valid key nearest to a misspelt one, for "unknown key" messages: the smallest optimal
 * string alignment distance (Levenshtein edits plus transposition of two adjacent characters;
 * Damerau 1964, Levenshtein 1966), compared case-insensitively with `_`, `-` and spaces ignored,
 * so that "K_units", "k_unit" and "Kunit" all point to "K_unit". A key of three or more
 * characters contained in the other ("band" in "band_percent", "radius" in "particle_radius")
 * counts as one edit away. Ties go to the earlier key.
 */

/** Optimal string alignment distance between `a` and `b`. */
export function editDistance(a: string, b: string): number {
  const m = a.length, n = b.length;
  const d: number[][] = Array.from({ length: m + 1 }, (_, i) => Array.from({ length: n + 1 }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)));
  for (let i = 1; i <= m; i++) {
    for (let j = 1; j <= n; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let v = Math.min(d[i - 1]![j]! + 1, d[i]![j - 1]! + 1, d[i - 1]![j - 1]! + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) v = Math.min(v, d[i - 2]![j - 2]! + 1);
      d[i]![j] = v;
    }
  }
  return d[m]![n]!;
}

function fold(s: string): string {
  return s.toLowerCase().replace(/[\s_\-]+/g, '');
}

/** The key of `allowed` nearest to `key` (undefined when `allowed` is empty). */
export function nearestKey(key: string, allowed: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestD = Infinity;
  for (const a of allowed) {
    // folded distance first; the raw distance breaks ties between keys that fold alike
    const k = fold(key), f = fold(a);
    const contained = Math.min(k.length, f.length) >= 3 && (f.includes(k) || k.includes(f));
    const folded = contained && k !== f ? Math.min(1, editDistance(k, f)) : editDistance(k, f);
    const dist = folded * 1000 + editDistance(key, a);
    if (dist < bestD) { bestD = dist; best = a; }
  }
  return best;
}
