import { ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import type { LockedNotebookDetails, MemberRole, NotebookStatus } from '@cribra/contracts';
import { NotebookEntity } from '../notebooks/notebook.entity';
import { NotebookMemberEntity } from './notebook-member.entity';

/** Everything a person may try to do with a notebook. The one list every permission check uses. */
export type NotebookAction =
  | 'notebook.read'
  | 'notebook.update'
  | 'notebook.delete'
  | 'members.read'
  | 'members.manage'
  | 'cells.edit'
  | 'runs.create'
  | 'runs.cancel'
  | 'uploads.create'
  | 'uploads.delete'
  | 'export'
  | 'audit.read'
  // Review and collaboration (invitations, comments, reviews, locks).
  | 'invitations.read'
  | 'invitations.manage'
  | 'comments.read'
  | 'comments.write'
  | 'comments.resolve'
  | 'review.read'
  | 'review.request'
  | 'review.verify'
  | 'review.decide'
  | 'lock.create'
  | 'lock.read'
  | 'lock.check'
  | 'notebook.duplicate'
  // Published records (the public page itself needs no role: /api/records/:id).
  | 'record.publish'
  | 'record.read';

/** The acting person as the policy needs it. */
export interface Actor {
  id: string;
  siteRole: 'admin' | 'member';
}

/**
 * Roles allowed per action (site admins may do everything except ADMIN_EXCLUDED). The table
 * docs/permissions.md shows and the permission tests iterate over.
 */
export const MATRIX: Record<NotebookAction, readonly MemberRole[]> = {
  'notebook.read': ['owner', 'editor', 'reviewer', 'viewer'],
  'notebook.update': ['owner', 'editor'],
  'notebook.delete': ['owner'],
  'members.read': ['owner', 'editor', 'reviewer', 'viewer'],
  'members.manage': ['owner'],
  'cells.edit': ['owner', 'editor'],
  // Reviewers re-run cells to check them.
  'runs.create': ['owner', 'editor', 'reviewer'],
  'runs.cancel': ['owner', 'editor', 'reviewer'],
  'uploads.create': ['owner', 'editor'],
  'uploads.delete': ['owner', 'editor'],
  export: ['owner', 'editor', 'reviewer', 'viewer'],
  'audit.read': ['owner'],
  'invitations.read': ['owner'],
  'invitations.manage': ['owner'],
  'comments.read': ['owner', 'editor', 'reviewer', 'viewer'],
  // Writing a comment, replying, editing one's own (authorship checked by assertAuthor).
  'comments.write': ['owner', 'editor', 'reviewer'],
  'comments.resolve': ['owner', 'editor', 'reviewer'],
  'review.read': ['owner', 'editor', 'reviewer', 'viewer'],
  'review.request': ['owner'],
  'review.verify': ['owner', 'editor', 'reviewer'],
  'review.decide': ['reviewer'],
  'lock.create': ['owner'],
  'lock.read': ['owner', 'editor', 'reviewer', 'viewer'],
  // Anyone with access can check a lock record by re-running it.
  'lock.check': ['owner', 'editor', 'reviewer', 'viewer'],
  'notebook.duplicate': ['owner', 'editor', 'reviewer', 'viewer'],
  // Publishing and withdrawing a locked notebook's record: the owner's word, like the lock.
  'record.publish': ['owner'],
  'record.read': ['owner', 'editor', 'reviewer', 'viewer'],
};

/** Site admins may not do these unless they hold the role: a sign-off is a reviewer's own word. */
export const ADMIN_EXCLUDED: ReadonlySet<NotebookAction> = new Set<NotebookAction>(['review.decide']);

/** Actions that change a notebook's content: refused on a locked notebook, whoever asks. */
export const CHANGES_CONTENT: ReadonlySet<NotebookAction> = new Set<NotebookAction>([
  'notebook.update',
  'notebook.delete',
  'cells.edit',
  'runs.create',
  'runs.cancel',
  'uploads.create',
  'uploads.delete',
  'comments.write',
  'comments.resolve',
  'review.request',
  'review.verify',
  'review.decide',
  'lock.create',
]);

/** A notebooks row as PostgreSQL returns it. */
interface NotebookRow {
  id: string;
  title: string;
  summary: string;
  tags: string[];
  owner_id: string;
  status: NotebookStatus;
  revision: number;
  required_signoffs: number;
  created_at: Date;
  updated_at: Date;
}

export interface Authorized {
  notebook: NotebookEntity;
  role: MemberRole | null;
}

/**
 * All notebook permission decisions live here (guards and services only ask this service).
 * `can` decides; `authorize` loads the notebook and the membership and throws 404 / 403 / 409.
 */
@Injectable()
export class NotebookPolicyService {
  constructor(
    @InjectRepository(NotebookEntity) private readonly notebooks: Repository<NotebookEntity>,
    @InjectRepository(NotebookMemberEntity) private readonly members: Repository<NotebookMemberEntity>,
  ) {}

  /** Pure decision from the actor's role and the notebook's status. */
  can(actor: Actor, action: NotebookAction, notebook: { status: NotebookStatus }, role: MemberRole | null): boolean {
    if (notebook.status === 'locked' && CHANGES_CONTENT.has(action)) return false;
    if (actor.siteRole === 'admin' && !ADMIN_EXCLUDED.has(action)) return true;
    return role !== null && MATRIX[action].includes(role);
  }

  async roleOf(userId: string, notebookId: string): Promise<MemberRole | null> {
    const m = await this.members.findOne({ where: { notebookId, userId } });
    return m?.role ?? null;
  }

  /** Loads the notebook and checks `action`; 404 unknown, 409 locked, 403 not allowed. */
  async authorize(actor: Actor, action: NotebookAction, notebookId: string): Promise<Authorized> {
    // One round trip for the notebook and the actor's membership (this runs on every notebook request).
    const rows: Array<NotebookRow & { member_role: MemberRole | null }> = await this.notebooks.query(
      `SELECT n.id, n.title, n.summary, n.tags, n.owner_id, n.status, n.revision, n.required_signoffs,
              n.created_at, n.updated_at, m.role AS member_role
         FROM notebooks n LEFT JOIN notebook_members m ON m.notebook_id = n.id AND m.user_id = $2
        WHERE n.id = $1`,
      [notebookId, actor.id],
    );
    if (!rows.length) throw new NotFoundException('Notebook not found');
    const r = rows[0];
    const notebook = Object.assign(new NotebookEntity(), {
      id: r.id, title: r.title, summary: r.summary, tags: r.tags, ownerId: r.owner_id, status: r.status,
      revision: r.revision, requiredSignoffs: r.required_signoffs, createdAt: r.created_at, updatedAt: r.updated_at,
    });
    const role = r.member_role ?? null;
    if (this.can(actor, action, notebook, role)) return { notebook, role };
    if (role === null && (actor.siteRole !== 'admin' || ADMIN_EXCLUDED.has(action))) {
      throw new ForbiddenException('You are not a member of this notebook');
    }
    if (notebook.status === 'locked' && CHANGES_CONTENT.has(action)) {
      const details: LockedNotebookDetails = { reason: 'notebook_locked', notebookId };
      throw new ConflictException({ message: 'This notebook is locked; duplicate it to make changes', details });
    }
    throw new ForbiddenException(`A ${role} of this notebook may not do this (${action})`);
  }

  /** Only the author edits a comment (after `comments.write` was authorized). */
  assertAuthor(actor: Actor, authorId: string): void {
    if (actor.id !== authorId) throw new ForbiddenException('Only its author can edit a comment');
  }
}
