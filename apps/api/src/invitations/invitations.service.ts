import {
  ConflictException,
  ForbiddenException,
  GoneException,
  Inject,
  Injectable,
  Logger,
  NotFoundException,
  OnModuleDestroy,
  OnModuleInit,
} from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import {
  INVITATION_PATH,
  INVITATION_TTL_DAYS,
  type AcceptInvitationResponse,
  type InvitationPreview,
  type InvitationStatus,
  type InvitationTokenErrorDetails,
  type InvitationView,
  type MemberRole,
} from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import type { InvitationGate } from '../auth/invitation-gate';
import { appConfig } from '../config/app.config';
import { invitationMail } from './invitation-mail';
import { MailService } from '../mail/mail.service';
import type { Actor } from '../members/notebook-policy.service';
import type { UserEntity } from '../users/user.entity';
import { CreateInvitationDto } from './dto/create-invitation.dto';
import { hashInvitationToken, newInvitationToken } from './invitation-token';

const DAY_MS = 24 * 60 * 60 * 1000;
/** Sending attempts before delivery is 'failed' (the owner can still resend). */
export const MAX_DELIVERY_ATTEMPTS = 8;

interface Row {
  id: string;
  notebook_id: string;
  email: string;
  role: InvitationView['role'];
  message: string;
  invited_by: string;
  inviter_name: string;
  created_at: Date;
  expires_at: Date;
  accepted_at: Date | null;
  accepted_by: string | null;
  acceptor_name: string | null;
  revoked_at: Date | null;
  delivery: InvitationView['delivery'];
  delivery_attempts: number;
  delivery_error: string | null;
  next_attempt_at: Date | null;
  sent_at: Date | null;
  notebook_title: string;
}

const SELECT = `
  SELECT i.*, u.display_name AS inviter_name, a.display_name AS acceptor_name, n.title AS notebook_title
    FROM invitations i
    JOIN users u ON u.id = i.invited_by
    JOIN notebooks n ON n.id = i.notebook_id
    LEFT JOIN users a ON a.id = i.accepted_by`;

const iso = (d: Date | null): string | null => (d ? new Date(d).toISOString() : null);

function statusOf(r: Pick<Row, 'accepted_at' | 'revoked_at' | 'expires_at'>): InvitationStatus {
  if (r.accepted_at) return 'accepted';
  if (r.revoked_at) return 'revoked';
  if (new Date(r.expires_at).getTime() <= Date.now()) return 'expired';
  return 'pending';
}

const toView = (r: Row): InvitationView => ({
  id: r.id,
  notebookId: r.notebook_id,
  email: r.email,
  role: r.role,
  status: statusOf(r),
  delivery: r.delivery,
  deliveryAttempts: r.delivery_attempts,
  deliveryError: r.delivery_error,
  nextAttemptAt: iso(r.next_attempt_at),
  sentAt: iso(r.sent_at),
  invitedBy: { id: r.invited_by, displayName: r.inviter_name },
  createdAt: iso(r.created_at)!,
  expiresAt: iso(r.expires_at)!,
  acceptedAt: iso(r.accepted_at),
  acceptedBy: r.accepted_by ? { id: r.accepted_by, displayName: r.acceptor_name ?? '' } : null,
  revokedAt: iso(r.revoked_at),
});

function tokenError(reason: InvitationTokenErrorDetails['reason']): never {
  const details: InvitationTokenErrorDetails = { reason };
  switch (reason) {
    case 'unknown':
      throw new NotFoundException({ message: 'This invitation link is not valid', details });
    case 'accepted':
      throw new GoneException({ message: 'This invitation was already used', details });
    case 'revoked':
      throw new GoneException({ message: 'This invitation was withdrawn by the notebook owner', details });
    case 'expired':
      throw new GoneException({ message: 'This invitation has expired; ask the owner to send it again', details });
    case 'wrong_account':
      throw new ForbiddenException({
        message: 'This invitation was sent to another e-mail address; sign in with that address',
        details,
      });
  }
}

/**
 * E-mail invitations to notebooks. A token is mailed once and only its hash is stored; each
 * delivery attempt mints a fresh token (an undelivered one is never usable), so a retry after
 * an SMTP failure needs no stored secret. Also the sign-up hook (InvitationGate) of AuthService.
 */
@Injectable()
export class InvitationsService implements InvitationGate, OnModuleInit, OnModuleDestroy {
  private readonly logger = new Logger('Invitations');
  private timer: NodeJS.Timeout | null = null;
  private ticking = false;
  /** First retry delay; doubles with every attempt, at most one hour. */
  private readonly retryBaseMs = Number(process.env.INVITATION_RETRY_BASE_MS) || 30_000;
  private readonly tickMs = Number(process.env.INVITATION_RETRY_TICK_MS) || 10_000;

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    @Inject(appConfig.KEY) private readonly cfg: ConfigType<typeof appConfig>,
    private readonly mail: MailService,
    private readonly audit: AuditService,
  ) {}

  onModuleInit(): void {
    this.timer = setInterval(() => void this.retryDue().catch((e) => this.logger.warn(`retry loop: ${(e as Error).message}`)), this.tickMs);
    this.timer.unref();
  }

  onModuleDestroy(): void {
    if (this.timer) clearInterval(this.timer);
  }

  private async row(id: string): Promise<Row> {
    const rows: Row[] = await this.db.query(`${SELECT} WHERE i.id = $1`, [id]);
    if (!rows.length) throw new NotFoundException('Invitation not found');
    return rows[0];
  }

  async get(id: string): Promise<InvitationView> {
    return toView(await this.row(id));
  }

  async notebookOf(id: string): Promise<string> {
    return (await this.row(id)).notebook_id;
  }

  async list(notebookId: string, status: 'pending' | 'all' = 'pending'): Promise<InvitationView[]> {
    const rows: Row[] = await this.db.query(`${SELECT} WHERE i.notebook_id = $1 ORDER BY i.created_at DESC`, [notebookId]);
    const views = rows.map(toView);
    return status === 'all' ? views : views.filter((v) => v.status === 'pending');
  }

  async create(actor: Actor, notebookId: string, body: CreateInvitationDto): Promise<InvitationView> {
    const email = body.email.trim().toLowerCase();
    const member: unknown[] = await this.db.query(
      `SELECT 1 FROM notebook_members m JOIN users u ON u.id = m.user_id WHERE m.notebook_id = $1 AND lower(u.email) = $2`,
      [notebookId, email],
    );
    if (member.length) throw new ConflictException('This address belongs to a member of the notebook already');
    const pending: unknown[] = await this.db.query(
      `SELECT 1 FROM invitations WHERE notebook_id = $1 AND lower(email) = $2
          AND accepted_at IS NULL AND revoked_at IS NULL AND expires_at > now()`,
      [notebookId, email],
    );
    if (pending.length) throw new ConflictException('This address has a pending invitation already; resend it instead');
    // A placeholder hash until the first delivery mints the mailed token. The 5-minute lease on
    // next_attempt_at keeps the retry loop away while this request sends.
    const { hash } = newInvitationToken();
    const [{ id }] = await this.db.query(
      `INSERT INTO invitations (notebook_id, email, role, message, token_hash, invited_by, expires_at, next_attempt_at)
       VALUES ($1, $2, $3, $4, $5, $6, now() + make_interval(days => $7), now() + interval '5 minutes') RETURNING id`,
      [notebookId, email, body.role, body.message?.trim() ?? '', hash, actor.id, INVITATION_TTL_DAYS],
    );
    await this.audit.record(actor.id, 'invitation.create', notebookId, { invitationId: id, email, role: body.role });
    await this.deliver(id);
    return this.get(id);
  }

  /** A new link (the old one stops working) valid for another 7 days, sent now. */
  async resend(actor: Actor, id: string): Promise<InvitationView> {
    const r = await this.row(id);
    const status = statusOf(r);
    if (status === 'accepted' || status === 'revoked') {
      throw new ConflictException(`This invitation was ${status}; create a new one instead`);
    }
    const { hash } = newInvitationToken();
    await this.db.query(
      `UPDATE invitations SET token_hash = $2, expires_at = now() + make_interval(days => $3), delivery = 'sending',
              delivery_attempts = 0, delivery_error = NULL, next_attempt_at = now() + interval '5 minutes'
        WHERE id = $1`,
      [id, hash, INVITATION_TTL_DAYS],
    );
    await this.audit.record(actor.id, 'invitation.resend', r.notebook_id, { invitationId: id, email: r.email });
    await this.deliver(id);
    return this.get(id);
  }

  async revoke(actor: Actor, id: string): Promise<void> {
    const r = await this.row(id);
    if (r.accepted_at) throw new ConflictException('This invitation was accepted already; remove the member instead');
    await this.db.query(`UPDATE invitations SET revoked_at = coalesce(revoked_at, now()), next_attempt_at = NULL WHERE id = $1`, [id]);
    await this.audit.record(actor.id, 'invitation.revoke', r.notebook_id, { invitationId: id, email: r.email });
  }

  // ------------------------------------------------------------ delivery

  /**
   * One delivery attempt: mint a token, store its hash, mail the link. On failure the invitation
   * stays pending with delivery 'retrying' and a next attempt after a growing delay.
   */
  async deliver(id: string): Promise<void> {
    const r = await this.row(id);
    if (statusOf(r) !== 'pending') return;
    const { token, hash } = newInvitationToken();
    await this.db.query(`UPDATE invitations SET token_hash = $2, delivery = 'sending' WHERE id = $1`, [id, hash]);
    const link = `${this.cfg.publicUrl}${INVITATION_PATH}/${token}`;
    const expires = new Date(r.expires_at).toISOString().slice(0, 10);
    const mail = invitationMail({
      inviterName: r.inviter_name, notebookTitle: r.notebook_title, role: r.role, message: r.message, link, expires,
    });
    try {
      await this.mail.send({ to: r.email, subject: mail.subject, text: mail.text, html: mail.html });
      await this.db.query(
        `UPDATE invitations SET delivery = 'sent', sent_at = now(), delivery_attempts = delivery_attempts + 1,
                delivery_error = NULL, next_attempt_at = NULL
          WHERE id = $1 AND token_hash = $2`,
        [id, hash],
      );
    } catch (err) {
      const message = (err as Error).message?.slice(0, 500) || 'unknown SMTP error';
      const attempts = r.delivery_attempts + 1;
      const gaveUp = attempts >= MAX_DELIVERY_ATTEMPTS;
      const delayMs = Math.min(this.retryBaseMs * 2 ** (attempts - 1), 60 * 60 * 1000);
      await this.db.query(
        `UPDATE invitations SET delivery = $3::varchar, delivery_attempts = $4, delivery_error = $5,
                next_attempt_at = CASE WHEN $3::varchar = 'failed' THEN NULL ELSE now() + make_interval(secs => $6::float8 / 1000) END
          WHERE id = $1 AND token_hash = $2`,
        [id, hash, gaveUp ? 'failed' : 'retrying', attempts, message, delayMs],
      );
      this.logger.warn(`Invitation ${id}: delivery attempt ${attempts} failed (${message})${gaveUp ? '; giving up' : ''}`);
    }
  }

  /** Retries every invitation whose next attempt is due (several API processes share the work). */
  async retryDue(): Promise<number> {
    if (this.ticking) return 0;
    this.ticking = true;
    try {
      // Claim with a lease so that another API process skips them meanwhile.
      const [claimed]: [Array<{ id: string }>, number] = await this.db.query(
        `UPDATE invitations SET next_attempt_at = now() + interval '5 minutes'
          WHERE id IN (SELECT id FROM invitations
                        WHERE delivery IN ('sending', 'retrying') AND accepted_at IS NULL AND revoked_at IS NULL
                          AND expires_at > now() AND next_attempt_at <= now()
                        ORDER BY next_attempt_at LIMIT 20 FOR UPDATE SKIP LOCKED)
          RETURNING id`,
      );
      for (const { id } of claimed) await this.deliver(id);
      return claimed.length;
    } finally {
      this.ticking = false;
    }
  }

  // ------------------------------------------------------------ following the link

  private async byToken(token: string): Promise<Row> {
    const rows: Row[] = await this.db.query(`${SELECT} WHERE i.token_hash = $1`, [hashInvitationToken(token)]);
    if (!rows.length) tokenError('unknown');
    const r = rows[0];
    const status = statusOf(r);
    if (status !== 'pending') tokenError(status);
    return r;
  }

  async preview(token: string): Promise<InvitationPreview> {
    const r = await this.byToken(token);
    const users: unknown[] = await this.db.query(`SELECT 1 FROM users WHERE lower(email) = $1`, [r.email]);
    return {
      notebookId: r.notebook_id,
      notebookTitle: r.notebook_title,
      role: r.role,
      email: r.email,
      invitedBy: { id: r.invited_by, displayName: r.inviter_name },
      expiresAt: iso(r.expires_at)!,
      accountExists: users.length > 0,
    };
  }

  /** InvitationGate: sign-up with a token must use the invited address. */
  async check(email: string, token: string): Promise<void> {
    const r = await this.byToken(token);
    if (r.email !== email.trim().toLowerCase()) tokenError('wrong_account');
  }

  /** InvitationGate: called by AuthService right after the account was created. */
  async accept(user: UserEntity, token: string): Promise<void> {
    await this.acceptAs(user, token);
  }

  /** Uses the token (once, atomically) and makes the user a member with the invited role. */
  async acceptAs(user: Pick<UserEntity, 'id' | 'email'>, token: string): Promise<AcceptInvitationResponse> {
    const r = await this.byToken(token);
    if (r.email !== user.email.trim().toLowerCase()) tokenError('wrong_account');
    return this.db.transaction(async (m) => {
      const [rows] = await m.query(
        `UPDATE invitations SET accepted_at = now(), accepted_by = $2, next_attempt_at = NULL
          WHERE id = $1 AND accepted_at IS NULL AND revoked_at IS NULL AND expires_at > now() RETURNING id`,
        [r.id, user.id],
      );
      if (!rows.length) tokenError('accepted');
      const existing: Array<{ role: MemberRole }> = await m.query(
        `SELECT role FROM notebook_members WHERE notebook_id = $1 AND user_id = $2 FOR UPDATE`,
        [r.notebook_id, user.id],
      );
      let role: MemberRole = r.role;
      if (!existing.length) {
        await m.query(`INSERT INTO notebook_members (notebook_id, user_id, role, added_by) VALUES ($1, $2, $3, $4)`, [
          r.notebook_id,
          user.id,
          r.role,
          r.invited_by,
        ]);
        await this.audit.record(user.id, 'member.join', r.notebook_id, { userId: user.id, role, invitationId: r.id }, m);
      } else if (existing[0].role !== 'owner' && existing[0].role !== r.role) {
        await m.query(`UPDATE notebook_members SET role = $3 WHERE notebook_id = $1 AND user_id = $2`, [r.notebook_id, user.id, r.role]);
        await this.audit.record(user.id, 'member.role', r.notebook_id, { userId: user.id, from: existing[0].role, to: r.role, invitationId: r.id }, m);
      } else {
        role = existing[0].role;
      }
      await this.audit.record(user.id, 'invitation.accept', r.notebook_id, { invitationId: r.id, email: r.email, role }, m);
      return { notebookId: r.notebook_id, role };
    });
  }
}
