import { Column, CreateDateColumn, Entity, PrimaryColumn } from 'typeorm';
import type { MemberRole } from '@cribra/contracts';

/** One person's role in one notebook; exactly one row per notebook has role 'owner'. */
@Entity('notebook_members')
export class NotebookMemberEntity {
  @PrimaryColumn({ name: 'notebook_id', type: 'uuid' }) notebookId!: string;
  @PrimaryColumn({ name: 'user_id', type: 'uuid' }) userId!: string;
  @Column({ type: 'varchar', length: 16 }) role!: MemberRole;
  @Column({ name: 'added_by', type: 'uuid', nullable: true }) addedBy!: string | null;
  @CreateDateColumn({ name: 'added_at', type: 'timestamptz' }) addedAt!: Date;
}
