import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** One comment of a thread: Markdown source with math; the web renders it sanitised. */
@Entity('comments')
export class CommentEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'thread_id', type: 'uuid' }) threadId!: string;
  @Column({ name: 'author_id', type: 'uuid' }) authorId!: string;
  @Column({ type: 'text' }) body!: string;
  @Column({ type: 'uuid', array: true, default: () => "'{}'" }) mentions!: string[];
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @Column({ name: 'edited_at', type: 'timestamptz', nullable: true }) editedAt!: Date | null;
}
