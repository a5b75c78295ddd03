// The combinable summary of the primes over one range [from, to] (a "prime ledger" block).

/** A record gap: larger than every earlier gap between consecutive primes of the block. */
export interface GapRecord {
  /** p' − p for consecutive primes p < p'. */
  readonly gap: number;
  /** The lower prime p. */
  readonly after: bigint;
}

/** Gaps between consecutive primes that both lie in the block. */
export interface GapStatistics {
  /** gap → number of consecutive pairs of primes of the block at that distance. */
  readonly histogram: ReadonlyMap<number, number>;
  /** Record gaps of the block, in increasing order (the last one is the largest gap). */
  readonly records: readonly GapRecord[];
}

/** Occurrences of one constellation pattern H: n with n + h prime for all h ∈ H, from ≤ n, n + max H ≤ to. */
export interface PatternStatistics {
  /** H normalized: increasing, starting at 0. */
  readonly pattern: readonly number[];
  readonly count: number;
  /** Smallest n of an occurrence, or null. */
  readonly first: bigint | null;
  /** Largest n of an occurrence, or null. */
  readonly last: bigint | null;
}

/**
 * Statistics of the primes in [from, to] that combine exactly with those of the adjacent ranges
 * (see `combinePrimeBlocks`). Counts are plain numbers: a block lies below 2^53, so they are exact.
 */
export interface PrimeBlock {
  readonly from: bigint;
  readonly to: bigint;
  /** π(to) − π(from − 1). */
  readonly primeCount: number;
  readonly firstPrime: bigint | null;
  readonly lastPrime: bigint | null;
  /** Present when gaps were asked for. */
  readonly gaps: GapStatistics | null;
  /** One entry per requested pattern, in request order. */
  readonly patterns: readonly PatternStatistics[];
  /** Boundary window W = the largest pattern diameter (0 without patterns). */
  readonly window: number;
  /** p − from for every prime p in [from, from + W), increasing. */
  readonly headPrimes: readonly number[];
  /** to − p for every prime p in (to − W, to], increasing (so p decreasing). */
  readonly tailPrimes: readonly number[];
}

/** JSON form of a {@link PrimeBlock}: bigints as decimal strings, the histogram as an object. */
export interface PrimeBlockJson {
  readonly version: 1;
  readonly from: string;
  readonly to: string;
  readonly primeCount: number;
  readonly firstPrime: string | null;
  readonly lastPrime: string | null;
  readonly gaps: {
    readonly histogram: Record<string, number>;
    readonly records: ReadonlyArray<{ readonly gap: number; readonly after: string }>;
  } | null;
  readonly patterns: ReadonlyArray<{
    readonly pattern: readonly number[];
    readonly count: number;
    readonly first: string | null;
    readonly last: string | null;
  }>;
  readonly window: number;
  readonly headPrimes: readonly number[];
  readonly tailPrimes: readonly number[];
}
