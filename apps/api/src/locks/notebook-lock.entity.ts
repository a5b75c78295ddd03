import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { LockRecord } from '@cribra/contracts';

/** The frozen record of a locked notebook (immutable: a trigger refuses UPDATE and DELETE). */
@Entity('notebook_locks')
export class NotebookLockEntity {
  @PrimaryColumn({ name: 'notebook_id', type: 'uuid' }) notebookId!: string;
  @Column({ name: 'locked_by', type: 'uuid' }) lockedBy!: string;
  @Column({ name: 'locked_at', type: 'timestamptz' }) lockedAt!: Date;
  @Column({ name: 'revision_digest', type: 'char', length: 64 }) revisionDigest!: string;
  @Column({ name: 'notebook_revision', type: 'int' }) notebookRevision!: number;
  @Column({ type: 'jsonb' }) record!: LockRecord;
}
