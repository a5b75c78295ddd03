// The WebAssembly sieve kernel as the JavaScript driver sees it: its exports, views of its memory,
// and the tables it needs (copied in once per instance). Pure: the caller instantiates the module
// (libs/engine/src/node/wasm-kernel.ts reads it from dist); the source is libs/engine/assembly.
import type { CompiledPattern } from './pattern';
import { WORD_PATTERNS, wordPattern, type WordPattern } from './presieve-words';
import { CLASS_STEP, PRODUCT_MASK, PRODUCT_RESIDUE, RESIDUES } from './wheel30';

/** The functions the kernel exports (libs/engine/assembly/sieve-kernel.ts documents each). */
export interface SieveKernelExports {
  /** The kernel's memory (fixed size: initial = maximum). */
  readonly memory: { readonly buffer: ArrayBuffer };
  layout(k: number): number;
  setPattern(k: number, address: number, period: number, inverse4: number): void;
  presieve(from: number, words: number, K0: number): void;
  activate(active: number, count: number, base: number, end: number): number;
  crossRange(i0: number, i1: number, end: number, shift: number): void;
  endSegment(active: number, len: number, L: number): void;
  countPrimes(from: number, to: number): number;
  countPrimesAndTwins(from: number, to: number): number;
  twins(): number;
  gapStart(last: number, largest: number): void;
  gapWalk(words: number, base: number): void;
  recordCount(): number;
  gapOverflow(): number;
  countPattern(words: number, desc: number): number;
  patternFirst(): number;
  patternLast(): number;
}

/** Crossing primes must lie below this bound (the kernel's layout holds them all): ranges end below 2^40. */
export const KERNEL_PRIME_BOUND = 1 << 20;
/** Largest `to` the kernel sieves: every sieving prime ≤ √to is below KERNEL_PRIME_BOUND. */
export const KERNEL_MAX_TO = KERNEL_PRIME_BOUND * KERNEL_PRIME_BOUND - 1;

const REPLICATED = 0x01010101;

/**
 * The primes the kernel removes by word patterns instead of crossing them off: the JavaScript
 * sieve's four tables of 7 … 47 and eight pair tables of 53 … 127 (in WebAssembly an AND of four
 * tables costs a few instructions per 16 bytes, far less than the crossings they replace; the
 * JavaScript sieve measured the opposite for itself). Four tables per pass.
 */
export const KERNEL_TABLE_PRIMES: readonly (readonly number[])[] = [
  [53, 59], [61, 67], [71, 73], [79, 83], [89, 97], [101, 103], [107, 109], [113, 127],
];

/** An instantiated kernel with its memory views; one per thread (its memory holds the segment). */
export class SieveKernel {
  readonly seg: number;
  readonly bytes: Uint8Array;
  readonly i32: Int32Array;
  readonly f64: Float64Array;
  readonly histAddress: number;
  readonly histSize: number;
  readonly recordsAddress: number;
  readonly maxRecords: number;
  private readonly primesAddress: number;
  private readonly maxPrimes: number;
  private readonly patternAddress: number;
  private readonly patternEnd: number;
  /** Crossing primes copied so far (the first ones of the sieving list above lastTablePrime). */
  private primesLoaded = 0;
  /** The primes removed by the tables (put back by the driver in the first bytes). */
  readonly tablePrimes: readonly number[];
  /** The largest of them: crossing off starts after it. */
  readonly lastTablePrime: number;

  /** `extraTables`: pair tables beyond 7 … 47 (a multiple of 4; 0 gives the JavaScript sieve's presieve). */
  readonly exports: SieveKernelExports;

  // (The exports are not a parameter property: a parameter named `exports` would shadow CommonJS's.)
  constructor(api: SieveKernelExports, extraTables: readonly (readonly number[])[] = KERNEL_TABLE_PRIMES) {
    this.exports = api;
    const k = api;
    const buffer = k.memory.buffer;
    // The memory has a fixed size (initial = maximum), so these views never detach.
    this.bytes = new Uint8Array(buffer);
    this.i32 = new Int32Array(buffer);
    this.f64 = new Float64Array(buffer);
    this.seg = k.layout(0);
    this.primesAddress = k.layout(1);
    this.i32.set(CLASS_STEP, k.layout(4) >> 2);
    this.i32.set(PRODUCT_RESIDUE, k.layout(5) >> 2);
    this.bytes.set(PRODUCT_MASK, k.layout(6));
    const bitValue = new Int32Array(64);
    for (let pos = 0; pos < 64; pos++) bitValue[pos] = 30 * (pos >> 3) + RESIDUES[pos & 7]!;
    this.i32.set(bitValue, k.layout(7) >> 2);
    // The word patterns, each stored CHUNK + 4 words past its period (whole 16-byte loads never wrap).
    if (extraTables.length % 4 !== 0 || 4 + extraTables.length > k.layout(18)) throw new Error('internal: kernel tables come in fours');
    const tables: WordPattern[] = [...WORD_PATTERNS, ...extraTables.map((primes) => wordPattern(primes))];
    this.tablePrimes = [7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47, ...extraTables.flat()].sort((x, y) => x - y);
    this.lastTablePrime = this.tablePrimes[this.tablePrimes.length - 1]!;
    const chunk = k.layout(14);
    let at = k.layout(8);
    tables.forEach((pattern, i) => {
      const n = pattern.period + chunk + 4;
      if (at + 4 * n > k.layout(17)) throw new Error('internal: the word patterns overflow the kernel layout');
      const w0 = at >> 2;
      for (let t = 0; t < n; t += pattern.period) this.i32.set(new Int32Array(pattern.words.buffer, pattern.words.byteOffset, Math.min(pattern.period, n - t)), w0 + t);
      k.setPattern(i, at, pattern.period, pattern.inverse4);
      at += 4 * n + 16;
    });
    this.histAddress = k.layout(9);
    this.recordsAddress = k.layout(10);
    this.patternAddress = k.layout(11);
    this.patternEnd = k.layout(12);
    this.maxPrimes = k.layout(13);
    this.histSize = k.layout(15);
    this.maxRecords = k.layout(16);
  }

  /** Makes the kernel hold the crossing primes sieving[first … first + count) (a prefix of the primes above 47). */
  loadPrimes(sieving: Uint32Array, first: number, count: number): void {
    if (count <= this.primesLoaded) return;
    if (count > this.maxPrimes) throw new Error(`internal: ${count} crossing primes exceed the kernel's ${this.maxPrimes}`);
    const last = sieving[first + count - 1]!;
    if (last >= KERNEL_PRIME_BOUND) throw new Error(`internal: crossing prime ${last} is above the kernel bound`);
    this.i32.set(sieving.subarray(first + this.primesLoaded, first + count), (this.primesAddress >> 2) + this.primesLoaded);
    this.primesLoaded = count;
  }

  /**
   * Writes the descriptors of the patterns into the kernel's memory and returns their addresses.
   * For each term, the start classes c are grouped by (byte offset of the term, its bit − c): one
   * shifted load per group serves every class in it (e.g. twins need one, {0, 6} two). Null when
   * they do not fit (patterns of thousands of terms; the JavaScript sieve takes those).
   */
  writePatterns(patterns: readonly CompiledPattern[]): number[] | null {
    const out: number[] = [];
    let w = this.patternAddress >> 2;
    const end = this.patternEnd >> 2;
    const i32 = this.i32;
    for (const cp of patterns) {
      out.push(w << 2);
      const words: number[] = [];
      let classMask = 0;
      for (const c of cp.classes) classMask |= REPLICATED << c;
      words.push(classMask | 0, classMask | 0, cp.offsets.length);
      for (let t = 0; t < cp.offsets.length; t++) {
        const groups = new Map<string, { byte: number; shift: number; mask: number }>();
        cp.classes.forEach((c, ci) => {
          const byte = cp.termBytes[ci]![t]!;
          const shift = cp.termBits[ci]![t]! - c;
          const key = `${byte},${shift}`;
          const g = groups.get(key) ?? { byte, shift, mask: 0 };
          g.mask |= REPLICATED << c;
          groups.set(key, g);
        });
        words.push(groups.size);
        for (const g of groups.values()) words.push(g.byte, g.shift, g.mask | 0, g.mask | 0);
      }
      if (w + words.length > end) return null;
      i32.set(words, w);
      w += words.length;
    }
    return out;
  }
}
