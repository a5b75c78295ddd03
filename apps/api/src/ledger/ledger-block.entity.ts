import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { GapCount, RecordGap } from '@cribra/contracts';

/** One fixed block of the prime ledger: [index·W, (index+1)·W) with W = LEDGER_BLOCK_SIZE. */
@Entity('ledger_blocks')
export class LedgerBlockEntity {
  @PrimaryColumn({ name: 'block_index', type: 'int' }) blockIndex!: number;
  /** bigint columns come back from pg as strings. */
  @Column({ name: 'start_n', type: 'bigint' }) start!: string;
  @Column({ name: 'end_n', type: 'bigint' }) end!: string;
  @Column({ name: 'prime_count', type: 'bigint' }) primeCount!: string;
  @Column({ name: 'first_prime', type: 'bigint', nullable: true }) firstPrime!: string | null;
  @Column({ name: 'last_prime', type: 'bigint', nullable: true }) lastPrime!: string | null;
  @Column({ name: 'gap_histogram', type: 'jsonb' }) gapHistogram!: GapCount[];
  @Column({ type: 'jsonb' }) constellations!: Record<string, string>;
  @Column({ name: 'record_gaps', type: 'jsonb' }) recordGaps!: RecordGap[];
  /** The engine's combinable block summary, as JSON (what the Sift data provider combines). */
  @Column({ type: 'jsonb' }) summary!: unknown;
  @Column({ type: 'varchar', length: 128 }) digest!: string;
  @Column({ name: 'computed_by', type: 'varchar', length: 120, nullable: true }) computedBy!: string | null;
  @Column({ name: 'computed_at', type: 'timestamptz', default: () => 'now()' }) computedAt!: Date;
  @Column({ name: 'engine_version', type: 'varchar', length: 32 }) engineVersion!: string;
}
