import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { combinePrimeBlockList, primeBlockFromJson, primeBlockToJson, type PrimeBlockJson } from '@cribra/engine';
import type { ComputationView, LedgerBlockSummary, LedgerBlockView, LedgerRangeView, Page } from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../members/notebook-policy.service';
import { blocksOf, ComputationRequestError, requestLedgerRange } from '../queue/computation-requests';
import { ComputationsService } from '../queue/computations.service';
import { QueueService } from '../queue/queue.service';
import { constellationCounts, gapCounts, recordGaps } from './ledger-stats';

interface BlockRow {
  block_index: number;
  start_n: string;
  end_n: string;
  prime_count: string;
  first_prime: string | null;
  last_prime: string | null;
  digest: string;
  computed_by: string | null;
  computed_at: Date;
  engine_version: string;
  gap_histogram?: LedgerBlockView['gapHistogram'];
  constellations?: Record<string, string>;
  record_gaps?: LedgerBlockView['recordGaps'];
}

const toSummary = (r: BlockRow): LedgerBlockSummary => ({
  index: r.block_index,
  start: r.start_n,
  end: r.end_n,
  primeCount: r.prime_count,
  firstPrime: r.first_prime,
  lastPrime: r.last_prime,
  digest: r.digest,
  computedBy: r.computed_by,
  computedAt: new Date(r.computed_at).toISOString(),
  engineVersion: r.engine_version,
});

const SUMMARY_COLS = `block_index, start_n, end_n, prime_count, first_prime, last_prime, digest, computed_by, computed_at, engine_version`;

function badRange(err: ComputationRequestError): BadRequestException {
  return new BadRequestException({ message: err.message, details: [{ field: err.field, messages: [err.message] }] });
}

/** The prime ledger: fixed blocks of prime statistics, combined on read. */
@Injectable()
export class LedgerService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly queue: QueueService,
    private readonly computations: ComputationsService,
    private readonly audit: AuditService,
  ) {}

  async list(page = 1, pageSize = 20, from?: string, to?: string): Promise<Page<LedgerBlockSummary>> {
    const params = [from ?? null, to ?? null];
    const where = `WHERE ($1::bigint IS NULL OR end_n > $1::bigint) AND ($2::bigint IS NULL OR start_n < $2::bigint)`;
    const rows: BlockRow[] = await this.db.query(
      `SELECT ${SUMMARY_COLS} FROM ledger_blocks ${where} ORDER BY block_index LIMIT ${pageSize} OFFSET ${(page - 1) * pageSize}`,
      params,
    );
    const [{ n }] = await this.db.query(`SELECT count(*)::int AS n FROM ledger_blocks ${where}`, params);
    return { items: rows.map(toSummary), total: n, page, pageSize };
  }

  async get(index: number): Promise<LedgerBlockView> {
    const rows: BlockRow[] = await this.db.query(
      `SELECT ${SUMMARY_COLS}, gap_histogram, constellations, record_gaps FROM ledger_blocks WHERE block_index = $1`,
      [index],
    );
    if (!rows.length) throw new NotFoundException(`Ledger block ${index} is not stored`);
    const r = rows[0];
    return { ...toSummary(r), gapHistogram: r.gap_histogram ?? [], constellations: r.constellations ?? {}, recordGaps: r.record_gaps ?? [] };
  }

  /** Statistics of the whole blocks covering [from, to), combined by the engine from stored blocks. */
  async range(from: string, to: string): Promise<LedgerRangeView> {
    let span: { first: number; last: number };
    try {
      span = blocksOf(from, to);
    } catch (err) {
      if (err instanceof ComputationRequestError) throw badRange(err);
      throw err;
    }
    const rows: Array<{ block_index: number; summary: PrimeBlockJson }> = await this.db.query(
      `SELECT block_index, summary FROM ledger_blocks WHERE block_index BETWEEN $1 AND $2 ORDER BY block_index`,
      [span.first, span.last],
    );
    const have = new Set(rows.map((r) => r.block_index));
    const missing: number[] = [];
    for (let i = span.first; i <= span.last && missing.length < 1000; i++) if (!have.has(i)) missing.push(i);
    const base = { from, to, missingBlocks: missing };
    if (missing.length) {
      return { ...base, complete: false, primeCount: null, gapHistogram: null, constellations: null, largestGap: null };
    }
    const combined = primeBlockToJson(combinePrimeBlockList(rows.map((r) => primeBlockFromJson(r.summary))));
    const records = recordGaps(combined);
    return {
      ...base,
      complete: true,
      primeCount: String(combined.primeCount),
      gapHistogram: gapCounts(combined.gaps?.histogram),
      constellations: constellationCounts(combined),
      largestGap: records.length ? records[records.length - 1] : null,
    };
  }

  async request(actor: Actor, from: string, to: string): Promise<ComputationView> {
    try {
      const id = await requestLedgerRange(this.db, this.queue.boss, from, to, actor.id);
      await this.audit.record(actor.id, 'ledger.request', null, { from, to, computationId: id });
      return this.computations.get(id);
    } catch (err) {
      if (err instanceof ComputationRequestError) throw badRange(err);
      throw err;
    }
  }
}
