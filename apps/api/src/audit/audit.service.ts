import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { EntityManager, Repository } from 'typeorm';
import type { AuditEventView } from '@cribra/contracts';
import { AuditEventEntity } from './audit-event.entity';

/** Appends audit events (who, what, when) and reads them back for owners and admins. */
@Injectable()
export class AuditService {
  constructor(@InjectRepository(AuditEventEntity) private readonly events: Repository<AuditEventEntity>) {}

  /** Records one event; pass the transaction's manager to make it part of the same commit. */
  async record(
    actorId: string | null,
    action: string,
    notebookId: string | null,
    details: Record<string, unknown> = {},
    manager?: EntityManager,
  ): Promise<void> {
    const db = manager ?? this.events.manager;
    await db.query(`INSERT INTO audit_events (actor_id, action, notebook_id, details) VALUES ($1, $2, $3, $4)`, [
      actorId,
      action,
      notebookId,
      JSON.stringify(details),
    ]);
  }

  async listForNotebook(notebookId: string, limit = 200): Promise<AuditEventView[]> {
    const rows: Array<AuditEventEntity & { actor_name: string | null }> = await this.events.query(
      `SELECT e.id, e.at, e.actor_id AS "actorId", e.notebook_id AS "notebookId", e.action, e.details,
              u.display_name AS actor_name
         FROM audit_events e LEFT JOIN users u ON u.id = e.actor_id
        WHERE e.notebook_id = $1 ORDER BY e.at DESC LIMIT $2`,
      [notebookId, limit],
    );
    return rows.map((r) => ({
      id: r.id,
      at: new Date(r.at).toISOString(),
      actor: r.actorId ? { id: r.actorId, displayName: r.actor_name ?? '' } : null,
      notebookId: r.notebookId,
      action: r.action,
      details: r.details,
    }));
  }
}
