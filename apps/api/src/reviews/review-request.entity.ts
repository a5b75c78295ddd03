import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** The owner asked for review (draft → in_review). */
@Entity('review_requests')
export class ReviewRequestEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'notebook_id', type: 'uuid' }) notebookId!: string;
  @Column({ name: 'requested_by', type: 'uuid' }) requestedBy!: string;
  @Column({ type: 'text', default: '' }) message!: string;
  @Column({ name: 'requested_at', type: 'timestamptz' }) requestedAt!: Date;
}
