// The segmented sieve of core.ts with its inner loops in the WebAssembly kernel (kernel.ts): the
// same segments, look-ahead, pieces and counts, driven from here one segment at a time. The
// JavaScript sieveCore stays the reference; tests compare the two on random ranges.
import { isSmallPrime } from '../primes/small-primes';
import type { CoreResult } from './core';
import { KERNEL_MAX_TO, type SieveKernel } from './kernel';
import { L1_BYTES, LOOKAHEAD_BYTES, SEGMENT_BYTES, SMALL_PRIME_BOUND } from './layout';
import type { CompiledPattern } from './pattern';
import { checkStop, type WorkHooks } from './progress';
import { RESIDUES, RESIDUE_BIT, WORD_BIT_VALUE } from './wheel30';

const SEGMENTS_PER_REPORT = 4;

/** Whether the kernel can sieve [a, b] with these patterns (else the caller uses sieveCore). */
export function kernelFits(b: number): boolean {
  return b <= KERNEL_MAX_TO;
}

/**
 * {@link sieveCore} with the kernel: same arguments and result. The caller checks
 * {@link kernelFits} (b < 2^40, i.e. every sieving prime below 2^20 — no bucket sieve). Returns
 * null when the patterns do not fit the kernel's descriptor memory.
 */
export function sieveCoreWasm(
  kernel: SieveKernel,
  a: number,
  b: number,
  patterns: readonly CompiledPattern[],
  wantGaps: boolean,
  sieving: Uint32Array,
  hooks?: WorkHooks,
): CoreResult | null {
  if (!kernelFits(b)) throw new Error(`internal: ${b} is above the kernel's range`);
  const descriptors = kernel.writePatterns(patterns);
  if (!descriptors) return null;
  const k = kernel.exports;
  const bytes = kernel.bytes;
  const i32 = kernel.i32;
  const SEG = kernel.seg;
  const W0 = SEG >> 2; // the segment's first word in i32

  const stats = new Float64Array(3 * patterns.length);
  for (let i = 0; i < patterns.length; i++) stats[3 * i + 1] = stats[3 * i + 2] = -1;
  let primeCount = 0;
  let firstPrime = -1;
  let lastPrime = -1;
  // 2, 3 and 5 are not on the wheel: counted here, with their gaps (the kernel goes on from them).
  const early: number[] = [];
  for (const p of [2, 3, 5]) {
    if (p < a || p > b) continue;
    primeCount++;
    if (firstPrime < 0) firstPrime = p;
    lastPrime = p;
    early.push(p);
  }
  patterns.forEach((cp, i) => {
    for (const n of [2, 3, 5]) {
      if (n < a || n + cp.diameter > b) continue;
      if (cp.offsets.every((h) => isSmallPrime(n + h))) {
        stats[3 * i]!++;
        if (stats[3 * i + 1]! < 0) stats[3 * i + 1] = n;
        stats[3 * i + 2] = n;
      }
    }
  });
  const earlyGaps: number[] = [];
  const earlyRecords: Array<{ gap: number; after: number }> = [];
  let maxGap = 0;
  for (let i = 1; i < early.length; i++) {
    const g = early[i]! - early[i - 1]!;
    earlyGaps.push(g);
    if (g > maxGap) {
      maxGap = g;
      earlyRecords.push({ gap: g, after: early[i - 1]! });
    }
  }
  if (wantGaps) k.gapStart(early.length > 0 ? early[early.length - 1]! : -1, maxGap);
  // The boundary windows' primes are read off the sieved segments (a separate walk over each
  // window cost about 1.5 ms per block: most of a ledger block's set-up).
  const W = patterns.reduce((w, cp) => Math.max(w, cp.diameter), 0);
  const head: number[] = [];
  const tail: number[] = [];
  const headHi = Math.min(b, a + W - 1);
  const tailLo = Math.max(a, b - W + 1);
  for (const p of early) {
    if (p <= headHi) head.push(p);
    if (p >= tailLo) tail.push(p);
  }
  if (b < 7) return finish();

  const twinIndex = patterns.findIndex((cp) => cp.twin);
  let maxByteOffset = 0;
  for (const cp of patterns) maxByteOffset = Math.max(maxByteOffset, cp.maxByteOffset);
  // 8 more bytes than core.ts: the kernel reads patterns 8 bytes at a time.
  const extra = patterns.length > 0 ? (maxByteOffset + 19) & ~3 : 0;
  if (extra > LOOKAHEAD_BYTES) throw new Error(`internal: look-ahead of ${extra} bytes exceeds ${LOOKAHEAD_BYTES}`);
  const base0 = a - (a % 30);
  const totalBytes = Math.floor((b - base0) / 30) + 1;

  let firstSieving = 0;
  while (firstSieving < sieving.length && sieving[firstSieving]! <= kernel.lastTablePrime) firstSieving++;
  let lastSieving = firstSieving;
  while (lastSieving < sieving.length && sieving[lastSieving]! * sieving[lastSieving]! <= b) lastSieving++;
  const nCross = lastSieving - firstSieving;
  kernel.loadPrimes(sieving, firstSieving, nCross);
  let nSmall = 0;
  while (nSmall < nCross && sieving[firstSieving + nSmall]! < SMALL_PRIME_BOUND) nSmall++;
  let active = 0;
  let small = 0;

  const what = `sieving [${a}, ${b}]`;
  let segments = 0;
  let done = 0;
  let prevLen = 0;
  const twins = twinIndex >= 0;
  const tw = 3 * twinIndex;
  while (done < totalBytes) {
    if (hooks && segments > 0 && segments % SEGMENTS_PER_REPORT === 0) {
      checkStop(hooks, what);
      hooks.onProgress?.(done / totalBytes, what);
    }
    segments++;
    const rest = totalBytes - done;
    const len = rest >= SEGMENT_BYTES ? SEGMENT_BYTES : (rest + 3) & ~3;
    const L = len + extra;
    const base = base0 + 30 * done;
    const carry = prevLen > 0 ? extra : 0;
    if (carry > 0) bytes.copyWithin(SEG, SEG + prevLen, SEG + prevLen + carry);
    k.presieve(carry >> 2, (L + 3) >> 2, base / 30);
    bytes.fill(0, SEG + L, SEG + L + 16);
    if (base <= kernel.lastTablePrime) {
      // The tables removed their primes with the multiples: put them back; 1 is not prime.
      if (base === 0) bytes[SEG]! &= 0xfe;
      for (const q of kernel.tablePrimes) if (q >= base) bytes[SEG + (q - base - (q % 30)) / 30]! |= 1 << RESIDUE_BIT[q % 30]!;
    }
    clearOutside(bytes, SEG, base, L, a, b);

    active = k.activate(active, nCross, base, base + 30 * L);
    small = Math.min(active, nSmall);
    k.crossRange(small, active, L, len);
    const words = len >> 2;
    let segCount = 0;
    let counted = 0;
    const twinsBefore = twins ? stats[tw]! : 0;
    for (let piece = L1_BYTES; piece < len; piece += L1_BYTES) {
      k.crossRange(0, small, piece, 0);
      const upTo = (piece >> 2) - 1;
      if (twins) {
        segCount += k.countPrimesAndTwins(counted, upTo);
        stats[tw] += k.twins();
      } else segCount += k.countPrimes(counted, upTo);
      counted = upTo;
    }
    k.crossRange(0, small, len, 0);
    k.endSegment(small, len, L);
    if (twins) {
      segCount += k.countPrimesAndTwins(counted, words);
      stats[tw] += k.twins();
    } else segCount += k.countPrimes(counted, words);
    if (twins && stats[tw]! > twinsBefore) locateTwins(i32, W0, words, base, stats, tw);
    if (segCount > 0) {
      primeCount += segCount;
      if (firstPrime < 0) firstPrime = base + firstBitValue(i32, W0, words);
      lastPrime = base + lastBitValue(i32, W0, words);
      if (wantGaps) k.gapWalk(words, base);
    }
    if (W > 0 && segCount > 0) {
      const segHi = base + 30 * len - 1;
      if (a <= segHi && headHi >= base) collectPrimes(bytes, SEG, base, Math.max(a, base), Math.min(headHi, segHi), head);
      if (tailLo <= segHi && b >= base) collectPrimes(bytes, SEG, base, Math.max(tailLo, base), Math.min(b, segHi), tail);
    }
    for (let i = 0; i < patterns.length; i++) {
      if (i === twinIndex) continue;
      const n = k.countPattern(words, descriptors[i]!);
      if (n === 0) continue;
      const at = 3 * i;
      stats[at] += n;
      if (stats[at + 1]! < 0) stats[at + 1] = base + k.patternFirst();
      stats[at + 2] = base + k.patternLast();
    }
    done += len;
    prevLen = len;
  }
  hooks?.onProgress?.(1, what);
  return finish();

  function finish(): CoreResult {
    let gaps: CoreResult['gaps'] = null;
    if (wantGaps) {
      if (k.gapOverflow()) throw new Error('internal: a prime gap above the kernel histogram');
      // Trimmed to the largest gap met, as core.ts grows its histogram only as far as needed.
      const all = kernel.f64.subarray(kernel.histAddress >> 3, (kernel.histAddress >> 3) + kernel.histSize);
      let top = all.length - 1;
      while (top > 0 && all[top] === 0) top--;
      const histogram = new Float64Array(Math.max(2048, top + 1));
      histogram.set(all.subarray(0, top + 1));
      for (const g of earlyGaps) histogram[g]!++;
      const records = [...earlyRecords];
      const n = b < 7 ? 0 : k.recordCount();
      const r0 = kernel.recordsAddress;
      for (let r = 0; r < n; r++) records.push({ gap: i32[(r0 >> 2) + 4 * r]!, after: kernel.f64[(r0 >> 3) + 2 * r + 1]! });
      if (n >= kernel.maxRecords) throw new Error('internal: more record gaps than the kernel stores');
      gaps = { histogram, records };
    }
    return {
      primeCount,
      firstPrime,
      lastPrime,
      patterns: patterns.map((_, i) => ({ count: stats[3 * i]!, first: stats[3 * i + 1]!, last: stats[3 * i + 2]! })),
      gaps,
      windows: W > 0 ? { head, tail } : undefined,
    };
  }
}

/** Appends the primes in [lo, hi] (within the segment at `base`) in increasing order. */
function collectPrimes(buf: Uint8Array, SEG: number, base: number, lo: number, hi: number, out: number[]): void {
  if (lo > hi) return;
  const k1 = Math.floor((hi - base) / 30);
  for (let k = Math.floor((lo - base) / 30); k <= k1; k++) {
    const v = buf[SEG + k]!;
    if (v === 0) continue;
    for (let i = 0; i < 8; i++) {
      if ((v & (1 << i)) === 0) continue;
      const p = base + 30 * k + RESIDUES[i]!;
      if (p >= lo && p <= hi) out.push(p);
    }
  }
}

/** count.ts's clearOutside on the kernel's segment (at byte SEG of `buf`). */
function clearOutside(buf: Uint8Array, SEG: number, base: number, L: number, a: number, b: number): void {
  if (a > base) {
    const k = Math.floor((a - base) / 30);
    buf.fill(0, SEG, SEG + Math.min(k, L));
    if (k < L) for (let i = 0; i < 8; i++) if (base + 30 * k + RESIDUES[i]! < a) buf[SEG + k]! &= ~(1 << i);
  }
  if (b < base + 30 * L - 1) {
    const k = Math.floor((b - base) / 30);
    for (let i = 0; i < 8; i++) if (base + 30 * k + RESIDUES[i]! > b) buf[SEG + k]! &= ~(1 << i);
    buf.fill(0, SEG + k + 1, SEG + L);
  }
}

function firstBitValue(u32: Int32Array, W0: number, words: number): number {
  for (let w = 0; w < words; w++) {
    const x = u32[W0 + w]!;
    if (x !== 0) return 120 * w + WORD_BIT_VALUE[31 - Math.clz32(x & -x)]!;
  }
  return -1;
}

function lastBitValue(u32: Int32Array, W0: number, words: number): number {
  for (let w = words - 1; w >= 0; w--) {
    const x = u32[W0 + w]!;
    if (x !== 0) return 120 * w + WORD_BIT_VALUE[31 - Math.clz32(x)]!;
  }
  return -1;
}

function twinBits(u32: Int32Array, W0: number, w: number): number {
  const P = u32[W0 + w]!;
  return P & ((P >>> 1) | (u32[W0 + w + 1]! << 31)) & 0x94949494;
}

function locateTwins(u32: Int32Array, W0: number, words: number, base: number, stats: Float64Array, at: number): void {
  if (stats[at + 1]! < 0) {
    let w = 0;
    while (twinBits(u32, W0, w) === 0) w++;
    const occ = twinBits(u32, W0, w);
    stats[at + 1] = base + 120 * w + WORD_BIT_VALUE[31 - Math.clz32(occ & -occ)]!;
  }
  let w = words - 1;
  while (twinBits(u32, W0, w) === 0) w--;
  stats[at + 2] = base + 120 * w + WORD_BIT_VALUE[31 - Math.clz32(twinBits(u32, W0, w))]!;
}
