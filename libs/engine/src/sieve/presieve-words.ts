import { SEGMENT_BUFFER } from './layout';
import { RESIDUES } from './wheel30';

// The segment as a module constant (see SEGMENT_BUFFER: why not a parameter).
const WORDS = new Int32Array(SEGMENT_BUFFER);

/**
 * A word pattern for a few primes: word t packs sieve bytes 4t … 4t+3 (mod the period) where bit i
 * of byte K is clear when 30K + RESIDUES[i] is divisible by one of the primes. The period P is odd,
 * so stepping t by 1 steps the byte by 4 and one copy serves every alignment.
 */
export interface WordPattern {
  readonly period: number;
  readonly words: Uint32Array;
  /** The multiplicative inverse of 4 modulo the period. */
  readonly inverse4: number;
}

const LITTLE_ENDIAN = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

/** Builds the word pattern of the given odd primes (> 5). */
export function wordPattern(primes: readonly number[]): WordPattern {
  const period = primes.reduce((x, p) => x * p, 1);
  const bytes = new Uint8Array(period).fill(0xff);
  for (const p of primes) {
    for (let i = 0; i < 8; i++) {
      let k0 = 0;
      while ((30 * k0 + RESIDUES[i]!) % p !== 0) k0++;
      const clear = ~(1 << i) & 0xff;
      for (let k = k0; k < period; k += p) bytes[k]! &= clear;
    }
  }
  // Word t packs bytes 4t … 4t+3 mod the period, so the words read in order are the byte period
  // repeated four times: on a little-endian machine that is a plain view of it (this runs once per
  // thread at module load, before V8 optimizes anything, so a per-word loop cost milliseconds).
  const repeated = new Uint8Array(4 * period);
  for (let r = 0; r < 4; r++) repeated.set(bytes, r * period);
  let words = new Uint32Array(repeated.buffer);
  if (!LITTLE_ENDIAN) {
    words = new Uint32Array(period);
    for (let t = 0; t < period; t++) {
      const k = 4 * t;
      words[t] = (repeated[k]! | (repeated[k + 1]! << 8) | (repeated[k + 2]! << 16) | (repeated[k + 3]! << 24)) >>> 0;
    }
  }
  // 1/4 = (1/2)² and 1/2 = (period + 1)/2 modulo an odd period.
  const half = (period + 1) / 2;
  const inverse4 = (half * half) % period;
  return { period, words, inverse4 };
}

/** Index t of the pattern word that starts at sieve byte K (a safe integer). */
export function wordIndex(pattern: WordPattern, byteIndex: number): number {
  return ((byteIndex % pattern.period) * pattern.inverse4) % pattern.period;
}

// The primes 7 … 47 are removed by word patterns rather than crossed off: four patterns of a few
// primes each (periods 17 017, 12 673, 47 027 and 2 021 words), combined into the segment in one pass.
const A = wordPattern([7, 11, 13, 17]);
const B = wordPattern([19, 23, 29]);
const C = wordPattern([31, 37, 41]);
const D = wordPattern([43, 47]);
/** Words written per chunk: the tables are stored that much beyond their period, so a chunk never wraps. */
const CHUNK_WORDS = 4096;
const extend = (pattern: WordPattern): Uint32Array => {
  const words = new Uint32Array(pattern.period + CHUNK_WORDS);
  for (let t = 0; t < words.length; t += pattern.period) words.set(pattern.words.subarray(0, Math.min(pattern.period, words.length - t)), t);
  return words;
};
// Module constants (as the segment views): the hot loop then has no table loads to repeat.
const A_WORDS = extend(A);
const B_WORDS = extend(B);
const C_WORDS = extend(C);
const D_WORDS = extend(D);
/** The four patterns of 7 … 47 (for the WebAssembly kernel, which copies them into its memory). */
export const WORD_PATTERNS: readonly WordPattern[] = [A, B, C, D];
/** The largest prime removed by a pattern (crossing off starts after it). */
export const LAST_PATTERN_PRIME = 47;
/** The primes the patterns remove together with their multiples (to be put back). */
export const PATTERN_PRIMES: readonly number[] = [7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47];
/** Sieve bytes holding PATTERN_PRIMES (they are below 60). */
export const PATTERN_PRIMES_BYTES = 2;

/**
 * Writes the words [from, words) of the segment, which starts at sieve byte K0, with the integers
 * coprime to 2 · 3 · 5 · … · 47 (as bits of the mod-30 wheel).
 */
export function writeWordPatterns(from: number, words: number, K0: number): void {
  const u32 = WORDS;
  const a = A_WORDS;
  const b = B_WORDS;
  const c = C_WORDS;
  const d = D_WORDS;
  // `| 0` keeps the positions small integers (they stay below the periods); left to themselves they
  // become floating-point numbers in V8, and every table index a conversion.
  const pa = A.period | 0;
  const pb = B.period | 0;
  const pc = C.period | 0;
  const pd = D.period | 0;
  const K = K0 + 4 * from;
  let ta = wordIndex(A, K) | 0;
  let tb = wordIndex(B, K) | 0;
  let tc = wordIndex(C, K) | 0;
  let td = wordIndex(D, K) | 0;
  for (let c0 = from; c0 < words; c0 += CHUNK_WORDS) {
    const n = Math.min(CHUNK_WORDS, words - c0) | 0;
    for (let k = 0; k < n; k++) u32[(c0 + k) | 0] = a[(ta + k) | 0]! & b[(tb + k) | 0]! & c[(tc + k) | 0]! & d[(td + k) | 0]!;
    ta = ((ta + n) % pa) | 0;
    tb = ((tb + n) % pb) | 0;
    tc = ((tc + n) % pc) | 0;
    td = ((td + n) % pd) | 0;
  }
}
