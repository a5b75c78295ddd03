import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { VerificationPurpose } from '@cribra/contracts';

/** One re-verify: every cell re-run from source (runs with purpose 'reverify'). */
@Entity('verifications')
export class VerificationEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'notebook_id', type: 'uuid' }) notebookId!: string;
  @Column({ type: 'varchar', length: 8 }) purpose!: VerificationPurpose;
  @Column({ name: 'revision_digest', type: 'char', length: 64 }) revisionDigest!: string;
  @Column({ name: 'requested_by', type: 'uuid' }) requestedBy!: string;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true }) finishedAt!: Date | null;
}
