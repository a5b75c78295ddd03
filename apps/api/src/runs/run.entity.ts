import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { CellKind, RunError, RunOutput, RunPurpose, RunStatus } from '@cribra/contracts';

/**
 * One execution of one cell revision. The source is copied in so that a run keeps saying what
 * was executed even after the cell changes. Written by the API (queued, cancelled) and by
 * runners (running, progress, final state).
 */
@Entity('runs')
export class RunEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'notebook_id', type: 'uuid' }) notebookId!: string;
  @Column({ name: 'cell_id', type: 'uuid' }) cellId!: string;
  @Column({ name: 'cell_revision', type: 'int' }) cellRevision!: number;
  @Column({ name: 'cell_kind', type: 'varchar', length: 8 }) cellKind!: CellKind;
  @Column({ type: 'text' }) source!: string;
  @Column({ type: 'varchar', length: 16, default: 'run' }) purpose!: RunPurpose;
  @Column({ type: 'varchar', length: 16, default: 'queued' }) status!: RunStatus;
  @Column({ type: 'real', default: 0 }) progress!: number;
  @Column({ name: 'progress_note', type: 'varchar', length: 200, nullable: true }) progressNote!: string | null;
  @Column({ type: 'jsonb', nullable: true }) outputs!: RunOutput[] | null;
  @Column({ name: 'output_digest', type: 'varchar', length: 128, nullable: true }) outputDigest!: string | null;
  @Column({ name: 'engine_version', type: 'varchar', length: 32, nullable: true }) engineVersion!: string | null;
  @Column({ name: 'language_version', type: 'varchar', length: 32, nullable: true }) languageVersion!: string | null;
  @Column({ name: 'runner_id', type: 'varchar', length: 120, nullable: true }) runnerId!: string | null;
  @Column({ type: 'int', default: 0 }) attempts!: number;
  @Column({ name: 'job_id', type: 'uuid', nullable: true }) jobId!: string | null;
  @Column({ name: 'requested_by', type: 'uuid' }) requestedBy!: string;
  @Column({ name: 'queued_at', type: 'timestamptz', default: () => 'now()' }) queuedAt!: Date;
  @Column({ name: 'started_at', type: 'timestamptz', nullable: true }) startedAt!: Date | null;
  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true }) finishedAt!: Date | null;
  @Column({ name: 'duration_ms', type: 'int', nullable: true }) durationMs!: number | null;
  @Column({ type: 'jsonb', nullable: true }) error!: RunError | null;
}
