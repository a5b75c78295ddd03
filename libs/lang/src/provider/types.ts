// Stored data a cell may read: wheel levels computed ahead of time, the prime ledger, uploads.
// The host implements DataProvider (asynchronous, e.g. over PostgreSQL); the interpreter sees the
// synchronous DataAccess (in a worker thread the pool bridges one to the other, see node/bridge).

/** A stored wheel level p (the reduced residue system modulo p#). */
export interface StoredLevel {
  prime: number;
  modulus: bigint;
  phi: bigint;
  largestGap: number;
  /** Gap → number of occurrences in one period, gaps increasing. */
  histogram: Array<{ gap: number; count: bigint }>;
  /** Tallies of runs of consecutive gaps, by run length. */
  patternTallies: Array<{ length: number; entries: Array<{ pattern: number[]; count: bigint }> }>;
}

/** Statistics of the primes in [from, to) combined from stored ledger blocks. */
export interface StoredLedgerRange {
  from: bigint;
  /** Exclusive. */
  to: bigint;
  primeCount: bigint;
  gapHistogram: Array<{ gap: number; count: bigint }>;
  /** Counts of named constellations starting in the range (e.g. 'twin'). */
  constellations: Record<string, bigint>;
  largestGap: { gap: number; start: bigint } | null;
}

/** An uploaded file: a tuple (one integer per line) or a table (CSV cells as text). */
export type StoredUpload =
  | { kind: 'tuples'; values: bigint[] }
  | { kind: 'table'; columns: string[]; rows: string[][] };

/** What the host supplies. Each method answers null when the data is not stored. */
export interface DataProvider {
  level(prime: number): Promise<StoredLevel | null>;
  ledger(from: bigint, to: bigint): Promise<StoredLedgerRange | null>;
  upload(name: string): Promise<StoredUpload | null>;
}

/** What the interpreter calls (synchronously). */
export interface DataAccess {
  level(prime: number): StoredLevel | null;
  ledger(from: bigint, to: bigint): StoredLedgerRange | null;
  upload(name: string): StoredUpload | null;
}

export type DataMethod = keyof DataProvider;
