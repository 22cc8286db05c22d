/**
 * luFactorAt (rows eliminated two at a time) gives exactly the numbers of the textbook loop, one
 * row at a time, also with zero multipliers; luSolveBlocksAt (several LU-factorised blocks solved
 * together, four at a time) gives exactly the numbers of luSolveAt block by block (the same
 * arithmetic in the same order), with row exchanges and at the offsets the HSDM particle system
 * uses; luFactorLastRowAt (a matrix whose rows but the last are those of one factorised before)
 * gives exactly luFactorAt's numbers where it accepts, and luSolveSharedBlocksAt solves such
 * blocks with exactly luSolveAt's numbers; and the reverse IAST with ln(β/K) kept by
 * the caller gives exactly the numbers computed without it.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { luFactorAt, luFactorLastRowAt, luSolveAt, luSolveBlocksAt, luSolveSharedBlocksAt } from '../../src/kinetics/denseLu.js';
import { reverseIast } from '../../src/kinetics/reverseIast.js';

/** Gaussian elimination with partial pivoting, one row at a time (Golub & Van Loan 2013, §3.4): the reference. */
function referenceFactor(a: Float64Array, off: number, n: number, piv: Int32Array, pOff: number): void {
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(a[off + k * n + k]!);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(a[off + i * n + k]!);
      if (v > best) { best = v; p = i; }
    }
    piv[pOff + k] = p;
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[off + k * n + j]!;
        a[off + k * n + j] = a[off + p * n + j]!;
        a[off + p * n + j] = t;
      }
    }
    const inv = 1 / a[off + k * n + k]!;
    for (let i = k + 1; i < n; i++) {
      const f = a[off + i * n + k]! * inv;
      if (f === 0) continue;
      a[off + i * n + k] = f;
      for (let j = k + 1; j < n; j++) a[off + i * n + j] = a[off + i * n + j]! - f * a[off + k * n + j]!;
    }
  }
}

describe('luFactorAt', () => {
  it('equals the one-row-at-a-time elimination bit for bit (order 1 to 12, with zero entries and -0)', () => {
    fc.assert(fc.property(
      fc.integer({ min: 1, max: 12 }), fc.integer({ min: 0, max: 2 }), fc.integer({ min: 1, max: 2147483646 }),
      (n, lead, seed) => {
        let s = seed;
        const rnd = () => { s = (s * 16807) % 2147483647; return s / 2147483647; };
        const off = lead * n * n;
        // about a third of the entries zero (some -0), so that multipliers of zero occur
        const a = Float64Array.from({ length: off + n * n }, () => { const u = rnd(); return u < 0.3 ? (u < 0.1 ? -0 : 0) : rnd() - 0.5; });
        for (let i = 0; i < n; i++) a[off + i * n + i] = a[off + i * n + i]! + (i % 2 ? 2 : -2); // nonsingular
        const ref = Float64Array.from(a), refPiv = new Int32Array(n), piv = new Int32Array(n);
        referenceFactor(ref, off, n, refPiv, 0);
        luFactorAt(a, off, n, piv, 0);
        expect(Array.from(piv)).toEqual(Array.from(refPiv));
        for (let i = 0; i < a.length; i++) expect(Object.is(a[i], ref[i])).toBe(true);
      },
    ), { numRuns: 300 });
  });
});

describe('luFactorLastRowAt', () => {
  it('equals luFactorAt bit for bit where it accepts, and refuses where the last row would be a pivot (order 2 to 12)', () => {
    let accepted = 0, refused = 0;
    fc.assert(fc.property(
      fc.integer({ min: 2, max: 12 }), fc.double({ min: 0.01, max: 30, noNaN: true }), fc.integer({ min: 1, max: 2147483646 }),
      (n, lastScale, seed) => {
        let s = seed;
        const rnd = () => { s = (s * 16807) % 2147483647; return s / 2147483647 - 0.5; };
        const nn = n * n, last = n - 1;
        // two matrices with the same rows but the last (stored one after the other), row exchanges allowed
        const a = new Float64Array(2 * nn);
        for (let i = 0; i < nn; i++) a[i] = rnd();
        for (let i = 0; i < last * n; i++) a[nn + i] = a[i]!;
        for (let j = 0; j < n; j++) a[nn + last * n + j] = lastScale * rnd();
        const whole = a.slice(nn), wholePiv = new Int32Array(n);
        let wholeThrows = false;
        try { luFactorAt(whole, 0, n, wholePiv, 0); } catch { wholeThrows = true; }
        const piv = new Int32Array(2 * n), upperBest = new Float64Array(2 * n);
        const ref = a.slice(0, nn), refPiv = new Int32Array(n);
        referenceFactor(ref, 0, n, refPiv, 0);
        luFactorAt(a, 0, n, piv, 0, 'test', upperBest, 0);
        for (let i = 0; i < nn; i++) expect(Object.is(a[i], ref[i])).toBe(true); // upperBest changes nothing
        if (Array.from(piv.subarray(0, last)).includes(last)) return; // the first chose its last row: nothing to share
        a.copyWithin(nn, 0, last * n);
        piv.copyWithin(n, 0, last);
        let ok: boolean;
        try { ok = luFactorLastRowAt(a, nn, n, piv, n, upperBest, 0, 'test'); } catch {
          expect(wholeThrows).toBe(true);
          return;
        }
        if (!ok) { refused++; return; }
        accepted++;
        expect(wholeThrows).toBe(false);
        expect(Array.from(piv.subarray(n))).toEqual(Array.from(wholePiv));
        for (let i = 0; i < nn; i++) expect(Object.is(a[nn + i], whole[i])).toBe(true);
      },
    ), { numRuns: 400 });
    expect(accepted).toBeGreaterThan(20);
    expect(refused).toBeGreaterThan(20);
  });
});

describe('luSolveSharedBlocksAt', () => {
  it('equals luSolveAt on every block, bit for bit (1 to 9 blocks of order 1 to 12 sharing all rows but the last, at offsets)', () => {
    let compared = 0;
    fc.assert(fc.property(
      fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 9 }), fc.integer({ min: 0, max: 3 }), fc.integer({ min: 1, max: 2147483646 }),
      (n, count, lead, seed) => {
        let s = seed;
        const rnd = () => { s = (s * 16807) % 2147483647; return s / 2147483647 - 0.5; };
        const nn = n * n, last = n - 1;
        const off = lead * nn, pOff = lead * n, bOff = lead * n;
        const a = new Float64Array(off + count * nn);
        const piv = new Int32Array(pOff + count * n);
        const upperBest = new Float64Array(count * n);
        // a first block whose last row is never a pivot (a small last row), the others its rows
        // but the last with last rows of their own, factorised by luFactorLastRowAt
        for (let i = 0; i < nn; i++) a[off + i] = i >= last * n ? 1e-3 * rnd() : rnd();
        if (n > 1) a[off + last * n + last] = 1;
        luFactorAt(a, off, n, piv, pOff, 'test', upperBest, 0);
        if (Array.from(piv.subarray(pOff, pOff + last)).includes(last)) return;
        for (let q = 1; q < count; q++) {
          const o = off + q * nn;
          a.copyWithin(o, off, off + last * n);
          piv.copyWithin(pOff + q * n, pOff, pOff + last);
          for (let j = 0; j < n; j++) a[o + last * n + j] = 1e-3 * rnd();
          a[o + last * n + last] = 1 + rnd();
          if (!luFactorLastRowAt(a, o, n, piv, pOff + q * n, upperBest, 0, 'test')) return;
        }
        const b = Float64Array.from({ length: bOff + count * n + 2 }, rnd);
        const one = Float64Array.from(b);
        for (let q = 0; q < count; q++) luSolveAt(a, off + q * nn, n, piv, pOff + q * n, one, bOff + q * n);
        const all = Float64Array.from(b);
        luSolveSharedBlocksAt(a, off, n, piv, pOff, all, bOff, count);
        for (let i = 0; i < b.length; i++) expect(Object.is(all[i], one[i])).toBe(true);
        compared++;
      },
    ), { numRuns: 300 });
    expect(compared).toBeGreaterThan(200);
  });
});

describe('luSolveBlocksAt', () => {
  it('equals luSolveAt on every block, bit for bit (1 to 9 blocks of order 1 to 12, at offsets)', () => {
    fc.assert(fc.property(
      fc.integer({ min: 1, max: 12 }), fc.integer({ min: 1, max: 9 }), fc.integer({ min: 0, max: 3 }), fc.integer({ min: 1, max: 2147483646 }), // a seed of the Park–Miller generator (2³¹ − 1 would stay at 0)
      (n, count, lead, seed) => {
        let s = seed;
        const rnd = () => { s = (s * 16807) % 2147483647; return s / 2147483647 - 0.5; };
        const nn = n * n;
        const off = lead * nn, pOff = lead * n, bOff = lead * n;
        const a = new Float64Array(off + count * nn);
        for (let i = 0; i < a.length; i++) a[i] = rnd(); // no diagonal dominance: row exchanges happen
        const piv = new Int32Array(pOff + count * n);
        for (let q = 0; q < count; q++) luFactorAt(a, off + q * nn, n, piv, pOff + q * n);
        const b = Float64Array.from({ length: bOff + count * n + 2 }, rnd);
        const one = Float64Array.from(b);
        for (let q = 0; q < count; q++) luSolveAt(a, off + q * nn, n, piv, pOff + q * n, one, bOff + q * n);
        const all = Float64Array.from(b);
        luSolveBlocksAt(a, off, n, piv, pOff, all, bOff, count);
        for (let i = 0; i < b.length; i++) expect(Object.is(all[i], one[i])).toBe(true);
      },
    ), { numRuns: 300 });
  });

  it('does nothing for no block', () => {
    const b = Float64Array.of(1, 2, 3);
    luSolveBlocksAt(new Float64Array(0), 0, 3, new Int32Array(0), 0, b, 0, 0);
    expect(Array.from(b)).toEqual([1, 2, 3]);
  });
});

describe('reverse IAST with ln(β/K) kept', () => {
  it('gives the same c_s, Jacobian, ψ and Q as without it, bit for bit', () => {
    fc.assert(fc.property(
      fc.array(fc.record({ K: fc.double({ min: 1, max: 300, noNaN: true }), beta: fc.double({ min: 0.1, max: 0.9, noNaN: true }), q: fc.double({ min: -0.1, max: 50, noNaN: true }) }), { minLength: 1, maxLength: 6 }),
      (comps) => {
        const m = comps.length;
        const K = Float64Array.from(comps, (c) => c.K), beta = Float64Array.from(comps, (c) => c.beta);
        const q = Float64Array.from(comps, (c) => c.q);
        const cs1 = new Float64Array(m), jac1 = new Float64Array(m * m), cs2 = new Float64Array(m), jac2 = new Float64Array(m * m);
        const st1 = reverseIast({ K, beta }, q, cs1, jac1);
        const st2 = reverseIast({ K, beta, lnBetaOverK: Float64Array.from(comps, (c) => Math.log(c.beta / c.K)) }, q, cs2, jac2);
        expect(st2).toEqual(st1);
        for (let i = 0; i < m; i++) expect(Object.is(cs2[i], cs1[i])).toBe(true);
        for (let i = 0; i < m * m; i++) expect(Object.is(jac2[i], jac1[i])).toBe(true);
      },
    ));
  });
});
