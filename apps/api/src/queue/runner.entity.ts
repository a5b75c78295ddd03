import { Column, Entity, PrimaryColumn } from 'typeorm';

/** A runner process, kept alive by heartbeats (last_seen_at). */
@Entity('runners')
export class RunnerEntity {
  @PrimaryColumn({ type: 'varchar', length: 120 }) id!: string;
  @Column({ type: 'varchar', length: 200 }) host!: string;
  @Column({ type: 'int' }) pid!: number;
  @Column({ name: 'started_at', type: 'timestamptz', default: () => 'now()' }) startedAt!: Date;
  @Column({ name: 'last_seen_at', type: 'timestamptz', default: () => 'now()' }) lastSeenAt!: Date;
  @Column({ name: 'current_job', type: 'varchar', length: 200, nullable: true }) currentJob!: string | null;
  @Column({ name: 'jobs_done', type: 'int', default: 0 }) jobsDone!: number;
  @Column({ name: 'stopped_at', type: 'timestamptz', nullable: true }) stoppedAt!: Date | null;
}
