/**
 * Expected values of the `sorbshare check` cases, computed independently of the library.
 *
 *   npx tsx scripts/checkExpected.ts                    compare: exit 1 if an expected.json differs
 *   UPDATE_FIXTURES=1 npx tsx scripts/checkExpected.ts  rewrite fixtures/checks/<case>/expected.json
 *
 * Nothing here imports from src/: each case is evaluated from its published equation with plain
 * double-precision arithmetic (unit factors from the SI definitions of the prefixes, roots by
 * bisection to machine precision), so a library defect cannot also move the expected value.
 * The sources are in docs/references.md; each case's input.json names its own.
 */
import { readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

type Input = Record<string, unknown>;

/** Amount units to mg (mass) or mmol (molar), from the SI prefixes; volume/carbon units to L and g. */
const AMOUNT: Record<string, { mg?: number; mmol?: number }> = {
  ng: { mg: 1e-6 }, ug: { mg: 1e-3 }, mg: { mg: 1 }, g: { mg: 1e3 },
  umol: { mmol: 1e-3 }, mmol: { mmol: 1 }, mol: { mmol: 1e3 },
};
const PER: Record<string, number> = { L: 1, mL: 1e-3, g: 1, mg: 1e-3, kg: 1e3 };

/** Factor from "a/b" to mg per L (concentration) or mg per g (loading); molar units need M in g/mol (1 mmol = M mg). */
function factor(unit: string, molarMassGPerMol?: number): number {
  const [a, b] = unit.split('/');
  const amount = AMOUNT[a!];
  const per = PER[b!];
  if (!amount || per === undefined) throw new Error(`script: unit "${unit}" not in the table`);
  const mg = amount.mg ?? (() => {
    if (!molarMassGPerMol) throw new Error(`script: "${unit}" is molar and needs a molar mass`);
    return amount.mmol! * molarMassGPerMol;
  })();
  return mg / per;
}

/** "500 ug/L" → 0.5 (mg/L). */
function concentrationMgPerL(text: unknown): number {
  const m = /^\s*([-+\d.eE]+)\s*(\S+)\s*$/.exec(String(text));
  if (!m) throw new Error(`script: cannot read "${String(text)}"`);
  return Number(m[1]) * factor(m[2]!);
}

/** Root of a monotone f on [lo, hi] by bisection until the interval stops shrinking. */
function bisect(f: (x: number) => number, lo: number, hi: number): number {
  let flo = f(lo);
  if (flo * f(hi) > 0) throw new Error('script: no sign change');
  for (let k = 0; k < 2000; k++) {
    const mid = lo + (hi - lo) / 2;
    if (mid === lo || mid === hi) break;
    const fm = f(mid);
    if (fm === 0) return mid;
    if ((fm < 0) === (flo < 0)) { lo = mid; flo = fm; } else hi = mid;
  }
  return lo + (hi - lo) / 2;
}

/** Chen, Xing & McGill 1999: K' = K · f_q / f_c^(1/n) between any two unit pairs. */
function convertK(K: number, b: number, from: { q: string; c: string }, to: { q: string; c: string }, M?: number): number {
  const toInternal = (K * factor(from.q, M)) / Math.pow(factor(from.c, M), b);
  return (toInternal * Math.pow(factor(to.c, M), b)) / factor(to.q, M);
}

type Comp = { id: string; c0?: string; K: number; one_over_n: number };

/** Each case by id: the published equation it checks, evaluated from the case's own input. */
export const REFERENCE: Record<string, (input: Input) => number> = {
  // Chen et al. 1999, factor rule
  'k-conversion-ug': (i) => convertK(i.K as number, i.one_over_n as number, i.from as never, i.to as never),
  'k-conversion-mmol': (i) => convertK(i.K as number, i.one_over_n as number, i.from as never, i.to as never, i.molar_mass as number),
  'k-conversion-ug-per-mg': (i) => convertK(i.K as number, i.one_over_n as number, i.from as never, i.to as never),
  // Freundlich q = K c^(1/n) in K's own units, then to mg/g
  'k-conversion-same-q': (i) => freundlichQ(i),
  'tce-isotherm-10': (i) => freundlichQ(i),
  'tce-isotherm-0.1': (i) => freundlichQ(i),
  // one solute, 1/n = 0.5: c + D·K·sqrt(c) = c0 is a quadratic in sqrt(c)
  'single-solute-batch': (i) => {
    if (i.one_over_n !== 0.5) throw new Error('script: the quadratic needs 1/n = 0.5');
    const DK = (concentrationMgPerL(i.dose) / 1000) * (i.K as number);
    const c0 = concentrationMgPerL(i.c0);
    const s = (-DK + Math.sqrt(DK * DK + 4 * c0)) / 2;
    return s * s;
  },
  // equal K and exponent: f·(1 + D·K·((c0T + c0B)·f)^(β − 1)) = 1 (IAST with identical isotherms)
  'equal-k-fraction-remaining': (i) => {
    const [t, bg] = i.components as Comp[];
    if (t!.K !== bg!.K || t!.one_over_n !== bg!.one_over_n) throw new Error('script: needs equal K and 1/n');
    const D = concentrationMgPerL(i.dose) / 1000, K = t!.K, b = t!.one_over_n;
    const C = concentrationMgPerL(t!.c0) + concentrationMgPerL(bg!.c0);
    return bisect((f) => f * (1 + D * K * Math.pow(C * f, b - 1)) - 1, 1e-12, 1);
  },
  // Knappe et al. 1998 trace form: q_1 = C0_1 / (D + (1/q_2)·(n_2·q_2/(n_1·K_1))^(n_1)), q_2 from the background's own batch balance
  'knappe-trace-limit': (i) => {
    const [t, bg] = i.components as Comp[];
    const D = concentrationMgPerL(i.dose) / 1000;
    const c02 = concentrationMgPerL(bg!.c0), K2 = bg!.K, b2 = bg!.one_over_n;
    const c2 = bisect((c) => c + D * K2 * Math.pow(c, b2) - c02, 0, c02);
    const q2 = K2 * Math.pow(c2, b2);
    const n1 = 1 / t!.one_over_n, n2 = 1 / b2;
    return concentrationMgPerL(t!.c0) / (D + (1 / q2) * Math.pow((n2 * q2) / (n1 * t!.K), n1));
  },
  // Sheindorf, Rebhun & Sheintuch 1981, common exponent β: q_i = c_i·K_i^(1/β)·(Σ c_j K_j^(1/β))^(β − 1)
  'srs-common-exponent': (i) => {
    const comps = i.components as Comp[];
    const conc = i.concentrations as Record<string, string>;
    const b = comps[0]!.one_over_n;
    if (comps.some((c) => c.one_over_n !== b)) throw new Error('script: needs a common exponent');
    const sum = comps.reduce((s, c) => s + concentrationMgPerL(conc[c.id]) * Math.pow(c.K, 1 / b), 0);
    const r = comps.find((c) => c.id === i.report)!;
    return concentrationMgPerL(conc[r.id]) * Math.pow(r.K, 1 / b) * Math.pow(sum, b - 1);
  },
  // SR 814.201.231 Art. 3: the arithmetic mean of the percentage removals
  'sr814-indicator-mean': (i) => {
    const subs = i.substances as Array<{ removal_percent: number }>;
    return subs.reduce((s, x) => s + x.removal_percent, 0) / subs.length;
  },
};

function freundlichQ(i: Input): number {
  const unit = (i.K_unit as { q: string; c: string } | undefined) ?? { q: 'mg/g', c: 'mg/L' };
  const cInKUnit = concentrationMgPerL(i.c) / factor(unit.c);
  return (i.K as number) * Math.pow(cInKUnit, i.one_over_n as number) * factor(unit.q);
}

/** The check-case folders and their input files. */
export function checkCaseFolders(root = fileURLToPath(new URL('../fixtures/checks/', import.meta.url))): Array<{ dir: string; input: Input & { id: string; input: Input } }> {
  return readdirSync(root, { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name).sort().map((name) => {
    const dir = join(root, name);
    return { dir, input: JSON.parse(readFileSync(join(dir, 'input.json'), 'utf8')) };
  });
}

/** The expected file's content for one case. */
export function expectedFile(caseFile: { id: string; input: Input }): { expected: number; computed_by: string } {
  const f = REFERENCE[caseFile.id];
  if (!f) throw new Error(`script: no reference for case "${caseFile.id}"`);
  const v = f(caseFile.input);
  if (!Number.isFinite(v)) throw new Error(`script: non-finite value for "${caseFile.id}"`);
  return { expected: v, computed_by: 'scripts/checkExpected.ts' };
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const update = process.env.UPDATE_FIXTURES === '1';
  let differ = 0;
  for (const { dir, input } of checkCaseFolders()) {
    const text = JSON.stringify(expectedFile(input), null, 2) + '\n';
    const path = join(dir, 'expected.json');
    let old = '';
    try { old = readFileSync(path, 'utf8'); } catch { /* new case */ }
    if (old === text) continue;
    if (update) { writeFileSync(path, text); console.log(`wrote ${path}`); } else { differ++; console.log(`differs: ${path}\n${text}`); }
  }
  if (differ) { console.log(`${differ} expected file(s) differ; rerun with UPDATE_FIXTURES=1 to rewrite them on purpose`); process.exitCode = 1; }
}
