import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { ComputationKind, ComputationStatus } from '@cribra/contracts';

/** A big computation split into chunk jobs that any runner may take. */
@Entity('computations')
export class ComputationEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ type: 'varchar', length: 16 }) kind!: ComputationKind;
  @Column({ type: 'jsonb' }) params!: Record<string, string | number>;
  @Column({ type: 'varchar', length: 16, default: 'queued' }) status!: ComputationStatus;
  @Column({ name: 'chunks_total', type: 'int', default: 0 }) chunksTotal!: number;
  @Column({ name: 'chunks_done', type: 'int', default: 0 }) chunksDone!: number;
  @Column({ name: 'requested_by', type: 'uuid', nullable: true }) requestedBy!: string | null;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @Column({ name: 'started_at', type: 'timestamptz', nullable: true }) startedAt!: Date | null;
  @Column({ name: 'finished_at', type: 'timestamptz', nullable: true }) finishedAt!: Date | null;
  @Column({ type: 'text', nullable: true }) error!: string | null;
}
