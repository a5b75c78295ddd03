import type { Pool } from 'pg';
import {
  combinePrimeBlockList,
  primeBlockFromJson,
  sievePrimeBlock,
  type PrimeBlock,
  type PrimeBlockJson,
} from '@cribra/engine';
import { LEDGER_BLOCK_SIZE, LEDGER_CONSTELLATIONS, LEDGER_MAX_END, type GapCount, type PatternTally, type UploadContent } from '@cribra/contracts';
import type { DataProvider, StoredLedgerRange, StoredLevel, StoredUpload } from '@cribra/lang';
import { computeAndStoreBlock, LEDGER_SIEVE_OPTIONS } from './ledger-block';

export interface PgDataProviderOptions {
  notebookId: string;
  runnerId: string;
  /** Missing ledger blocks a cell may compute (and store) inline; more are queued instead. */
  maxInlineBlocks: number;
  /** Called when a range has too many missing blocks: queue a ledger computation for it. */
  requestLedger: (from: bigint, to: bigint) => Promise<void>;
  onNote: (note: string) => void;
}

/**
 * The data Sift reads, backed by PostgreSQL: stored wheel levels, the prime ledger (stored blocks
 * combined by the engine; missing whole blocks computed and stored; partial edge blocks computed
 * on the fly), and the uploads of the cell's notebook. Answers null when data is not available.
 */
export class PgDataProvider implements DataProvider {
  constructor(
    private readonly db: Pool,
    private readonly opts: PgDataProviderOptions,
  ) {}

  async level(prime: number): Promise<StoredLevel | null> {
    const { rows } = await this.db.query(
      `SELECT prime, modulus, phi, largest_gap, histogram, pattern_tallies FROM wheel_levels WHERE prime = $1 AND status = 'stored'`,
      [prime],
    );
    if (!rows.length) return null;
    const r = rows[0] as { prime: number; modulus: string; phi: string; largest_gap: number; histogram: GapCount[]; pattern_tallies: PatternTally[] };
    return {
      prime: r.prime,
      modulus: BigInt(r.modulus),
      phi: BigInt(r.phi),
      largestGap: r.largest_gap,
      histogram: r.histogram.map((h) => ({ gap: h.gap, count: BigInt(h.count) })),
      patternTallies: r.pattern_tallies.map((t) => ({
        length: t.length,
        entries: t.entries.map((e) => ({ pattern: e.pattern, count: BigInt(e.count) })),
      })),
    };
  }

  async ledger(from: bigint, to: bigint): Promise<StoredLedgerRange | null> {
    if (from < 0n || to <= from || to > BigInt(LEDGER_MAX_END)) return null;
    const W = BigInt(LEDGER_BLOCK_SIZE);
    const firstFull = (from + W - 1n) / W;
    const endFull = to / W;
    const parts: PrimeBlock[] = [];
    if (firstFull >= endFull) {
      // No whole block inside: sieve the range directly (nothing stored).
      parts.push(sievePrimeBlock(from, to - 1n, LEDGER_SIEVE_OPTIONS));
    } else {
      const first = Number(firstFull);
      const end = Number(endFull);
      const { rows } = await this.db.query(`SELECT block_index FROM ledger_blocks WHERE block_index >= $1 AND block_index < $2`, [first, end]);
      const have = new Set(rows.map((r: { block_index: number }) => r.block_index));
      const missing: number[] = [];
      for (let i = first; i < end; i++) if (!have.has(i)) missing.push(i);
      if (missing.length > this.opts.maxInlineBlocks) {
        this.opts.onNote(`${missing.length} ledger blocks missing; a ledger computation was queued`);
        await this.opts.requestLedger(firstFull * W, endFull * W);
        return null;
      }
      for (const [k, i] of missing.entries()) {
        this.opts.onNote(`computing ledger block ${i} (${k + 1} of ${missing.length})`);
        await computeAndStoreBlock(this.db, i, this.opts.runnerId);
      }
      if (from < firstFull * W) parts.push(sievePrimeBlock(from, firstFull * W - 1n, LEDGER_SIEVE_OPTIONS));
      const stored = await this.db.query(
        `SELECT summary FROM ledger_blocks WHERE block_index >= $1 AND block_index < $2 ORDER BY block_index`,
        [first, end],
      );
      for (const r of stored.rows as Array<{ summary: PrimeBlockJson }>) parts.push(primeBlockFromJson(r.summary));
      if (endFull * W < to) parts.push(sievePrimeBlock(endFull * W, to - 1n, LEDGER_SIEVE_OPTIONS));
    }
    const all = combinePrimeBlockList(parts);
    const constellations: Record<string, bigint> = {};
    for (const [name, pattern] of Object.entries(LEDGER_CONSTELLATIONS)) {
      const found = all.patterns.find((p) => p.pattern.join(',') === pattern.join(','));
      if (found) constellations[name] = BigInt(found.count);
    }
    const records = all.gaps?.records ?? [];
    const largest = records.length ? records[records.length - 1] : null;
    return {
      from,
      to,
      primeCount: BigInt(all.primeCount),
      gapHistogram: [...(all.gaps?.histogram ?? new Map<number, number>())]
        .sort((a, b) => a[0] - b[0])
        .map(([gap, count]) => ({ gap, count: BigInt(count) })),
      constellations,
      largestGap: largest ? { gap: largest.gap, start: largest.after } : null,
    };
  }

  async upload(name: string): Promise<StoredUpload | null> {
    const { rows } = await this.db.query(`SELECT content FROM uploads WHERE notebook_id = $1 AND name = $2`, [this.opts.notebookId, name]);
    if (!rows.length) return null;
    const c = rows[0].content as UploadContent;
    return c.kind === 'tuples' ? { kind: 'tuples', values: c.values.map((v) => BigInt(v)) } : { kind: 'table', columns: c.columns, rows: c.rows };
  }
}
