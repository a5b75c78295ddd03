import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { CellKind } from '@cribra/contracts';

/** A cell of a notebook; `revision` is bumped by each change of source or kind. */
@Entity('cells')
export class CellEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'notebook_id', type: 'uuid' }) notebookId!: string;
  @Column({ type: 'varchar', length: 8 }) kind!: CellKind;
  @Column({ type: 'text', default: '' }) source!: string;
  /** Optional heading of the cell card (not part of the revision digest). */
  @Column({ type: 'varchar', length: 200, nullable: true }) title!: string | null;
  @Column({ type: 'int' }) position!: number;
  @Column({ type: 'int', default: 1 }) revision!: number;
  @Column({ name: 'author_id', type: 'uuid' }) authorId!: string;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt!: Date;
}
