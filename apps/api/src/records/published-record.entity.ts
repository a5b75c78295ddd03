import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { LockRecord } from '@cribra/contracts';
import type { PublishedContent } from './published-content';

/** A published lock record (immutable but for one withdrawal: see migration 1797200000000). */
@Entity('published_records')
export class PublishedRecordEntity {
  @PrimaryColumn({ type: 'text' }) id!: string;
  @Column({ name: 'notebook_id', type: 'uuid' }) notebookId!: string;
  @Column({ name: 'record_sha256', type: 'char', length: 64 }) recordSha256!: string;
  @Column({ type: 'jsonb' }) record!: LockRecord;
  @Column({ type: 'jsonb' }) content!: PublishedContent;
  @Column({ name: 'published_by', type: 'uuid' }) publishedBy!: string;
  @Column({ name: 'published_at', type: 'timestamptz' }) publishedAt!: Date;
  @Column({ name: 'withdrawn_at', type: 'timestamptz', nullable: true }) withdrawnAt!: Date | null;
  @Column({ name: 'withdrawn_by', type: 'uuid', nullable: true }) withdrawnBy!: string | null;
  @Column({ name: 'withdraw_reason', type: 'text', nullable: true }) withdrawReason!: string | null;
}
