import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { InvitableRole, InvitationDelivery } from '@cribra/contracts';

/** An e-mailed invitation to join a notebook. Only the SHA-256 of the token is kept. */
@Entity('invitations')
export class InvitationEntity {
  @PrimaryGeneratedColumn('uuid') id!: string;
  @Column({ name: 'notebook_id', type: 'uuid' }) notebookId!: string;
  @Column({ type: 'varchar', length: 320 }) email!: string;
  @Column({ type: 'varchar', length: 16 }) role!: InvitableRole;
  @Column({ type: 'text', default: '' }) message!: string;
  @Column({ name: 'token_hash', type: 'char', length: 64 }) tokenHash!: string;
  @Column({ name: 'invited_by', type: 'uuid' }) invitedBy!: string;
  @CreateDateColumn({ name: 'created_at', type: 'timestamptz' }) createdAt!: Date;
  @Column({ name: 'expires_at', type: 'timestamptz' }) expiresAt!: Date;
  @Column({ name: 'accepted_at', type: 'timestamptz', nullable: true }) acceptedAt!: Date | null;
  @Column({ name: 'accepted_by', type: 'uuid', nullable: true }) acceptedBy!: string | null;
  @Column({ name: 'revoked_at', type: 'timestamptz', nullable: true }) revokedAt!: Date | null;
  @Column({ type: 'varchar', length: 16, default: 'sending' }) delivery!: InvitationDelivery;
  @Column({ name: 'delivery_attempts', type: 'int', default: 0 }) deliveryAttempts!: number;
  @Column({ name: 'delivery_error', type: 'text', nullable: true }) deliveryError!: string | null;
  @Column({ name: 'next_attempt_at', type: 'timestamptz', nullable: true }) nextAttemptAt!: Date | null;
  @Column({ name: 'sent_at', type: 'timestamptz', nullable: true }) sentAt!: Date | null;
}
