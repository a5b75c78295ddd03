import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { ThreadStatus } from '@cribra/contracts';

/** A discussion attached to a notebook, a cell, or one output of a cell's run. */
@Entity('comment_threads')
export class CommentThreadEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'notebook_id', type: 'uuid' }) notebookId!: string;
  @Column({ name: 'anchor_kind', type: 'varchar', length: 8 }) anchorKind!: 'notebook' | 'cell' | 'output';
  @Column({ name: 'cell_id', type: 'uuid', nullable: true }) cellId!: string | null;
  @Column({ name: 'run_id', type: 'uuid', nullable: true }) runId!: string | null;
  @Column({ name: 'output_index', type: 'int', nullable: true }) outputIndex!: number | null;
  @Column({ type: 'varchar', length: 8, default: 'open' }) status!: ThreadStatus;
  @Column({ name: 'created_by', type: 'uuid' }) createdBy!: string;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @Column({ name: 'resolved_by', type: 'uuid', nullable: true }) resolvedBy!: string | null;
  @Column({ name: 'resolved_at', type: 'timestamptz', nullable: true }) resolvedAt!: Date | null;
}
