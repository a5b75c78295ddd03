import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** Who did what, when. Rows are only inserted, never changed. */
@Entity('audit_events')
export class AuditEventEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @CreateDateColumn({ type: 'timestamptz' }) at!: Date;
  @Column({ name: 'actor_id', type: 'uuid', nullable: true }) actorId!: string | null;
  /** Not a foreign key: the trail outlives a deleted notebook. */
  @Column({ name: 'notebook_id', type: 'uuid', nullable: true }) notebookId!: string | null;
  @Column({ type: 'varchar', length: 64 }) action!: string;
  @Column({ type: 'jsonb', default: () => "'{}'" }) details!: Record<string, unknown>;
}
