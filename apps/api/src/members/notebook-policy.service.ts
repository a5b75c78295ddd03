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
  | 'audit.read';

/** The acting person as the policy needs it. */
export interface Actor {
  id: string;
  siteRole: 'admin' | 'member';
}

/** Roles allowed per action (site admins may do everything). */
const MATRIX: Record<NotebookAction, readonly MemberRole[]> = {
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
};

/** Actions that change a notebook's content: refused on a locked notebook, whoever asks. */
const CHANGES_CONTENT: ReadonlySet<NotebookAction> = new Set([
  'notebook.update',
  'notebook.delete',
  'cells.edit',
  'runs.create',
  'runs.cancel',
  'uploads.create',
  'uploads.delete',
]);

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
    if (actor.siteRole === 'admin') return true;
    return role !== null && MATRIX[action].includes(role);
  }

  async roleOf(userId: string, notebookId: string): Promise<MemberRole | null> {
    const m = await this.members.findOne({ where: { notebookId, userId } });
    return m?.role ?? null;
  }

  /** Loads the notebook and checks `action`; 404 unknown, 409 locked, 403 not allowed. */
  async authorize(actor: Actor, action: NotebookAction, notebookId: string): Promise<Authorized> {
    const notebook = await this.notebooks.findOne({ where: { id: notebookId } });
    if (!notebook) throw new NotFoundException('Notebook not found');
    const role = await this.roleOf(actor.id, notebookId);
    if (this.can(actor, action, notebook, role)) return { notebook, role };
    if (role === null && actor.siteRole !== 'admin') {
      throw new ForbiddenException('You are not a member of this notebook');
    }
    if (notebook.status === 'locked' && CHANGES_CONTENT.has(action)) {
      const details: LockedNotebookDetails = { reason: 'notebook_locked', notebookId };
      throw new ConflictException({ message: 'This notebook is locked; duplicate it to make changes', details });
    }
    throw new ForbiddenException(`A ${role} of this notebook may not do this (${action})`);
  }
}
