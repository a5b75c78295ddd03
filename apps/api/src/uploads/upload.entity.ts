import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { UploadContent, UploadKind } from '@cribra/contracts';

/** An uploaded tuple file or CSV table, stored raw and parsed; a Sift cell reads it by `name`. */
@Entity('uploads')
export class UploadEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'notebook_id', type: 'uuid' }) notebookId!: string;
  @Column({ name: 'owner_id', type: 'uuid' }) ownerId!: string;
  @Column({ type: 'varchar', length: 64 }) name!: string;
  @Column({ name: 'original_name', type: 'varchar', length: 255 }) originalName!: string;
  @Column({ type: 'varchar', length: 8 }) kind!: UploadKind;
  @Column({ name: 'media_type', type: 'varchar', length: 100 }) mediaType!: string;
  @Column({ name: 'size_bytes', type: 'int' }) sizeBytes!: number;
  @Column({ type: 'char', length: 64 }) sha256!: string;
  @Column({ name: 'row_count', type: 'int' }) rowCount!: number;
  @Column({ type: 'jsonb', nullable: true }) columns!: string[] | null;
  @Column({ type: 'jsonb' }) content!: UploadContent;
  @Column({ type: 'bytea', select: false }) raw!: Buffer;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
}
