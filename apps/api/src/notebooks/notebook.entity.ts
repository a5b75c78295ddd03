import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { NotebookStatus } from '@cribra/contracts';

/** A research notebook. `revision` is bumped by every change to it or its cells. */
@Entity('notebooks')
export class NotebookEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ type: 'varchar', length: 200 }) title!: string;
  @Column({ type: 'text', default: '' }) summary!: string;
  @Column({ type: 'text', array: true, default: () => "'{}'" }) tags!: string[];
  @Column({ name: 'owner_id', type: 'uuid' }) ownerId!: string;
  @Column({ type: 'varchar', length: 16, default: 'draft' }) status!: NotebookStatus;
  @Column({ type: 'int', default: 1 }) revision!: number;
  @Column({ name: 'required_signoffs', type: 'int', default: 1 }) requiredSignoffs!: number;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @UpdateDateColumn({ name: 'updated_at', type: 'timestamptz' }) updatedAt!: Date;
}
