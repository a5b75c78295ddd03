// Reading a sieved segment: range masking, first/last set bits, pattern occurrences.
import type { CorePatternResult } from './core';
import type { CompiledPattern } from './pattern';
import { RESIDUES, WORD_BIT_VALUE, popcount32 } from './wheel30';

/** Clears the bits of the integers outside [a, b] among the bytes [0, L) that start at base. */
export function clearOutside(buf: Uint8Array, base: number, L: number, a: number, b: number): void {
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
export function firstBitValue(u32: Uint32Array, from: number, words: number): number {
  for (let w = from; w < words; w++) {
    const x = u32[w]!;
    if (x !== 0) return 120 * w + WORD_BIT_VALUE[31 - Math.clz32(x & -x)]!;
  }
  return -1;
}

/** Offset from the base of the highest set bit in words [0, words) (there must be one). */
export function lastBitValue(u32: Uint32Array, words: number): number {
  for (let w = words - 1; w >= 0; w--) {
    const x = u32[w]!;
    if (x !== 0) return 120 * w + WORD_BIT_VALUE[31 - Math.clz32(x)]!;
  }
  return -1;
}

/**
 * Counts the occurrences of one pattern whose start n lies in the bytes [0, 4·words) of the segment,
 * and updates its first/last occurrence. Occurrence bits are built per 32-bit word: bit c of each
 * byte says that n = 30k + RESIDUES[c] starts an occurrence.
 */
export function countPattern(u32: Uint32Array, words: number, base: number, cp: CompiledPattern, out: CorePatternResult): void {
  let count = 0;
  let firstWord = -1;
  let firstBits = 0;
  let lastWord = -1;
  let lastBits = 0;
  if (cp.twin) {
    // Starts 11 and 17 (bits 2, 4) pair with the next bit of the byte; 29 (bit 7) with bit 0 of the
    // next byte, which is the next bit of the word except at bit 31.
    for (let w = 0; w < words; w++) {
      const P = u32[w]!;
      const occ = P & ((P >>> 1) | (u32[w + 1]! << 31)) & 0x94949494;
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
  } else {
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
  }
  if (count === 0) return;
  out.count += count;
  if (out.first < 0) out.first = base + 120 * firstWord + WORD_BIT_VALUE[31 - Math.clz32(firstBits & -firstBits)]!;
  out.last = base + 120 * lastWord + WORD_BIT_VALUE[31 - Math.clz32(lastBits)]!;
}
