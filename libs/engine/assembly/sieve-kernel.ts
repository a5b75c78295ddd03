// The sieve's inner loops in WebAssembly (AssemblyScript, compiled at build time by
// libs/engine/scripts/build-wasm.mjs into dist/wasm/sieve-kernel.wasm). The algorithm is the one
// of the JavaScript sieve (libs/engine/src/sieve: core.ts, cross.ts, count.ts, presieve-words.ts),
// which stays the reference; libs/engine/src/sieve/core-wasm.ts drives this kernel segment by
// segment. No allocator, no runtime: every array lives at a fixed address of the linear memory
// (LAYOUT below), written by the driver through typed-array views.

// ---- memory layout (bytes) ----
/** The segment: SEGMENT_BYTES + LOOKAHEAD_BYTES + slack. */
const SEG: usize = 0x10000;
/** Crossing primes 53 ≤ p < 2^20 in increasing order (i32). */
const PRIMES: usize = 0x100000;
/** Eight byte positions per crossing prime (i32), one per residue class of its cofactor. */
const NEXT: usize = 0x180000;
/** The eight byte masks of each crossing prime (u8). */
const MASKS: usize = 0x580000;
/** CLASS_STEP (i32 × 240), PRODUCT_RESIDUE (i32 × 240), PRODUCT_MASK (u8 × 240), BIT_VALUE (i32 × 64). */
const CLASS_STEP: usize = 0x680000;
const PRODUCT_RESIDUE: usize = 0x680400;
const PRODUCT_MASK: usize = 0x680800;
const BIT_VALUE: usize = 0x680900;
/** The word patterns (u32), each extended past its period. */
const TABLES: usize = 0x690000;
const TABLES_END: usize = 0x800000;
/** Gap histogram (f64 × HIST_SIZE). */
const HIST: usize = 0x800000;
const HIST_SIZE: i32 = 4096;
/** Record gaps: (gap: i32, pad, after: f64) × MAX_RECORDS. */
const RECORDS: usize = 0x808000;
const MAX_RECORDS: i32 = 4096;
/** Compiled pattern descriptors (i32 words; see countPattern). */
const PATTERN: usize = 0x820000;
const PATTERN_END: usize = 0x840000;
/** Occurrence words of one piece of a pattern count, and the OR of a term's groups (u64 × PIECE_WORDS each). */
const OCC: usize = 0x840000;
const TMP: usize = 0x848000;
const PIECE_WORDS: i32 = 4096;
/** Gap counters of one gapWalk call (u32 × HIST_SIZE). */
const HIST32: usize = 0x850000;
/** Crossing primes the layout holds (π(2^20) − 15 = 82 010 are needed). */
const MAX_PRIMES: i32 = 0x20000;
/** Words written per presieve chunk; the tables are extended this much (+ 4) past their period. */
const CHUNK: i32 = 1024;

/** Addresses and sizes of the layout for the driver (k = 0 … 18), so that both sides agree. */
export function layout(k: i32): i32 {
  switch (k) {
    case 0: return <i32>SEG;
    case 1: return <i32>PRIMES;
    case 2: return <i32>NEXT;
    case 3: return <i32>MASKS;
    case 4: return <i32>CLASS_STEP;
    case 5: return <i32>PRODUCT_RESIDUE;
    case 6: return <i32>PRODUCT_MASK;
    case 7: return <i32>BIT_VALUE;
    case 8: return <i32>TABLES;
    case 9: return <i32>HIST;
    case 10: return <i32>RECORDS;
    case 11: return <i32>PATTERN;
    case 12: return <i32>PATTERN_END;
    case 13: return MAX_PRIMES;
    case 14: return CHUNK;
    case 15: return HIST_SIZE;
    case 16: return MAX_RECORDS;
    case 17: return <i32>TABLES_END;
    case 18: return MAX_TABLES;
    default: return -1;
  }
}

// ---- word-pattern pre-sieve ----
// Up to MAX_TABLES word patterns (tables of a few primes each, extended CHUNK + 4 words past their
// period), described at TABLE_INFO: address, period, inverse of 4 modulo the period, current index.
const TABLE_INFO: usize = 0x680A00;
const MAX_TABLES: i32 = 16;
let nTables: i32 = 0;

/** Declares word pattern k (0 … 15; a multiple of 4 of them in all): its table address, odd period and the inverse of 4 modulo it. */
export function setPattern(k: i32, address: i32, period: i32, inverse4: i32): void {
  const info = TABLE_INFO + (<usize>k << 4);
  store<i32>(info, address);
  store<i32>(info, period, 4);
  store<i32>(info, inverse4, 8);
  if (k >= nTables) nTables = k + 1;
}

// @ts-ignore: decorator
@inline function tableAt(k: i32): usize {
  const info = TABLE_INFO + (<usize>k << 4);
  return <usize>load<i32>(info) + (<usize>load<i32>(info, 12) << 2);
}

/**
 * Writes the words [from, words) of the segment, which starts at sieve byte K0 (a safe integer),
 * with the integers coprime to 2 · 3 · 5 and to every prime of the tables: the AND of the tables,
 * 16 bytes at a time, four tables per pass over a chunk (the chunk stays in the L1 cache).
 */
export function presieve(from: i32, words: i32, K0: f64): void {
  const K = <i64>K0 + 4 * <i64>from;
  for (let k = 0; k < nTables; k++) {
    const info = TABLE_INFO + (<usize>k << 4);
    const per = <i64>load<i32>(info, 4);
    store<i32>(info, <i32>(((K % per) * <i64>load<i32>(info, 8)) % per), 12);
  }
  for (let c0 = from; c0 < words; c0 += CHUNK) {
    const n = min(CHUNK, words - c0);
    const dst = SEG + (<usize>c0 << 2);
    // Whole groups of four words; the tables reach 4 words past a chunk, the segment has slack.
    const bytes = <usize>(n << 2);
    for (let g = 0; g < nTables; g += 4) {
      const a = tableAt(g), b = tableAt(g + 1), c = tableAt(g + 2), d = tableAt(g + 3);
      if (g == 0) {
        for (let k: usize = 0; k < bytes; k += 16) {
          v128.store(dst + k, v128.and(v128.and(v128.load(a + k), v128.load(b + k)), v128.and(v128.load(c + k), v128.load(d + k))));
        }
      } else {
        for (let k: usize = 0; k < bytes; k += 16) {
          const v = v128.and(v128.and(v128.load(a + k), v128.load(b + k)), v128.and(v128.load(c + k), v128.load(d + k)));
          v128.store(dst + k, v128.and(v128.load(dst + k), v));
        }
      }
    }
    for (let k = 0; k < nTables; k++) {
      const info = TABLE_INFO + (<usize>k << 4);
      store<i32>(info, (load<i32>(info, 12) + n) % load<i32>(info, 4), 12);
    }
  }
}

// ---- crossing off the primes 53 ≤ p < 2^20: eight progressions each (as cross.ts) ----

/**
 * Starts the crossing primes from index `active` on (below `count`) whose square lies below `end`:
 * for each residue class c, the byte (relative to `base`, a multiple of 30) of the least multiple
 * p·m ≥ max(p², base) with m ≡ RESIDUES[c] (mod 30). Returns the new number of active primes.
 */
export function activate(active: i32, count: i32, base: f64, end: f64): i32 {
  const B = <i64>base;
  const E = <i64>end;
  while (active < count) {
    const p32 = load<i32>(PRIMES + (<usize>active << 2));
    const p = <i64>p32;
    if (p * p >= E) break;
    const start = p * p > B ? p * p : B;
    const m0 = (start + p - 1) / p;
    const d = <usize>(<i32>(m0 % 30) << 3);
    const pr = <usize>(<i32>(p % 30) << 3);
    const rel = <i32>(p * m0 - B);
    const o = NEXT + (<usize>active << 5);
    const mo = MASKS + (<usize>active << 3);
    for (let c: usize = 0; c < 8; c++) {
      const n = rel + p32 * load<i32>(CLASS_STEP + ((d + c) << 2));
      store<i32>(o + (c << 2), (n - load<i32>(PRODUCT_RESIDUE + ((pr + c) << 2))) / 30);
      store<u8>(mo + c, load<u8>(PRODUCT_MASK + pr + c));
    }
    active++;
  }
  return active;
}

// @ts-ignore: decorator
@inline function andByte(at: usize, m: u32): void {
  store<u8>(at, load<u8>(at) & m);
}

/**
 * Crosses off, for the crossing primes i0 ≤ i < i1, every multiple whose byte lies before `end`;
 * each progression is left at its first byte ≥ end, minus `shift`.
 */
export function crossRange(i0: i32, i1: i32, end: i32, shift: i32): void {
  for (let i = i0; i < i1; i++) {
    const p = load<i32>(PRIMES + (<usize>i << 2));
    const o = NEXT + (<usize>i << 5);
    const mo = MASKS + (<usize>i << 3);
    const j0 = load<i32>(o);
    const d1 = load<i32>(o, 4) - j0, d2 = load<i32>(o, 8) - j0, d3 = load<i32>(o, 12) - j0;
    const d4 = load<i32>(o, 16) - j0, d5 = load<i32>(o, 20) - j0, d6 = load<i32>(o, 24) - j0, d7 = load<i32>(o, 28) - j0;
    const m0 = <u32>load<u8>(mo), m1 = <u32>load<u8>(mo, 1), m2 = <u32>load<u8>(mo, 2), m3 = <u32>load<u8>(mo, 3);
    const m4 = <u32>load<u8>(mo, 4), m5 = <u32>load<u8>(mo, 5), m6 = <u32>load<u8>(mo, 6), m7 = <u32>load<u8>(mo, 7);
    // stop = end − max(0, d1 … d7): the loop runs while every progression is below end.
    let mx = max(0, d1);
    mx = max(mx, d2); mx = max(mx, d3); mx = max(mx, d4);
    mx = max(mx, d5); mx = max(mx, d6); mx = max(mx, d7);
    const stop = end - mx;
    let J = j0;
    const stop2 = stop - p;
    while (J < stop2) {
      const a = SEG + <usize>J;
      const b = a + <usize>p;
      andByte(a, m0); andByte(a + <usize>d1, m1); andByte(a + <usize>d2, m2); andByte(a + <usize>d3, m3);
      andByte(a + <usize>d4, m4); andByte(a + <usize>d5, m5); andByte(a + <usize>d6, m6); andByte(a + <usize>d7, m7);
      andByte(b, m0); andByte(b + <usize>d1, m1); andByte(b + <usize>d2, m2); andByte(b + <usize>d3, m3);
      andByte(b + <usize>d4, m4); andByte(b + <usize>d5, m5); andByte(b + <usize>d6, m6); andByte(b + <usize>d7, m7);
      J += p << 1;
    }
    if (J < stop) {
      const a = SEG + <usize>J;
      andByte(a, m0); andByte(a + <usize>d1, m1); andByte(a + <usize>d2, m2); andByte(a + <usize>d3, m3);
      andByte(a + <usize>d4, m4); andByte(a + <usize>d5, m5); andByte(a + <usize>d6, m6); andByte(a + <usize>d7, m7);
      J += p;
    }
    // Each progression needs at most one more step (they lie within p bytes of each other); taken
    // without branches: t is −1 when needed, and otherwise the write goes to byte 0 with mask 0xff.
    store<i32>(o, lastStep(J, p, end, m0) - shift);
    store<i32>(o, lastStep(J + d1, p, end, m1) - shift, 4);
    store<i32>(o, lastStep(J + d2, p, end, m2) - shift, 8);
    store<i32>(o, lastStep(J + d3, p, end, m3) - shift, 12);
    store<i32>(o, lastStep(J + d4, p, end, m4) - shift, 16);
    store<i32>(o, lastStep(J + d5, p, end, m5) - shift, 20);
    store<i32>(o, lastStep(J + d6, p, end, m6) - shift, 24);
    store<i32>(o, lastStep(J + d7, p, end, m7) - shift, 28);
  }
}

// @ts-ignore: decorator
@inline function lastStep(j: i32, p: i32, end: i32, m: u32): i32 {
  const t = (j - end) >> 31;
  const at = SEG + <usize>(j & t);
  store<u8>(at, load<u8>(at) & (m | ~<u32>t));
  return j + (p & t);
}

/**
 * Ends a segment of `len` bytes for the crossing primes i < active: crosses off the look-ahead
 * bytes [len, L) and makes the positions relative to the next segment.
 */
export function endSegment(active: i32, len: i32, L: i32): void {
  const n = <usize>active << 3;
  if (L == len) {
    for (let k: usize = 0; k < n; k++) store<i32>(NEXT + (k << 2), load<i32>(NEXT + (k << 2)) - len);
    return;
  }
  for (let i = 0; i < active; i++) {
    const p = load<i32>(PRIMES + (<usize>i << 2));
    for (let k = <usize>i << 3, e = k + 8; k < e; k++) {
      const j0 = load<i32>(NEXT + (k << 2));
      store<i32>(NEXT + (k << 2), j0 - len);
      if (j0 < L) {
        const m = <u32>load<u8>(MASKS + k);
        for (let j = j0; j < L; j += p) andByte(SEG + <usize>j, m);
      }
    }
  }
}

// ---- counting ----
const TWIN64: u64 = 0x9494949494949494;
const TWIN32: u32 = 0x94949494;
let twinCount: i32 = 0;

/** Primes (1 bits) in the 32-bit words [from, to) of the segment. */
export function countPrimes(from: i32, to: i32): i32 {
  let total: u64 = 0;
  let w = from;
  for (; w + 4 <= to; w += 4) {
    const at = SEG + (<usize>w << 2);
    total += popcnt<u64>(load<u64>(at)) + popcnt<u64>(load<u64>(at, 8));
  }
  for (; w < to; w++) total += <u64>popcnt<u32>(load<u32>(SEG + (<usize>w << 2)));
  return <i32>total;
}

/**
 * Primes in the words [from, to), returned, and the twin pairs starting there (starts 11, 17 pair
 * with the next bit of their byte, 29 with bit 0 of the next byte), left in `twins()`. Reads word
 * `to` too, which must be final.
 */
export function countPrimesAndTwins(from: i32, to: i32): i32 {
  let primes: u64 = 0;
  let twins: u64 = 0;
  let w = from;
  for (; w + 2 <= to; w += 2) {
    const at = SEG + (<usize>w << 2);
    const x = load<u64>(at);
    const next = <u64>load<u32>(at, 8);
    primes += popcnt<u64>(x);
    twins += popcnt<u64>(x & ((x >> 1) | (next << 63)) & TWIN64);
  }
  for (; w < to; w++) {
    const at = SEG + (<usize>w << 2);
    const x = load<u32>(at);
    primes += <u64>popcnt<u32>(x);
    twins += <u64>popcnt<u32>(x & ((x >> 1) | (load<u32>(at, 4) << 31)) & TWIN32);
  }
  twinCount = <i32>twins;
  return <i32>primes;
}

/** The twins counted by the last countPrimesAndTwins. */
export function twins(): i32 {
  return twinCount;
}

// ---- gaps between consecutive primes ----
let gapLast: i64 = -1;
let gapMax: i32 = 0;
let records: i32 = 0;
let gapTooLarge: i32 = 0;

/** Starts a block's gap statistics: the last prime already met (−1: none) and the largest gap so far; clears the histogram. */
export function gapStart(last: f64, largest: i32): void {
  gapLast = <i64>last;
  gapMax = largest;
  records = 0;
  gapTooLarge = 0;
  memory.fill(HIST, 0, <usize>HIST_SIZE << 3);
  memory.fill(HIST32, 0, <usize>HIST_SIZE << 2);
}

/** Number of record gaps stored at RECORDS so far in this block. */
export function recordCount(): i32 {
  return records;
}

/** A gap ≥ HIST_SIZE met (impossible below 2^64; checked anyway). */
export function gapOverflow(): i32 {
  return gapTooLarge;
}

/** The last prime met (for the driver's bookkeeping). */
export function lastGapPrime(): f64 {
  return <f64>gapLast;
}

/**
 * Adds the gaps of the primes in the words [0, words) of the segment starting at `base`. Counted
 * in 32-bit counters (an integer add is shorter than a floating-point one on the chains of equal
 * gaps), added into the f64 histogram at the end of each call.
 */
export function gapWalk(words: i32, base: f64): void {
  const B = <i64>base;
  let last = gapLast;
  let largest = gapMax;
  for (let w = 0; w < words; w += 2) {
    const at = SEG + (<usize>w << 2);
    let x = w + 2 <= words ? load<u64>(at) : <u64>load<u32>(at);
    const wb = B + 120 * <i64>w;
    if (last < 0 && x != 0) {
      // The block's first prime: only where the previous one is still unknown.
      last = wb + <i64>load<i32>(BIT_VALUE + (<usize>ctz<u64>(x) << 2));
      x &= x - 1;
    }
    while (x != 0) {
      const pos = <usize>ctz<u64>(x);
      x &= x - 1;
      const p = wb + <i64>load<i32>(BIT_VALUE + (pos << 2));
      const g = <i32>(p - last);
      if (g > largest) {
        largest = g;
        if (g >= HIST_SIZE) gapTooLarge = 1;
        if (records < MAX_RECORDS) {
          const r = RECORDS + (<usize>records << 4);
          store<i32>(r, g);
          store<f64>(r, <f64>last, 8);
          records++;
        }
      }
      const h = HIST32 + (<usize>(g & (HIST_SIZE - 1)) << 2);
      store<u32>(h, load<u32>(h) + 1);
      last = p;
    }
  }
  gapLast = last;
  gapMax = largest;
  const top = <usize>min(largest, HIST_SIZE - 1);
  for (let g: usize = 0; g <= top; g++) {
    const h = HIST + (g << 3);
    store<f64>(h, load<f64>(h) + <f64>load<u32>(HIST32 + (g << 2)));
    store<u32>(HIST32 + (g << 2), 0);
  }
}

// ---- constellation patterns ----
let patFirst: i32 = -1;
let patLast: i32 = -1;

/**
 * Counts the occurrences of one pattern whose start lies in the words [0, words) of the segment.
 * Descriptor at `desc` (i32 words): classMask lo, hi (start bits allowed, every byte alike), then
 * the number of terms; per term its number of groups and per group: byte offset, signed bit shift,
 * mask lo, mask hi. A term's bit for the start bit c of a byte is the segment read `byte offset`
 * bytes further and shifted right by `shift` (left when negative), masked to the start classes of
 * that group. An occurrence bit is the AND over the terms. Leaves the value offsets (from the
 * segment base) of the first and last occurrence in patternFirst() / patternLast().
 */
export function countPattern(words: i32, desc: i32): i32 {
  const d0 = <usize>desc;
  const classMask = <u64>load<u32>(d0) | (<u64>load<u32>(d0, 4) << 32);
  const nTerms = load<i32>(d0, 8);
  let count: i32 = 0;
  let firstW: i32 = -1, lastW: i32 = -1;
  let firstBits: u64 = 0, lastBits: u64 = 0;
  // Pieces of PIECE_WORDS 64-bit words (the occurrence words stay in the L1 cache); per piece one
  // tight pass per term and group with its offset, shift and mask fixed (no per-word branches:
  // an early exit when no start is left mispredicts for sparse patterns).
  const n64 = (words + 1) >> 1;
  for (let p0 = 0; p0 < n64; p0 += PIECE_WORDS) {
    const pn = <usize>min(PIECE_WORDS, n64 - p0);
    const src0 = SEG + (<usize>p0 << 3);
    for (let i: usize = 0; i < pn; i++) store<u64>(OCC + (i << 3), classMask);
    if (p0 + <i32>pn == n64 && (words & 1) != 0) store<u64>(OCC + ((pn - 1) << 3), classMask & 0xffffffff);
    let d = d0 + 12;
    for (let t = 0; t < nTerms; t++) {
      const nGroups = load<i32>(d);
      d += 4;
      for (let g = 0; g < nGroups; g++) {
        const src = src0 + <usize>load<i32>(d);
        const sh = load<i32>(d, 4);
        const mask = <u64>load<u32>(d, 8) | (<u64>load<u32>(d, 12) << 32);
        d += 16;
        // One group: AND straight into the occurrences; several: OR into TMP first.
        const into = nGroups == 1 ? OCC : TMP;
        const first = g == 0;
        if (sh >= 0) groupPass(into, src, pn, <u64>sh, mask, nGroups == 1, first, true);
        else groupPass(into, src, pn, <u64>(-sh), mask, nGroups == 1, first, false);
      }
      if (nGroups > 1) for (let i: usize = 0; i < pn; i++) store<u64>(OCC + (i << 3), load<u64>(OCC + (i << 3)) & load<u64>(TMP + (i << 3)));
    }
    for (let i: usize = 0; i < pn; i++) {
      const occ = load<u64>(OCC + (i << 3));
      count += <i32>popcnt<u64>(occ);
      const found = occ != 0;
      const w = (p0 + <i32>i) << 1;
      if (firstW < 0 && found) {
        firstW = w;
        firstBits = occ;
      }
      lastW = select<i32>(w, lastW, found);
      lastBits = select<u64>(occ, lastBits, found);
    }
  }
  if (count > 0) {
    patFirst = 120 * firstW + load<i32>(BIT_VALUE + (<usize>ctz<u64>(firstBits) << 2));
    patLast = 120 * lastW + load<i32>(BIT_VALUE + (<usize>(63 - clz<u64>(lastBits)) << 2));
  }
  return count;
}

// @ts-ignore: decorator
@inline function groupPass(into: usize, src: usize, n: usize, sh: u64, mask: u64, and: bool, first: bool, right: bool): void {
  if (and) {
    if (right) for (let i: usize = 0; i < n; i++) store<u64>(into + (i << 3), load<u64>(into + (i << 3)) & ((load<u64>(src + (i << 3)) >> sh) & mask));
    else for (let i: usize = 0; i < n; i++) store<u64>(into + (i << 3), load<u64>(into + (i << 3)) & ((load<u64>(src + (i << 3)) << sh) & mask));
  } else if (first) {
    if (right) for (let i: usize = 0; i < n; i++) store<u64>(into + (i << 3), (load<u64>(src + (i << 3)) >> sh) & mask);
    else for (let i: usize = 0; i < n; i++) store<u64>(into + (i << 3), (load<u64>(src + (i << 3)) << sh) & mask);
  } else {
    if (right) for (let i: usize = 0; i < n; i++) store<u64>(into + (i << 3), load<u64>(into + (i << 3)) | ((load<u64>(src + (i << 3)) >> sh) & mask));
    else for (let i: usize = 0; i < n; i++) store<u64>(into + (i << 3), load<u64>(into + (i << 3)) | ((load<u64>(src + (i << 3)) << sh) & mask));
  }
}

/** Value offset of the first occurrence found by the last countPattern with a non-zero count. */
export function patternFirst(): i32 {
  return patFirst;
}

/** Value offset of the last occurrence found by the last countPattern with a non-zero count. */
export function patternLast(): i32 {
  return patLast;
}
