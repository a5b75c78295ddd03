import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { ReviewDecision } from '@cribra/contracts';

/** A reviewer's decision on one revision digest; decision 'signoff' rows are the sign-offs. */
@Entity('reviews')
export class ReviewEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'notebook_id', type: 'uuid' }) notebookId!: string;
  @Column({ name: 'reviewer_id', type: 'uuid' }) reviewerId!: string;
  @Column({ type: 'varchar', length: 20 }) decision!: ReviewDecision;
  @Column({ type: 'text' }) comment!: string;
  @Column({ name: 'revision_digest', type: 'char', length: 64 }) revisionDigest!: string;
  @Column({ name: 'notebook_revision', type: 'int' }) notebookRevision!: number;
  @Column({ name: 'verification_id', type: 'uuid', nullable: true }) verificationId!: string | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @Column({ name: 'voided_at', type: 'timestamptz', nullable: true }) voidedAt!: Date | null;
  @Column({ name: 'void_reason', type: 'text', nullable: true }) voidReason!: string | null;
}
