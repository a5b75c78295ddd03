import { isSmallPrime } from '../primes/small-primes';
import type { CompiledPattern } from './pattern';
import { PRESIEVE_PERIOD, presievePattern } from './presieve';
import { wordIndex, wordPattern, type WordPattern } from './presieve-words';
import { RESIDUES, RESIDUE_BIT, popcount32 } from './wheel30';

/** Bytes of one piece sieved by the small primes at a time (the L1 data cache). */
const L1_BYTES = 1 << 14;
/** Primes below this bound have several hits per L1 piece and are sieved piece by piece. */
const SMALL_PRIME_BOUND = 1 << 13;

/** Sieving primes from this bound on go to the bucket sieve (fewer than one hit per class per segment). */
const LARGE_PRIME_BOUND = 1 << 19;

/** Bytes per sieve segment (each byte spans 30 integers); sized for the L2 cache. */
export const SEGMENT_BYTES = 1 << 19;

/** Statistics of one constellation pattern over a block (numbers; −1 for "none"). */
export interface CorePatternResult {
  count: number;
  first: number;
  last: number;
}

/** Consecutive-prime gap statistics over a block. */
export interface CoreGapResult {
  /** histogram[g] = number of consecutive primes p < p' in the block with p' − p = g. */
  histogram: Float64Array;
  /** Record gaps in order: each larger than every earlier gap of the block; `after` is the lower prime. */
  records: Array<{ gap: number; after: number }>;
}

/** Raw result of {@link sieveCore}; numbers are exact (the range lies below 2^53). */
export interface CoreResult {
  primeCount: number;
  firstPrime: number;
  lastPrime: number;
  patterns: CorePatternResult[];
  gaps: CoreGapResult | null;
}

// CLASS_STEP[8·r + c]: the least t ≥ 0 with r + t ≡ RESIDUES[c] (mod 30).
const CLASS_STEP: Int32Array = (() => {
  const t = new Int32Array(240);
  for (let r = 0; r < 30; r++) for (let c = 0; c < 8; c++) t[8 * r + c] = (((RESIDUES[c]! - r) % 30) + 30) % 30;
  return t;
})();
// For p ≡ s (mod 30): PRODUCT_RESIDUE[8·s + c] = s·RESIDUES[c] mod 30, PRODUCT_MASK the byte mask clearing it.
const PRODUCT_RESIDUE = new Int32Array(240);
const PRODUCT_MASK = new Uint8Array(240);
for (let s = 0; s < 30; s++) {
  for (let c = 0; c < 8; c++) {
    const r = (s * RESIDUES[c]!) % 30;
    PRODUCT_RESIDUE[8 * s + c] = r;
    PRODUCT_MASK[8 * s + c] = RESIDUE_BIT[r]! >= 0 ? ~(1 << RESIDUE_BIT[r]!) & 0xff : 0xff;
  }
}

// Offset (from the segment base) of the integer of bit `pos` of a 32-bit word at word index 0.
const WORD_BIT_VALUE: Int32Array = (() => {
  const t = new Int32Array(32);
  for (let pos = 0; pos < 32; pos++) t[pos] = 30 * (pos >> 3) + RESIDUES[pos & 7]!;
  return t;
})();

// Work arrays reused across calls (a sieve call runs to completion before the next one starts).
let scratchNext = new Int32Array(0);
let scratchMasks = new Uint8Array(0);
let scratchBuf = new Uint8Array(0);
let scratchU32 = new Uint32Array(0);

/**
 * Segmented sieve of Eratosthenes on the mod-30 wheel over [a, b] (safe integers, 0 ≤ a ≤ b,
 * b < 2^53): one byte per 30 integers, segments of SEGMENT_BYTES; the multiples of 7 … 19 removed by
 * copying a pre-sieved pattern, those of 23 … 43 by AND-ing word patterns; every sieving prime
 * 47 ≤ p < LARGE_PRIME_BOUND crossed off per wheel residue class (eight progressions of step p
 * bytes, unrolled), the larger ones by a bucket sieve. `sieving` must hold every prime ≤ √b in
 * increasing order (more are ignored). Counts primes, the given patterns (n ≥ a, n + max H ≤ b) and,
 * when asked, the gap histogram and the record gaps.
 */
export function sieveCore(
  a: number,
  b: number,
  patterns: readonly CompiledPattern[],
  wantGaps: boolean,
  sieving: Uint32Array,
): CoreResult {
  const pat: CorePatternResult[] = patterns.map(() => ({ count: 0, first: -1, last: -1 }));
  let histogram = new Float64Array(wantGaps ? 2048 : 0);
  const records: Array<{ gap: number; after: number }> = [];
  let lastSeen = -1; // last prime met so far (for gaps)
  let maxGap = 0;
  let primeCount = 0;
  let firstPrime = -1;
  let lastPrime = -1;

  const addGapPrime = (p: number): void => {
    if (lastSeen >= 0) {
      const g = p - lastSeen;
      if (g >= histogram.length) {
        const grown = new Float64Array(Math.max(2 * histogram.length, g + 1));
        grown.set(histogram);
        histogram = grown;
      }
      histogram[g]!++;
      if (g > maxGap) {
        maxGap = g;
        records.push({ gap: g, after: lastSeen });
      }
    }
    lastSeen = p;
  };

  // 2, 3 and 5 are not on the wheel: count them, and the occurrences that start at them, directly.
  for (const p of [2, 3, 5]) {
    if (p < a || p > b) continue;
    primeCount++;
    if (firstPrime < 0) firstPrime = p;
    lastPrime = p;
    if (wantGaps) addGapPrime(p);
  }
  patterns.forEach((cp, i) => {
    for (const n of [2, 3, 5]) {
      if (n < a || n + cp.diameter > b) continue;
      if (cp.offsets.every((h) => isSmallPrime(n + h))) {
        const r = pat[i]!;
        r.count++;
        if (r.first < 0) r.first = n;
        r.last = n;
      }
    }
  });
  if (b < 7) return finish();

  let maxByteOffset = 0;
  for (const cp of patterns) maxByteOffset = Math.max(maxByteOffset, cp.maxByteOffset);
  // Bytes sieved beyond each segment so that occurrences starting in it can be read whole.
  const extra = patterns.length > 0 ? (maxByteOffset + 11) & ~3 : 0;
  const base0 = a - (a % 30);
  const totalBytes = Math.floor((b - base0) / 30) + 1;
  if (scratchBuf.length < SEGMENT_BYTES + extra + 8) {
    const buffer = new ArrayBuffer(SEGMENT_BYTES + extra + 8);
    scratchBuf = new Uint8Array(buffer);
    scratchU32 = new Uint32Array(buffer);
  }
  const buf = scratchBuf;
  const u32 = scratchU32;
  const pattern = presievePattern(SEGMENT_BYTES + extra + 8);

  // Sieving primes from 47 up: next byte of each of the 8 residue-class progressions, and its mask.
  let firstSieving = 0;
  while (firstSieving < sieving.length && sieving[firstSieving]! <= LAST_PATTERN_PRIME) firstSieving++;
  let lastSieving = firstSieving;
  while (lastSieving < sieving.length && sieving[lastSieving]! * sieving[lastSieving]! <= b) lastSieving++;
  const nSieving = lastSieving - firstSieving;
  // Primes from LARGE_PRIME_BOUND on hit a segment less than once per residue class: bucket sieve.
  let nMedium = 0;
  while (nMedium < nSieving && sieving[firstSieving + nMedium]! < LARGE_PRIME_BOUND) nMedium++;
  const large = nMedium < nSieving ? new LargePrimes(sieving, firstSieving + nMedium, lastSieving, totalBytes) : null;
  if (scratchNext.length < 8 * nMedium) {
    scratchNext = new Int32Array(8 * nMedium);
    scratchMasks = new Uint8Array(8 * nMedium);
  }
  const next = scratchNext;
  const masks = scratchMasks;
  let active = 0;
  let small = 0;

  let done = 0;
  while (done < totalBytes) {
    const len = Math.min(SEGMENT_BYTES, (totalBytes - done + 3) & ~3);
    const L = len + extra;
    const base = base0 + 30 * done;
    const off = (base / 30) % PRESIEVE_PERIOD;
    buf.set(pattern.subarray(off, off + L), 0);
    buf.fill(0, L, L + 8);
    applyWordPatterns(u32, (L + 3) >> 2, base / 30);
    if (base < 30 * PATTERN_PRIMES_BYTES) {
      // The patterns removed 7 … 43 with their multiples: put them back; 1 is not prime.
      if (base === 0) buf[0]! &= 0xfe;
      for (const q of PATTERN_PRIMES) if (q >= base) buf[(q - base - (q % 30)) / 30]! |= 1 << RESIDUE_BIT[q % 30]!;
    }

    // Activate the primes whose square falls before the end of this segment.
    active = activate(sieving, firstSieving, nMedium, active, base, base + 30 * L, next, masks);
    // Primes with many hits per segment are crossed off one L1-sized piece at a time.
    while (small < active && sieving[firstSieving + small]! < SMALL_PRIME_BOUND) small++;
    for (let piece = L1_BYTES; piece < len; piece += L1_BYTES) crossRange(buf, next, masks, sieving, firstSieving, 0, small, piece, 0);
    crossRange(buf, next, masks, sieving, firstSieving, 0, small, len, 0);
    crossRange(buf, next, masks, sieving, firstSieving, small, active, len, 0);
    if (L > len) crossLookahead(buf, next, masks, sieving, firstSieving, active, len, L);
    for (let i = 0, n = active << 3; i < n; i++) next[i] -= len;
    if (large) large.crossSegment(buf, base0, done, len, L);
    clearOutside(buf, base, L, a, b);

    // Primes of this segment: start bytes [0, len).
    const words = len >> 2;
    let segCount = 0;
    for (let w = 0; w < words; w++) segCount += popcount32(u32[w]!);
    if (segCount > 0) {
      primeCount += segCount;
      if (firstPrime < 0) firstPrime = base + firstBitValue(u32, 0, words);
      lastPrime = base + lastBitValue(u32, words);
      if (wantGaps) {
        for (let w = 0; w < words; w++) {
          let x = u32[w]!;
          const wb = base + 120 * w;
          while (x !== 0) {
            const low = x & -x;
            const p = wb + WORD_BIT_VALUE[31 - Math.clz32(low)]!;
            x ^= low;
            if (lastSeen >= 0) {
              const g = p - lastSeen;
              if (g < histogram.length && g <= maxGap) {
                histogram[g]!++;
                lastSeen = p;
                continue;
              }
            }
            addGapPrime(p);
          }
        }
      }
    }
    for (let i = 0; i < patterns.length; i++) countPattern(u32, words, base, patterns[i]!, pat[i]!);
    done += len;
  }
  return finish();

  function finish(): CoreResult {
    return {
      primeCount,
      firstPrime,
      lastPrime,
      patterns: pat,
      gaps: wantGaps ? { histogram, records } : null,
    };
  }
}

// Primes 23 … 43 are removed by AND-ing word patterns (cheaper than crossing them off).
const WORD_PATTERNS: readonly WordPattern[] = [wordPattern([23, 29, 31]), wordPattern([37, 41, 43])];
const LAST_PATTERN_PRIME = 43;
const PATTERN_PRIMES: readonly number[] = [7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43];
const PATTERN_PRIMES_BYTES = 2;

/** ANDs the word patterns into the first `words` words of a segment starting at sieve byte K0. */
function applyWordPatterns(u32: Uint32Array, words: number, K0: number): void {
  const [A, B] = WORD_PATTERNS as [WordPattern, WordPattern];
  const wa = A.words, pa = A.period, wb = B.words, pb = B.period;
  let ta = wordIndex(A, K0);
  let tb = wordIndex(B, K0);
  for (let w = 0; w < words; w++) {
    u32[w]! &= wa[ta]! & wb[tb]!;
    if (++ta === pa) ta = 0;
    if (++tb === pb) tb = 0;
  }
}

/**
 * Crosses off, for the sieving primes i0 ≤ i < i1, every multiple whose byte lies before `end`;
 * each progression is left at its first byte ≥ end, minus `shift` (the segment length when the
 * segment is finished, so that positions become relative to the next segment).
 */
function crossRange(
  buf: Uint8Array,
  next: Int32Array,
  masks: Uint8Array,
  sieving: Uint32Array,
  first: number,
  i0: number,
  i1: number,
  end: number,
  shift: number,
): void {
  for (let i = i0; i < i1; i++) {
    const p = sieving[first + i]!;
    const o = i << 3;
    let j0 = next[o]!, j1 = next[o + 1]!, j2 = next[o + 2]!, j3 = next[o + 3]!;
    let j4 = next[o + 4]!, j5 = next[o + 5]!, j6 = next[o + 6]!, j7 = next[o + 7]!;
    const m0 = masks[o]!, m1 = masks[o + 1]!, m2 = masks[o + 2]!, m3 = masks[o + 3]!;
    const m4 = masks[o + 4]!, m5 = masks[o + 5]!, m6 = masks[o + 6]!, m7 = masks[o + 7]!;
    // The eight progressions stay within p bytes of each other: step them together.
    let jmax = Math.max(j0, j1, j2, j3, j4, j5, j6, j7);
    while (jmax < end) {
      buf[j0] &= m0; buf[j1] &= m1; buf[j2] &= m2; buf[j3] &= m3;
      buf[j4] &= m4; buf[j5] &= m5; buf[j6] &= m6; buf[j7] &= m7;
      j0 += p; j1 += p; j2 += p; j3 += p; j4 += p; j5 += p; j6 += p; j7 += p;
      jmax += p;
    }
    while (j0 < end) { buf[j0] &= m0; j0 += p; }
    while (j1 < end) { buf[j1] &= m1; j1 += p; }
    while (j2 < end) { buf[j2] &= m2; j2 += p; }
    while (j3 < end) { buf[j3] &= m3; j3 += p; }
    while (j4 < end) { buf[j4] &= m4; j4 += p; }
    while (j5 < end) { buf[j5] &= m5; j5 += p; }
    while (j6 < end) { buf[j6] &= m6; j6 += p; }
    while (j7 < end) { buf[j7] &= m7; j7 += p; }
    next[o] = j0 - shift; next[o + 1] = j1 - shift; next[o + 2] = j2 - shift; next[o + 3] = j3 - shift;
    next[o + 4] = j4 - shift; next[o + 5] = j5 - shift; next[o + 6] = j6 - shift; next[o + 7] = j7 - shift;
  }
}

/**
 * Starts the progressions of the sieving primes from index `active` on whose square lies below
 * `end`: for each residue class c, the byte (relative to `base`) of the least multiple p·m ≥
 * max(p², base) with m ≡ RESIDUES[c] (mod 30). Returns the new number of active primes.
 */
function activate(
  sieving: Uint32Array,
  first: number,
  count: number,
  active: number,
  base: number,
  end: number,
  next: Int32Array,
  masks: Uint8Array,
): number {
  while (active < count) {
    const p = sieving[first + active]!;
    if (p * p >= end) break;
    const start = p * p > base ? p * p : base;
    // m0 = ⌈start / p⌉ without a floating-point remainder (the quotient is corrected to be exact).
    let q = Math.floor(start / p);
    let rem = start - q * p;
    if (rem < 0) {
      q--;
      rem += p;
    } else if (rem >= p) {
      q++;
      rem -= p;
    }
    const m0 = rem === 0 ? q : q + 1;
    const d = (m0 - 30 * Math.floor(m0 / 30)) << 3;
    const pr = (p % 30) << 3;
    const o = active << 3;
    const rel = p * m0 - base; // small: the multiples are near base
    for (let c = 0; c < 8; c++) {
      const n = rel + p * CLASS_STEP[d + c]!;
      next[o + c] = (n - PRODUCT_RESIDUE[pr + c]!) / 30; // base ≡ 0 (mod 30)
      masks[o + c] = PRODUCT_MASK[pr + c]!;
    }
    active++;
  }
  return active;
}

// The wheel of cofactors m coprime to 30: from m ≡ RESIDUES[w] the next one is DELTA[w] further.
const DELTA = new Int32Array([6, 4, 2, 4, 2, 4, 6, 2]);
// For p ≡ s (mod 30) and p = 30q + s: the byte of p·m advances by q·DELTA[w] + BYTE_CARRY[8s + w].
const BYTE_CARRY = new Int32Array(240);
for (let s = 0; s < 30; s++) {
  for (let w = 0; w < 8; w++) {
    const r = RESIDUES[w]!;
    BYTE_CARRY[8 * s + w] = Math.floor((s * (r + DELTA[w]!)) / 30) - Math.floor((s * r) / 30);
  }
}
// For r in 0..29: the least t ≥ 0 with r + t coprime to 30, and the wheel index of r + t.
const TO_WHEEL_STEP = new Int32Array(30);
const TO_WHEEL_INDEX = new Int32Array(30);
for (let r = 0; r < 30; r++) {
  let t = 0;
  while (RESIDUE_BIT[(r + t) % 30]! < 0) t++;
  TO_WHEEL_STEP[r] = t;
  TO_WHEEL_INDEX[r] = RESIDUE_BIT[(r + t) % 30]!;
}

/**
 * Bucket sieve for the large sieving primes: each waits in the bucket of the segment of its next
 * multiple as two small integers, its index and (byte offset in that segment)·8 + (wheel index of
 * its cofactor); a segment only touches the primes that hit it.
 */
class LargePrimes {
  private readonly buckets: number[][];
  private activated: number;

  constructor(
    private readonly sieving: Uint32Array,
    from: number,
    private readonly to: number,
    private readonly totalBytes: number,
  ) {
    const maxStep = Math.floor(sieving[to - 1]! / 5) + 2; // q·6 + carry ≤ p/5 + 2 bytes
    this.buckets = Array.from({ length: Math.floor(maxStep / SEGMENT_BYTES) + 2 }, () => []);
    this.activated = from;
  }

  /** Crosses off the large primes' multiples in the segment starting at block byte `start`. */
  crossSegment(buf: Uint8Array, base0: number, start: number, len: number, L: number): void {
    const segment = start / SEGMENT_BYTES;
    const base = base0 + 30 * start;
    const end = base + 30 * L;
    const sieving = this.sieving;
    const ring = this.buckets.length;
    // Start the primes whose square lies before the end of this segment.
    while (this.activated < this.to) {
      const p = sieving[this.activated]!;
      if (p * p >= end) break;
      const first = p * p > base ? p * p : base;
      let q = Math.floor(first / p);
      let rem = first - q * p;
      if (rem < 0) {
        q--;
        rem += p;
      } else if (rem >= p) {
        q++;
        rem -= p;
      }
      let m = rem === 0 ? q : q + 1;
      const r = m - 30 * Math.floor(m / 30);
      m += TO_WHEEL_STEP[r]!;
      const w = TO_WHEEL_INDEX[r]!;
      const j = (p * m - base - PRODUCT_RESIDUE[8 * (p % 30) + w]!) / 30;
      if (start + j < this.totalBytes) {
        const d = Math.floor(j / SEGMENT_BYTES);
        this.buckets[(segment + d) % ring]!.push(this.activated, ((j - d * SEGMENT_BYTES) << 3) | w);
      }
      this.activated++;
    }
    const current = this.buckets[segment % ring]!;
    const last = start + len >= this.totalBytes;
    for (let t = 0; t < current.length; t += 2) {
      const i = current[t]!;
      const packed = current[t + 1]!;
      let j = packed >>> 3;
      let w = packed & 7;
      const p = sieving[i]!;
      const s = p % 30;
      const s8 = s << 3;
      const q = (p - s) / 30;
      while (j < len) {
        buf[j]! &= PRODUCT_MASK[s8 + w]!;
        j += q * DELTA[w]! + BYTE_CARRY[s8 + w]!;
        w = (w + 1) & 7;
      }
      if (last) continue; // past the block
      const d = (j / SEGMENT_BYTES) | 0;
      this.buckets[(segment + d) % ring]!.push(i, ((j - d * SEGMENT_BYTES) << 3) | w);
    }
    current.length = 0;
    if (L > len && !last) {
      // Look-ahead bytes [len, L): the hits of the primes waiting for the next segment (len = SEGMENT_BYTES).
      const following = this.buckets[(segment + 1) % ring]!;
      for (let t = 0; t < following.length; t += 2) {
        const i = following[t]!;
        const packed = following[t + 1]!;
        let j = (packed >>> 3) + len;
        let w = packed & 7;
        const p = sieving[i]!;
        const s = p % 30;
        const s8 = s << 3;
        const q = (p - s) / 30;
        while (j < L) {
          buf[j]! &= PRODUCT_MASK[s8 + w]!;
          j += q * DELTA[w]! + BYTE_CARRY[s8 + w]!;
          w = (w + 1) & 7;
        }
      }
    }
  }
}

/** Crosses off the look-ahead bytes [len, L) (they are sieved again as part of the next segment). */
function crossLookahead(
  buf: Uint8Array,
  next: Int32Array,
  masks: Uint8Array,
  sieving: Uint32Array,
  first: number,
  active: number,
  len: number,
  L: number,
): void {
  for (let i = 0; i < active; i++) {
    const p = sieving[first + i]!;
    const o = i << 3;
    for (let c = 0; c < 8; c++) {
      const m = masks[o + c]!;
      for (let j = next[o + c]!; j < L; j += p) buf[j] &= m;
    }
  }
}

/** Clears the bits of the integers outside [a, b] among the bytes [0, L) that start at base. */
function clearOutside(buf: Uint8Array, base: number, L: number, a: number, b: number): void {
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
function firstBitValue(u32: Uint32Array, from: number, words: number): number {
  for (let w = from; w < words; w++) {
    const x = u32[w]!;
    if (x !== 0) return 120 * w + WORD_BIT_VALUE[31 - Math.clz32(x & -x)]!;
  }
  return -1;
}

/** Offset from the base of the highest set bit in words [0, words) (there must be one). */
function lastBitValue(u32: Uint32Array, words: number): number {
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
function countPattern(u32: Uint32Array, words: number, base: number, cp: CompiledPattern, out: CorePatternResult): void {
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
