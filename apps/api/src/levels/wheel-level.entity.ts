import { Column, Entity, PrimaryColumn } from 'typeorm';
import type { GapCount, LevelStatus, PatternTally } from '@cribra/contracts';

/** A stored wheel level: statistics of the reduced residue system modulo p#. */
@Entity('wheel_levels')
export class WheelLevelEntity {
  @PrimaryColumn({ type: 'int' }) prime!: number;
  @Column({ type: 'text' }) modulus!: string;
  @Column({ type: 'text' }) phi!: string;
  @Column({ name: 'largest_gap', type: 'int', nullable: true }) largestGap!: number | null;
  @Column({ type: 'jsonb', nullable: true }) histogram!: GapCount[] | null;
  @Column({ name: 'pattern_tallies', type: 'jsonb', nullable: true }) patternTallies!: PatternTally[] | null;
  @Column({ type: 'varchar', length: 128, nullable: true }) digest!: string | null;
  @Column({ type: 'varchar', length: 16, default: 'pending' }) status!: LevelStatus;
  @Column({ name: 'computation_id', type: 'uuid', nullable: true }) computationId!: string | null;
  @Column({ name: 'computed_by', type: 'varchar', length: 120, nullable: true }) computedBy!: string | null;
  @Column({ name: 'computed_at', type: 'timestamptz', nullable: true }) computedAt!: Date | null;
  @Column({ name: 'engine_version', type: 'varchar', length: 32, nullable: true }) engineVersion!: string | null;
}
