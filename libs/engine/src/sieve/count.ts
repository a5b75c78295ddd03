// Reading a sieved segment: range masking, first/last set bits, pattern occurrences.
import type { CompiledPattern } from './pattern';
import { SEGMENT_BUFFER } from './layout';
import { RESIDUES, WORD_BIT_VALUE, popcount32 } from './wheel30';

// The segment as module constants (see SEGMENT_BUFFER: why not parameters). Signed words load as
// small integers; every use below is bitwise, so the sign bit is just bit 31.
const BYTES = new Uint8Array(SEGMENT_BUFFER);
const WORDS = new Int32Array(SEGMENT_BUFFER);

/** Clears the bits of the integers outside [a, b] among the bytes [0, L) that start at base. */
export function clearOutside(base: number, L: number, a: number, b: number): void {
  const buf = BYTES;
  if (a > base) {
    const k = Math.floor((a - base) / 30);
    buf.fill(0, 0, Math.min(k, L));
    if (k < L) for (let i = 0; i < 8; i++) if (base + 30 * k + RESIDUES[i]! < a) buf[k]! &= ~(1 << i);
  }
  if (b < base + 30 * L - 1) {
    const k = Math.floor((b - base) / 30);
    for (let i = 0; i < 8; i++) if (base + 30 * k + RESIDUES[i]! > b) buf[k]! &= ~(1 << i);
    buf.fill(0, k + 1, L);
  }
}

/** Offset from the base of the lowest set bit in words [from, words) (there must be one). */
export function firstBitValue(from: number, words: number): number {
  const u32 = WORDS;
  for (let w = from; w < words; w++) {
    const x = u32[w]!;
    if (x !== 0) return 120 * w + WORD_BIT_VALUE[31 - Math.clz32(x & -x)]!;
  }
  return -1;
}

/** Offset from the base of the highest set bit in words [0, words) (there must be one). */
export function lastBitValue(words: number): number {
  const u32 = WORDS;
  for (let w = words - 1; w >= 0; w--) {
    const x = u32[w]!;
    if (x !== 0) return 120 * w + WORD_BIT_VALUE[31 - Math.clz32(x)]!;
  }
  return -1;
}

/** The twin-prime start bits of word w (starts 11, 17 at bits 2, 4 of a byte; 29 at bit 7). */
const twinBits = (w: number): number => {
  const u32 = WORDS;
  const P = u32[w]!;
  // 11 and 17 pair with the next bit of their byte; 29 with bit 0 of the next byte, which is the
  // next bit of the word except at bit 31.
  return P & ((P >>> 1) | (u32[w + 1]! << 31)) & 0x94949494;
};

/** Number of primes (1 bits) in the words [from, to): eight words per population count (see countPrimesAndTwins). */
export function countPrimes(from: number, to: number): number {
  const u32 = WORDS;
  let ones = 0, twos = 0, fours = 0, eights = 0;
  let w = from;
  for (; w + 8 <= to; w += 8) {
    const P0 = u32[w]!, P1 = u32[(w + 1) | 0]!, P2 = u32[(w + 2) | 0]!, P3 = u32[(w + 3) | 0]!;
    const P4 = u32[(w + 4) | 0]!, P5 = u32[(w + 5) | 0]!, P6 = u32[(w + 6) | 0]!, P7 = u32[(w + 7) | 0]!;
    let u = ones ^ P0, h = (ones & P0) | (u & P1), twosA = h; ones = u ^ P1;
    u = ones ^ P2; h = (ones & P2) | (u & P3); ones = u ^ P3;
    u = twos ^ twosA; const foursA = (twos & twosA) | (u & h); twos = u ^ h;
    u = ones ^ P4; h = (ones & P4) | (u & P5); twosA = h; ones = u ^ P5;
    u = ones ^ P6; h = (ones & P6) | (u & P7); ones = u ^ P7;
    u = twos ^ twosA; const foursB = (twos & twosA) | (u & h); twos = u ^ h;
    u = fours ^ foursA; eights += popcount32((fours & foursA) | (u & foursB)); fours = u ^ foursB;
  }
  let total = 8 * eights + 4 * popcount32(fours) + 2 * popcount32(twos) + popcount32(ones);
  for (; w < to; w++) total += popcount32(u32[w]!);
  return total;
}

/**
 * Counts the primes in the words [from, to) and the twin pairs that start there; reads word `to`
 * too, which must be final. Returns the number of primes and adds the twins to
 * `stats[at]` (their first and last are found by locateTwins, so the loop has no bookkeeping).
 * Pattern statistics live in a Float64Array — count, first, last at `at`, `at + 1`, `at + 2` — not
 * in objects: a field of an object changing from a small integer to a large one changes the
 * object's shape, and V8 threw the optimized counting code away on every new sieve call (measured:
 * 652 deoptimizations while sieving 16 blocks).
 */
export function countPrimesAndTwins(from: number, to: number, stats: Float64Array, at: number): number {
  const u32 = WORDS;
  // Twin starts are at bits 2, 4, 7 of a byte; shifted right by one they land on 1, 3, 6, so two
  // words of twin starts share one word, and four such words go through the carry-save adders.
  let ones = 0, twos = 0, fours = 0;
  let w = from;
  for (; w + 8 <= to; w += 8) {
    const P0 = u32[w]!, P1 = u32[(w + 1) | 0]!, P2 = u32[(w + 2) | 0]!, P3 = u32[(w + 3) | 0]!;
    const P4 = u32[(w + 4) | 0]!, P5 = u32[(w + 5) | 0]!, P6 = u32[(w + 6) | 0]!, P7 = u32[(w + 7) | 0]!;
    const P8 = u32[(w + 8) | 0]!;
    const T0 = (P0 & ((P0 >>> 1) | (P1 << 31)) & 0x94949494) | ((P1 & ((P1 >>> 1) | (P2 << 31)) & 0x94949494) >>> 1);
    const T1 = (P2 & ((P2 >>> 1) | (P3 << 31)) & 0x94949494) | ((P3 & ((P3 >>> 1) | (P4 << 31)) & 0x94949494) >>> 1);
    const T2 = (P4 & ((P4 >>> 1) | (P5 << 31)) & 0x94949494) | ((P5 & ((P5 >>> 1) | (P6 << 31)) & 0x94949494) >>> 1);
    const T3 = (P6 & ((P6 >>> 1) | (P7 << 31)) & 0x94949494) | ((P7 & ((P7 >>> 1) | (P8 << 31)) & 0x94949494) >>> 1);
    let u = ones ^ T0, h = (ones & T0) | (u & T1);
    const twosA = h;
    ones = u ^ T1;
    u = ones ^ T2; h = (ones & T2) | (u & T3); ones = u ^ T3;
    u = twos ^ twosA; fours += popcount32((twos & twosA) | (u & h)); twos = u ^ h;
  }
  let count = 4 * fours + 2 * popcount32(twos) + popcount32(ones);
  for (; w < to; w++) count += popcount32(twinBits(w));
  stats[at] += count;
  // A second pass over the same words, still in the L1 cache.
  return countPrimes(from, to);
}

/** Sets the first twin (stats[at + 1], when still −1) and the last one (stats[at + 2]) from the words [0, words), which hold one. */
export function locateTwins(words: number, base: number, stats: Float64Array, at: number): void {
  if (stats[at + 1]! < 0) {
    let w = 0;
    while (twinBits(w) === 0) w++;
    const occ = twinBits(w);
    stats[at + 1] = base + 120 * w + WORD_BIT_VALUE[31 - Math.clz32(occ & -occ)]!;
  }
  let w = words - 1;
  while (twinBits(w) === 0) w--;
  stats[at + 2] = base + 120 * w + WORD_BIT_VALUE[31 - Math.clz32(twinBits(w))]!;
}

/**
 * Counts the occurrences of one pattern whose start n lies in the bytes [0, 4·words) of the segment,
 * and updates its count, first and last occurrence at stats[at], stats[at + 1], stats[at + 2]. Occurrence bits are built per 32-bit word: bit c of each
 * byte says that n = 30k + RESIDUES[c] starts an occurrence.
 */
export function countPattern(words: number, base: number, cp: CompiledPattern, stats: Float64Array, at: number): void {
  const u32 = WORDS;
  let count = 0;
  let firstWord = -1;
  let firstBits = 0;
  let lastWord = -1;
  let lastBits = 0;
  // Twin patterns too (a second {0, 2} comes here): bit c of a byte marks start class c either way.
  const nClasses = cp.classes.length;
  for (let w = 0; w < words; w++) {
    let occ = 0;
    for (let ci = 0; ci < nClasses; ci++) {
      const bytes = cp.termBytes[ci]!;
      const bits = cp.termBits[ci]!;
      let acc = -1;
      for (let t = 0; t < bytes.length; t++) {
        const d = bytes[t]!;
        const q = w + (d >> 2);
        const s = (d & 3) << 3;
        const v = s === 0 ? u32[q]! : (u32[q]! >>> s) | (u32[q + 1]! << (32 - s));
        acc &= v >>> bits[t]!;
        if ((acc & 0x01010101) === 0) break;
      }
      occ |= (acc & 0x01010101) << cp.classes[ci]!;
    }
    if (occ !== 0) {
      count += popcount32(occ);
      if (firstWord < 0) {
        firstWord = w;
        firstBits = occ;
      }
      lastWord = w;
      lastBits = occ;
    }
  }
  if (count === 0) return;
  stats[at] += count;
  if (stats[at + 1]! < 0) stats[at + 1] = base + 120 * firstWord + WORD_BIT_VALUE[31 - Math.clz32(firstBits & -firstBits)]!;
  stats[at + 2] = base + 120 * lastWord + WORD_BIT_VALUE[31 - Math.clz32(lastBits)]!;
}
