import { createHash } from 'node:crypto';
import type { Pool } from 'pg';
import { ENGINE_VERSION, primeBlockToJson, sievePrimeBlock, type PrimeBlockJson } from '@cribra/engine';
import { kernelFor } from '@cribra/engine/node';
import { LEDGER_BLOCK_SIZE, LEDGER_CONSTELLATIONS, type GapCount, type RecordGap } from '@cribra/contracts';

/** The constellation patterns every ledger block counts (same order everywhere, so blocks combine). */
export const LEDGER_PATTERNS: number[][] = Object.values(LEDGER_CONSTELLATIONS).map((p) => [...p]);

/** Sieve options of ledger blocks; partial ranges use the same ones so that they combine with blocks. */
export const LEDGER_SIEVE_OPTIONS = { gaps: true, patterns: LEDGER_PATTERNS } as const;

/** SHA-256 of the block's JSON summary (fields in a fixed order, so the digest is reproducible). */
export function blockDigest(json: PrimeBlockJson): string {
  return createHash('sha256').update(JSON.stringify(json)).digest('hex');
}

/** Inclusive engine range of ledger block i: [i·W, (i+1)·W − 1]. */
export function blockRange(index: number): { from: bigint; to: bigint } {
  const w = BigInt(LEDGER_BLOCK_SIZE);
  return { from: BigInt(index) * w, to: BigInt(index + 1) * w - 1n };
}

function gapCounts(h: Record<string, number> | undefined): GapCount[] {
  return Object.entries(h ?? {})
    .map(([gap, count]) => ({ gap: Number(gap), count: String(count) }))
    .sort((a, b) => a.gap - b.gap);
}

function constellations(json: PrimeBlockJson): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [name, pattern] of Object.entries(LEDGER_CONSTELLATIONS)) {
    const found = json.patterns.find((p) => p.pattern.join(',') === pattern.join(','));
    if (found) out[name] = String(found.count);
  }
  return out;
}

/**
 * Computes ledger block `index` with the engine's segmented sieve and stores it. Idempotent: if
 * another runner stored it first, the insert does nothing and the stored row stays.
 * @returns true when this call stored the block.
 */
export async function computeAndStoreBlock(db: Pool, index: number, runnerId: string): Promise<boolean> {
  const exists = await db.query(`SELECT 1 FROM ledger_blocks WHERE block_index = $1`, [index]);
  if (exists.rowCount) return false;
  const { from, to } = blockRange(index);
  // The WebAssembly kernel when built (the same summary as the JavaScript sieve, tested so): its
  // per-block set-up is about a third of the JavaScript sieve's (docs/benchmarks.md).
  const json = primeBlockToJson(sievePrimeBlock(from, to, { ...LEDGER_SIEVE_OPTIONS, kernel: kernelFor('auto') ?? undefined }));
  const records: RecordGap[] = (json.gaps?.records ?? []).map((r) => ({ gap: r.gap, start: r.after }));
  const res = await db.query(
    `INSERT INTO ledger_blocks (block_index, start_n, end_n, prime_count, first_prime, last_prime, gap_histogram,
                                constellations, record_gaps, summary, digest, computed_by, engine_version)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13) ON CONFLICT (block_index) DO NOTHING`,
    [
      index,
      from.toString(),
      (to + 1n).toString(),
      json.primeCount,
      json.firstPrime,
      json.lastPrime,
      JSON.stringify(gapCounts(json.gaps?.histogram)),
      JSON.stringify(constellations(json)),
      JSON.stringify(records),
      JSON.stringify(json),
      blockDigest(json),
      runnerId,
      ENGINE_VERSION,
    ],
  );
  return res.rowCount === 1;
}
