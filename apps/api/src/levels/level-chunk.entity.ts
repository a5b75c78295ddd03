import { Column, Entity, PrimaryColumn } from 'typeorm';

/** The partial summary of one chunk of a wheel-level computation; combined when all are in. */
@Entity('level_chunks')
export class LevelChunkEntity {
  @PrimaryColumn({ name: 'computation_id', type: 'uuid' }) computationId!: string;
  @PrimaryColumn({ name: 'chunk_index', type: 'int' }) chunkIndex!: number;
  @Column({ type: 'jsonb' }) summary!: unknown;
  @Column({ name: 'runner_id', type: 'varchar', length: 120 }) runnerId!: string;
  @Column({ name: 'computed_at', type: 'timestamptz', default: () => 'now()' }) computedAt!: Date;
}
