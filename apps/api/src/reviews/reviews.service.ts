import { BadRequestException, ConflictException, Inject, Injectable, Logger, NotFoundException } from '@nestjs/common';
import type { ConfigType } from '@nestjs/config';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, EntityManager } from 'typeorm';
import type { NotebookStatus, ReviewStateView, ReviewView, StaleDigestDetails } from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import { appConfig } from '../config/app.config';
import { composeMail, type MailContent } from '../mail/compose-mail';
import { MailService } from '../mail/mail.service';
import type { Actor } from '../members/notebook-policy.service';
import { CreateReviewDto } from './dto/create-review.dto';
import { RequestReviewDto } from './dto/request-review.dto';
import { revisionDigest } from './revision-digest';
import { stillReviewer } from './still-reviewer';
import { VerificationsService } from './verifications.service';

interface ReviewRow {
  id: string;
  notebook_id: string;
  reviewer_id: string;
  reviewer_name: string;
  decision: ReviewView['decision'];
  comment: string;
  revision_digest: string;
  notebook_revision: number;
  verification_id: string | null;
  created_at: Date;
  voided_at: Date | null;
  void_reason: string | null;
}

interface NotebookRow {
  id: string;
  title: string;
  status: NotebookStatus;
  revision: number;
  required_signoffs: number;
  owner_id: string;
}

const iso = (d: Date | null): string | null => (d ? new Date(d).toISOString() : null);

const toView = (r: ReviewRow, currentDigest: string): ReviewView => ({
  id: r.id,
  notebookId: r.notebook_id,
  reviewer: { id: r.reviewer_id, displayName: r.reviewer_name },
  decision: r.decision,
  comment: r.comment,
  revisionDigest: r.revision_digest,
  notebookRevision: r.notebook_revision,
  verificationId: r.verification_id,
  createdAt: iso(r.created_at)!,
  voidedAt: iso(r.voided_at),
  voidReason: r.void_reason,
  valid: r.decision === 'signoff' && !r.voided_at && r.revision_digest === currentDigest,
});

const SELECT_REVIEWS = `
  SELECT r.*, u.display_name AS reviewer_name FROM reviews r JOIN users u ON u.id = r.reviewer_id`;

/**
 * Review: asking for review, reviewers' decisions (sign-off or changes requested) bound to the
 * revision digest, and voiding sign-offs once the digest moves on (`reconcile`).
 */
@Injectable()
export class ReviewsService {
  private readonly logger = new Logger('Reviews');

  constructor(
    @InjectDataSource() private readonly db: DataSource,
    @Inject(appConfig.KEY) private readonly cfg: ConfigType<typeof appConfig>,
    private readonly mail: MailService,
    private readonly audit: AuditService,
    private readonly verifications: VerificationsService,
  ) {}

  private async notebook(db: DataSource | EntityManager, id: string, forUpdate = false): Promise<NotebookRow> {
    const rows: NotebookRow[] = await db.query(
      `SELECT id, title, status, revision, required_signoffs, owner_id FROM notebooks WHERE id = $1${forUpdate ? ' FOR UPDATE' : ''}`,
      [id],
    );
    if (!rows.length) throw new NotFoundException('Notebook not found');
    return rows[0];
  }

  private link(notebookId: string): string {
    return `${this.cfg.publicUrl}/notebooks/${notebookId}`;
  }

  private async mailQuietly(to: string, subject: string, content: MailContent): Promise<void> {
    try {
      await this.mail.send({ to, subject, ...composeMail(content) });
    } catch (err) {
      this.logger.warn(`Could not mail "${subject}" to ${to}: ${(err as Error).message}`);
    }
  }

  async list(notebookId: string): Promise<ReviewView[]> {
    const digest = await revisionDigest(this.db, notebookId);
    const rows: Array<ReviewRow & { still_reviewer: boolean }> = await this.db.query(
      `SELECT x.*, ${stillReviewer('x')} AS still_reviewer
         FROM (${SELECT_REVIEWS} WHERE r.notebook_id = $1) x ORDER BY x.created_at DESC`,
      [notebookId],
    );
    return rows.map((r) => {
      const view = toView(r, digest);
      return { ...view, valid: view.valid && r.still_reviewer };
    });
  }

  /**
   * Valid sign-offs: decision signoff, not voided, bound to `digest`, by someone who is still a
   * reviewer of the notebook (a sign-off stops counting when its author is removed or demoted).
   */
  async validSignoffs(db: DataSource | EntityManager, notebookId: string, digest: string): Promise<ReviewRow[]> {
    return db.query(
      `${SELECT_REVIEWS} WHERE r.notebook_id = $1 AND r.decision = 'signoff' AND r.voided_at IS NULL AND r.revision_digest = $2
          AND ${stillReviewer('r')}
        ORDER BY r.created_at`,
      [notebookId, digest],
    );
  }

  async state(notebookId: string): Promise<ReviewStateView> {
    await this.reconcile(notebookId);
    const nb = await this.notebook(this.db, notebookId);
    const digest = await revisionDigest(this.db, notebookId);
    const valid = (await this.validSignoffs(this.db, notebookId, digest)).map((r) => toView(r, digest));
    const [req] = await this.db.query(
      `SELECT requested_at FROM review_requests WHERE notebook_id = $1 ORDER BY requested_at DESC LIMIT 1`,
      [notebookId],
    );
    const blockers = await this.lockBlockers(this.db, nb, valid.length);
    return {
      notebookId,
      status: nb.status,
      notebookRevision: nb.revision,
      revisionDigest: digest,
      requiredSignoffs: nb.required_signoffs,
      validSignoffs: valid,
      canLock: blockers.length === 0,
      lockBlockers: blockers,
      latestVerification: await this.verifications.latest(notebookId),
      reviewRequestedAt: iso(req?.requested_at ?? null),
    };
  }

  /** Why the notebook cannot be locked now (empty: it can). */
  async lockBlockers(db: DataSource | EntityManager, nb: NotebookRow, validCount: number): Promise<string[]> {
    const out: string[] = [];
    if (nb.status === 'locked') return ['The notebook is locked already'];
    if (nb.status !== 'in_review') out.push('The owner has not asked for review of this revision (the notebook is a draft)');
    if (validCount < nb.required_signoffs) {
      out.push(`${nb.required_signoffs} valid sign-off(s) on the current revision are required; there are ${validCount}`);
    }
    const [{ n }] = await db.query(`SELECT count(*)::int AS n FROM runs WHERE notebook_id = $1 AND status IN ('queued', 'running')`, [nb.id]);
    if (n > 0) out.push(`${n} run(s) are still queued or running`);
    return out;
  }

  /** Owner: draft → in_review; reviewers are told by e-mail. */
  async request(actor: Actor, notebookId: string, body: RequestReviewDto): Promise<ReviewStateView> {
    const [rows] = await this.db.query(
      `UPDATE notebooks SET status = 'in_review', updated_at = now() WHERE id = $1 AND status = 'draft' RETURNING id`,
      [notebookId],
    );
    if (!rows.length) throw new ConflictException('The notebook is in review already');
    const message = body.message?.trim() ?? '';
    await this.db.query(`INSERT INTO review_requests (notebook_id, requested_by, message) VALUES ($1, $2, $3)`, [
      notebookId,
      actor.id,
      message,
    ]);
    await this.audit.record(actor.id, 'review.request', notebookId, {});
    const nb = await this.notebook(this.db, notebookId);
    const reviewers: Array<{ email: string; display_name: string }> = await this.db.query(
      `SELECT u.email, u.display_name FROM notebook_members m JOIN users u ON u.id = m.user_id
        WHERE m.notebook_id = $1 AND m.role = 'reviewer'`,
      [notebookId],
    );
    for (const r of reviewers) {
      await this.mailQuietly(
        r.email,
        `Review requested: "${nb.title}"`,
        {
          greeting: `Hello ${r.display_name},`,
          intro: [`The owner asks you to review the notebook "${nb.title}".`, ...(message ? ['Their note:'] : [])],
          quote: message || undefined,
          link: { href: this.link(notebookId), label: 'Re-verify it, then sign off or ask for changes' },
          outro: [],
        },
      );
    }
    return this.state(notebookId);
  }

  /** A reviewer's decision on the revision they looked at. */
  async decide(actor: Actor, notebookId: string, body: CreateReviewDto): Promise<ReviewView> {
    await this.reconcile(notebookId);
    const id = await this.db.transaction(async (m) => {
      const nb = await this.notebook(m, notebookId, true);
      if (nb.status !== 'in_review') throw new ConflictException('The owner has not asked for review of this notebook');
      const digest = await revisionDigest(m, notebookId);
      if (digest !== body.revisionDigest) {
        const details: StaleDigestDetails = { reason: 'stale_digest', revisionDigest: digest };
        throw new ConflictException({ message: 'The notebook changed since you looked at it; reload and re-verify', details });
      }
      if (body.decision === 'signoff') {
        if (!body.verificationId) {
          throw new BadRequestException({
            message: 'A sign-off needs a finished re-verify of this revision',
            details: [{ field: 'verificationId', messages: ['required for a sign-off'] }],
          });
        }
        const v = await this.verifications.get(body.verificationId).catch(() => null);
        if (!v || v.notebookId !== notebookId || v.purpose !== 'review' || v.revisionDigest !== digest) {
          throw new BadRequestException({
            message: 'verificationId must name a re-verify of this revision of this notebook',
            details: [{ field: 'verificationId', messages: ['not a re-verify of this revision'] }],
          });
        }
        // A sign-off says "I re-ran it": the re-verify must be the reviewer's own.
        if (v.requestedBy.id !== actor.id) {
          throw new BadRequestException({
            message: 'Sign off on a re-verify you ran yourself',
            details: [{ field: 'verificationId', messages: ['started by someone else'] }],
          });
        }
        if (v.status !== 'done') throw new ConflictException('The re-verify is still running; wait for it to finish');
        if (!v.allSame) {
          throw new ConflictException({
            message: `The re-verify did not reproduce every cell (${v.counts.differs} differ, ${v.counts.failed} failed); ask for changes instead`,
            details: { counts: v.counts },
          });
        }
        const mine = (await this.validSignoffs(m, notebookId, digest)).filter((r) => r.reviewer_id === actor.id);
        if (mine.length) throw new ConflictException('You signed off this revision already');
      }
      const [{ id }] = await m.query(
        `INSERT INTO reviews (notebook_id, reviewer_id, decision, comment, revision_digest, notebook_revision, verification_id)
         VALUES ($1, $2, $3, $4, $5, $6, $7) RETURNING id`,
        [notebookId, actor.id, body.decision, body.comment, digest, nb.revision, body.verificationId ?? null],
      );
      if (body.decision === 'changes_requested') {
        await m.query(`UPDATE notebooks SET status = 'draft', updated_at = now() WHERE id = $1`, [notebookId]);
      }
      await this.audit.record(
        actor.id,
        body.decision === 'signoff' ? 'review.signoff' : 'review.changes_requested',
        notebookId,
        { reviewId: id, revisionDigest: digest, notebookRevision: nb.revision, verificationId: body.verificationId ?? null },
        m,
      );
      return id as string;
    });
    const owner: Array<{ email: string; title: string; reviewer: string }> = await this.db.query(
      `SELECT o.email, n.title, u.display_name AS reviewer FROM notebooks n JOIN users o ON o.id = n.owner_id, users u
        WHERE n.id = $1 AND u.id = $2`,
      [notebookId, actor.id],
    );
    if (owner.length) {
      const what = body.decision === 'signoff' ? 'signed off' : 'asked for changes to';
      await this.mailQuietly(
        owner[0].email,
        `${owner[0].reviewer} ${what} "${owner[0].title}"`,
        {
          greeting: 'Hello,',
          intro: [`${owner[0].reviewer} ${what} the notebook "${owner[0].title}":`],
          quote: body.comment,
          link: { href: this.link(notebookId), label: 'Open the notebook' },
          outro: [],
        },
      );
    }
    const rows: ReviewRow[] = await this.db.query(`${SELECT_REVIEWS} WHERE r.id = $1`, [id]);
    return toView(rows[0], body.revisionDigest);
  }

  /**
   * Voids every sign-off whose revision digest is no longer the notebook's, returns the notebook
   * to review and tells each reviewer by e-mail. Idempotent and safe to call from several
   * processes: the UPDATE … RETURNING claims each sign-off once.
   */
  async reconcile(notebookId: string): Promise<number> {
    const active: Array<{ n: number }> = await this.db.query(
      `SELECT count(*)::int AS n FROM reviews r JOIN notebooks nb ON nb.id = r.notebook_id
        WHERE r.notebook_id = $1 AND r.decision = 'signoff' AND r.voided_at IS NULL AND nb.status <> 'locked'`,
      [notebookId],
    );
    if (!active[0]?.n) return 0;
    const voided = await this.db.transaction(async (m) => {
      const nb = await this.notebook(m, notebookId, true);
      if (nb.status === 'locked') return [];
      const digest = await revisionDigest(m, notebookId);
      const [rows]: [Array<{ id: string; reviewer_id: string; notebook_revision: number }>, number] = await m.query(
        `UPDATE reviews SET voided_at = now(), void_reason = $3
          WHERE notebook_id = $1 AND decision = 'signoff' AND voided_at IS NULL AND revision_digest <> $2
          RETURNING id, reviewer_id, notebook_revision`,
        [notebookId, digest, `The notebook changed after the sign-off (now at revision ${nb.revision})`],
      );
      if (!rows.length) return [];
      await m.query(`UPDATE notebooks SET status = 'in_review' WHERE id = $1 AND status = 'draft'`, [notebookId]);
      for (const r of rows) {
        await this.audit.record(null, 'review.signoff_void', notebookId, { reviewId: r.id, reviewerId: r.reviewer_id, revisionDigest: digest }, m);
      }
      return rows.map((r) => ({ ...r, title: nb.title, revision: nb.revision }));
    });
    for (const v of voided) {
      const [u] = await this.db.query(`SELECT email, display_name FROM users WHERE id = $1`, [v.reviewer_id]);
      if (!u) continue;
      await this.mailQuietly(
        u.email,
        `Your sign-off of "${v.title}" no longer holds`,
        {
          greeting: `Hello ${u.display_name},`,
          intro: [`The notebook "${v.title}" changed after you signed it off (it is now at revision ${v.revision}), so your sign-off was voided and the notebook is back in review.`],
          link: { href: this.link(notebookId), label: 'Re-verify and sign off again' },
          outro: [],
        },
      );
    }
    return voided.length;
  }
}
