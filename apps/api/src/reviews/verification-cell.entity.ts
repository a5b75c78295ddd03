import { Column, Entity, PrimaryColumn } from 'typeorm';

/** One cell of a re-verify: what was recorded, and the re-run that checks it. */
@Entity('verification_cells')
export class VerificationCellEntity {
  @PrimaryColumn({ name: 'verification_id', type: 'uuid' }) verificationId!: string;
  @PrimaryColumn({ name: 'cell_id', type: 'uuid' }) cellId!: string;
  @Column({ type: 'int' }) position!: number;
  @Column({ type: 'varchar', length: 8 }) kind!: string;
  @Column({ name: 'recorded_run_id', type: 'uuid', nullable: true }) recordedRunId!: string | null;
  @Column({ name: 'recorded_digest', type: 'varchar', length: 128, nullable: true }) recordedDigest!: string | null;
  @Column({ name: 'run_id', type: 'uuid', nullable: true }) runId!: string | null;
}
