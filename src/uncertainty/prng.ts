/**
 * A seeded, reproducible pseudorandom number generator for the Monte Carlo runs.
 *
 * Generator: xoshiro128** (Blackman, D., Vigna, S. (2021) "Scrambled linear pseudorandom number
 * generators", ACM Trans. Math. Softw. 47(4):36),
 * 128 bits of state, period 2^128 − 1, 32-bit outputs. Doubles in [0, 1) take 53 bits from two
 * outputs (the usual (a·2^26 + b)/2^53 construction).
 *
 * Seeding: SplitMix64 (Steele, G.L., Lea, D., Flood, C.H. (2014) "Fast splittable pseudorandom
 * number generators", OOPSLA 2014), the seeding method the xoshiro authors recommend. It runs in
 * BigInt arithmetic, but only four words per generator are needed, so the cost is negligible.
 *
 * Streams for parallel runs: `chunkRng(seed, chunk)` seeds SplitMix64 with seed·2^32 + chunk, so
 * every chunk of draws has its own stream fixed by the master seed and the chunk index alone
 * (never by the worker that runs it), which makes results independent of the number of workers.
 */
import { InputError } from '../core/errors.js';

const MASK64 = (1n << 64n) - 1n;

/** SplitMix64 (Steele et al. 2014): a 64-bit counter-based mixer, outputs as BigInt. */
export class SplitMix64 {
  private state: bigint;
  constructor(seed: bigint) {
    this.state = seed & MASK64;
  }
  next(): bigint {
    this.state = (this.state + 0x9e3779b97f4a7c15n) & MASK64;
    let z = this.state;
    z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
    z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
    return z ^ (z >> 31n);
  }
}

/** xoshiro128** (Blackman & Vigna 2021). */
export class Xoshiro128 {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  /** @param state four 32-bit words, not all zero. */
  constructor(state: readonly [number, number, number, number]) {
    // held as signed 32-bit words (| 0), as every later update leaves them: one number
    // representation for the fields (the outputs are the same bits either way)
    [this.s0, this.s1, this.s2, this.s3] = state.map((w) => w | 0) as [number, number, number, number];
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) throw new InputError('xoshiro128** needs a state that is not all zero');
  }

  /** Next 32-bit unsigned output. */
  nextUint32(): number {
    const s1 = this.s1;
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0; // rotl(s[1] * 5, 7) * 9
    const t = s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return result;
  }

  /** Uniform double in [0, 1) with 53 random bits. */
  nextFloat(): number {
    const a = this.nextUint32() >>> 5; // 27 bits
    const b = this.nextUint32() >>> 6; // 26 bits
    return (a * 67108864 + b) / 9007199254740992;
  }
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

/** The generator type used by the distributions. */
export interface Rng {
  nextFloat(): number;
}

function checkSeed(seed: number, what: string): void {
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff) {
    throw new InputError(`expected ${what} as an integer from 0 to 4294967295, got ${seed}`, { path: what });
  }
}

function fromSplitMix(sm: SplitMix64): Xoshiro128 {
  const a = sm.next();
  const b = sm.next();
  return new Xoshiro128([
    Number(a & 0xffffffffn), Number(a >> 32n), Number(b & 0xffffffffn), Number(b >> 32n),
  ]);
}

/** A generator seeded from one integer seed (0 … 2^32 − 1). @throws InputError for other seeds. */
export function seededRng(seed: number): Xoshiro128 {
  checkSeed(seed, 'seed');
  return fromSplitMix(new SplitMix64(BigInt(seed)));
}

/**
 * The generator of chunk `chunk` of a run with master seed `seed`: SplitMix64 seeded with
 * seed·2^32 + chunk (distinct for every pair), expanded to the xoshiro128** state.
 */
export function chunkRng(seed: number, chunk: number): Xoshiro128 {
  checkSeed(seed, 'seed');
  checkSeed(chunk, 'chunk index');
  return fromSplitMix(new SplitMix64((BigInt(seed) << 32n) | BigInt(chunk)));
}
