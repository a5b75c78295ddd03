// Sizes of the sieve segments and the prime classes that share their work.

/** Bytes of one piece sieved by the small primes at a time (the L1 data cache). */
export const L1_BYTES = 1 << 15;
/** Primes below this bound have several hits per L1 piece and are sieved piece by piece. */
export const SMALL_PRIME_BOUND = 1 << 11;

/** Sieving primes from this bound on go to the bucket sieve (fewer than one hit per class per segment). */
export const LARGE_PRIME_BOUND = 1 << 19;

/** π(LARGE_PRIME_BOUND) = π(2^19) = 43 390 (OEIS A007053): more than the crossed-off primes 53 ≤ p < 2^19. */
export const CROSSING_PRIMES_MAX = 43_390;

/** Bytes per sieve segment (each byte spans 30 integers); sized for the L2 cache. */
export const SEGMENT_BYTES = 1 << 19;

/**
 * Bytes sieved past a segment so that a pattern occurrence starting in it is read whole: at most
 * MAX_PATTERN_DIAMETER / 30 + 12 (pattern.ts checks the bound), rounded up.
 */
export const LOOKAHEAD_BYTES = 1 << 16;

/**
 * The one segment buffer of this thread (a sieve call runs to completion before the next starts).
 * The modules with hot loops over it each keep their own view as a module constant: V8 then knows
 * the view's length and storage, which makes crossing off about a fifth faster than through a
 * parameter (measured; docs/benchmarks.md).
 */
export const SEGMENT_BUFFER = new ArrayBuffer(SEGMENT_BYTES + LOOKAHEAD_BYTES + 8);
