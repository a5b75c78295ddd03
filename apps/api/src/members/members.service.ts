import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { Repository } from 'typeorm';
import type { MemberRole, MemberView } from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import { NotebookMemberEntity } from './notebook-member.entity';

interface MemberRow {
  user_id: string;
  email: string;
  display_name: string;
  role: MemberRole;
  added_at: Date;
}

const toView = (r: MemberRow): MemberView => ({
  userId: r.user_id,
  email: r.email,
  displayName: r.display_name,
  role: r.role,
  addedAt: new Date(r.added_at).toISOString(),
});

/** Memberships of notebooks (by existing user; e-mail invitations are the review feature's). */
@Injectable()
export class MembersService {
  constructor(
    @InjectRepository(NotebookMemberEntity) private readonly members: Repository<NotebookMemberEntity>,
    private readonly audit: AuditService,
  ) {}

  async list(notebookId: string): Promise<MemberView[]> {
    const rows: MemberRow[] = await this.members.query(
      `SELECT m.user_id, u.email, u.display_name, m.role, m.added_at
         FROM notebook_members m JOIN users u ON u.id = m.user_id
        WHERE m.notebook_id = $1
        ORDER BY CASE m.role WHEN 'owner' THEN 0 WHEN 'editor' THEN 1 WHEN 'reviewer' THEN 2 ELSE 3 END, u.display_name`,
      [notebookId],
    );
    return rows.map(toView);
  }

  private async one(notebookId: string, userId: string): Promise<MemberView> {
    const found = (await this.list(notebookId)).find((m) => m.userId === userId);
    if (!found) throw new NotFoundException('This person is not a member of the notebook');
    return found;
  }

  async add(actorId: string, notebookId: string, email: string, role: MemberRole): Promise<MemberView> {
    const users: Array<{ id: string }> = await this.members.query(`SELECT id FROM users WHERE lower(email) = lower($1)`, [
      email.trim(),
    ]);
    if (!users.length) {
      throw new NotFoundException({
        message: `No account uses ${email.trim()}; invite the address instead`,
        details: [{ field: 'email', messages: ['no account with this e-mail'] }],
      });
    }
    const userId = users[0].id;
    if (await this.members.findOne({ where: { notebookId, userId } })) {
      throw new ConflictException('This person is already a member of the notebook');
    }
    await this.members.insert({ notebookId, userId, role, addedBy: actorId });
    await this.audit.record(actorId, 'member.add', notebookId, { userId, role });
    return this.one(notebookId, userId);
  }

  async changeRole(actorId: string, notebookId: string, userId: string, role: MemberRole): Promise<MemberView> {
    const m = await this.members.findOne({ where: { notebookId, userId } });
    if (!m) throw new NotFoundException('This person is not a member of the notebook');
    if (m.role === 'owner') throw new BadRequestException("The owner's role cannot be changed");
    await this.members.update({ notebookId, userId }, { role });
    await this.audit.record(actorId, 'member.role', notebookId, { userId, from: m.role, to: role });
    return this.one(notebookId, userId);
  }

  async remove(actorId: string, notebookId: string, userId: string): Promise<void> {
    const m = await this.members.findOne({ where: { notebookId, userId } });
    if (!m) throw new NotFoundException('This person is not a member of the notebook');
    if (m.role === 'owner') throw new BadRequestException('The owner cannot be removed');
    await this.members.delete({ notebookId, userId });
    await this.audit.record(actorId, 'member.remove', notebookId, { userId, role: m.role });
  }
}
