import { isSmallPrime } from '../primes/small-primes';
import type { CompiledPattern } from './pattern';
import { LargePrimes } from './buckets';
import { clearOutside, countPattern, countPrimes, countPrimesAndTwins, firstBitValue, lastBitValue, locateTwins } from './count';
import { activate, crossRange, endSegment } from './cross';
import { CROSSING_PRIMES_MAX, L1_BYTES, LARGE_PRIME_BOUND, LOOKAHEAD_BYTES, SEGMENT_BUFFER, SEGMENT_BYTES, SMALL_PRIME_BOUND } from './layout';
import { LAST_PATTERN_PRIME, PATTERN_PRIMES, PATTERN_PRIMES_BYTES, writeWordPatterns } from './presieve-words';
import { checkStop, type WorkHooks } from './progress';
import { RESIDUE_BIT, WORD_BIT_VALUE } from './wheel30';

export { SEGMENT_BYTES } from './layout';

/** Segments between two progress reports / stop checks (about 6·10^7 integers, tens of milliseconds). */
export const SEGMENTS_PER_REPORT = 4;

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
  /**
   * The primes of the boundary windows [a, a + W) and (b − W, b] (W = the largest pattern
   * diameter), increasing, when the sieve collected them itself (the kernel driver does; without
   * them the caller walks the windows).
   */
  windows?: { head: number[]; tail: number[] };
}

// The segment as module constants (see SEGMENT_BUFFER: why not parameters).
const BUF = new Uint8Array(SEGMENT_BUFFER);
const WORDS = new Int32Array(SEGMENT_BUFFER);

/**
 * Segmented sieve of Eratosthenes on the mod-30 wheel over [a, b] (safe integers, 0 ≤ a ≤ b,
 * b < 2^53): one byte per 30 integers, segments of SEGMENT_BYTES; the multiples of 7 … 47 removed by
 * writing word patterns; every sieving prime 53 ≤ p < LARGE_PRIME_BOUND crossed off per wheel
 * residue class (eight progressions of step p bytes, unrolled), the larger ones by a bucket sieve.
 * `sieving` must hold every prime ≤ √b in increasing order (more are ignored). Counts primes, the
 * given patterns (n ≥ a, n + max H ≤ b) and, when asked, the gap histogram and the record gaps.
 * `hooks` are called every SEGMENTS_PER_REPORT segments and once with fraction 1 at the end.
 * @throws EngineError(limit) when `hooks.shouldStop` answers true (or whatever it throws).
 */
export function sieveCore(
  a: number,
  b: number,
  patterns: readonly CompiledPattern[],
  wantGaps: boolean,
  sieving: Uint32Array,
  hooks?: WorkHooks,
): CoreResult {
  // Count, first and last of pattern i at 3i, 3i + 1, 3i + 2 (see countPrimesAndTwins: why not objects).
  const stats = new Float64Array(3 * patterns.length);
  for (let i = 0; i < patterns.length; i++) stats[3 * i + 1] = stats[3 * i + 2] = -1;
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
        stats[3 * i]!++;
        if (stats[3 * i + 1]! < 0) stats[3 * i + 1] = n;
        stats[3 * i + 2] = n;
      }
    }
  });
  if (b < 7) return finish();

  const twinIndex = patterns.findIndex((cp) => cp.twin); // counted in the same pass as π
  let maxByteOffset = 0;
  for (const cp of patterns) maxByteOffset = Math.max(maxByteOffset, cp.maxByteOffset);
  // Bytes sieved beyond each segment so that occurrences starting in it can be read whole.
  const extra = patterns.length > 0 ? (maxByteOffset + 11) & ~3 : 0;
  const base0 = a - (a % 30);
  const totalBytes = Math.floor((b - base0) / 30) + 1;
  // MAX_PATTERN_DIAMETER keeps the look-ahead within the buffer (sieve.test.ts sieves the widest pattern).
  if (extra > LOOKAHEAD_BYTES) throw new Error(`internal: look-ahead of ${extra} bytes exceeds ${LOOKAHEAD_BYTES}`);
  const buf = BUF;
  const u32 = WORDS;

  // Sieving primes above LAST_PATTERN_PRIME: next byte of each of the 8 residue-class progressions, and its mask.
  let firstSieving = 0;
  while (firstSieving < sieving.length && sieving[firstSieving]! <= LAST_PATTERN_PRIME) firstSieving++;
  let lastSieving = firstSieving;
  while (lastSieving < sieving.length && sieving[lastSieving]! * sieving[lastSieving]! <= b) lastSieving++;
  const nSieving = lastSieving - firstSieving;
  // Primes from LARGE_PRIME_BOUND on hit a segment less than once per residue class: bucket sieve.
  let nMedium = 0;
  while (nMedium < nSieving && sieving[firstSieving + nMedium]! < LARGE_PRIME_BOUND) nMedium++;
  const large = nMedium < nSieving ? new LargePrimes(sieving, firstSieving + nMedium, lastSieving, totalBytes) : null;
  if (nMedium > CROSSING_PRIMES_MAX) throw new Error(`internal: ${nMedium} crossing primes exceed ${CROSSING_PRIMES_MAX}`);
  let active = 0;
  let small = 0;

  const what = `sieving [${a}, ${b}]`;
  let segments = 0;
  let done = 0;
  let prevLen = 0; // bytes of the previous segment (0 before the first)
  while (done < totalBytes) {
    if (hooks && segments > 0 && segments % SEGMENTS_PER_REPORT === 0) {
      checkStop(hooks, what);
      hooks.onProgress?.(done / totalBytes, what);
    }
    segments++;
    // Rounded up to whole words; compared first, as `& ~3` would wrap above 2^31 bytes (ranges over 6·10^10).
    const rest = totalBytes - done;
    const len = rest >= SEGMENT_BYTES ? SEGMENT_BYTES : (rest + 3) & ~3;
    const L = len + extra;
    const base = base0 + 30 * done;
    // The previous segment's look-ahead, sieved whole, is this segment's start: carried over, since
    // the primes from SMALL_PRIME_BOUND on crossed it off there and go on after it (one pass over
    // their progressions per segment instead of two; the others cross it again, which is harmless).
    const carry = prevLen > 0 ? extra : 0;
    if (carry > 0) buf.copyWithin(0, prevLen, prevLen + carry);
    writeWordPatterns(carry >> 2, (L + 3) >> 2, base / 30);
    buf.fill(0, L, L + 8);
    if (base < 30 * PATTERN_PRIMES_BYTES) {
      // The patterns removed 7 … 47 with their multiples: put them back; 1 is not prime.
      if (base === 0) buf[0]! &= 0xfe;
      for (const q of PATTERN_PRIMES) if (q >= base) buf[(q - base - (q % 30)) / 30]! |= 1 << RESIDUE_BIT[q % 30]!;
    }

    // Clearing commutes with crossing off: done first, so that pieces can be counted once finished.
    clearOutside(base, L, a, b);

    // Activate the primes whose square falls before the end of this segment.
    active = activate(sieving, firstSieving, nMedium, active, base, base + 30 * L);
    while (small < active && sieving[firstSieving + small]! < SMALL_PRIME_BOUND) small++;
    // The primes with few hits per piece cross the whole segment and its look-ahead first, and their
    // positions become relative to the next segment; then the small primes one
    // L1-sized piece at a time, and each piece is counted while it is still in the cache (its last
    // word waits for the next piece: a twin starting there ends in it).
    crossRange(small, active, L, len);
    if (large) large.crossSegment(base0, done, len, L);
    const words = len >> 2;
    const twins = twinIndex >= 0;
    const tw = 3 * twinIndex;
    const twinsBefore = twins ? stats[tw]! : 0;
    let segCount = 0;
    let counted = 0;
    for (let piece = L1_BYTES; piece < len; piece += L1_BYTES) {
      crossRange(0, small, piece, 0);
      const upTo = (piece >> 2) - 1;
      segCount += twins ? countPrimesAndTwins(counted, upTo, stats, tw) : countPrimes(counted, upTo);
      counted = upTo;
    }
    crossRange(0, small, len, 0);
    endSegment(small, len, L);

    // Primes of this segment: start bytes [0, len).
    segCount += twins ? countPrimesAndTwins(counted, words, stats, tw) : countPrimes(counted, words);
    if (twins && stats[tw]! > twinsBefore) locateTwins(words, base, stats, tw);
    if (segCount > 0) {
      primeCount += segCount;
      if (firstPrime < 0) firstPrime = base + firstBitValue(0, words);
      lastPrime = base + lastBitValue(words);
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
    for (let i = 0; i < patterns.length; i++) if (i !== twinIndex) countPattern(words, base, patterns[i]!, stats, 3 * i);
    done += len;
    prevLen = len;
  }
  hooks?.onProgress?.(1, what);
  return finish();

  function finish(): CoreResult {
    return {
      primeCount,
      firstPrime,
      lastPrime,
      patterns: patterns.map((_, i) => ({ count: stats[3 * i]!, first: stats[3 * i + 1]!, last: stats[3 * i + 2]! })),
      gaps: wantGaps ? { histogram, records } : null,
    };
  }
}

