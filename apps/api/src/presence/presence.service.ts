import { Injectable } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { PRESENCE_QUIET_MS, type PresenceView } from '@cribra/contracts';

/** Who has a notebook open, from the tabs' heartbeats (a tab quiet for PRESENCE_QUIET_MS is gone). */
@Injectable()
export class PresenceService {
  constructor(@InjectDataSource() private readonly db: DataSource) {}

  async beat(userId: string, notebookId: string, tabId: string, cellId: string | null): Promise<PresenceView[]> {
    await this.db.query(
      `INSERT INTO notebook_presence (notebook_id, user_id, tab_id, cell_id) VALUES ($1, $2, $3, $4)
       ON CONFLICT (notebook_id, user_id, tab_id) DO UPDATE SET cell_id = EXCLUDED.cell_id, seen_at = now()`,
      [notebookId, userId, tabId, cellId],
    );
    // Quiet tabs are cleared as others beat, so their departure is announced too.
    await this.db.query(`DELETE FROM notebook_presence WHERE notebook_id = $1 AND seen_at < now() - make_interval(secs => $2)`, [
      notebookId,
      PRESENCE_QUIET_MS / 1000,
    ]);
    return this.list(notebookId);
  }

  async leave(userId: string, notebookId: string, tabId: string): Promise<void> {
    await this.db.query(`DELETE FROM notebook_presence WHERE notebook_id = $1 AND user_id = $2 AND tab_id = $3`, [notebookId, userId, tabId]);
  }

  /** One entry per person (several tabs merge; a focused cell wins over none). */
  async list(notebookId: string): Promise<PresenceView[]> {
    const rows: Array<{ user_id: string; display_name: string; cell_id: string | null }> = await this.db.query(
      `SELECT p.user_id, u.display_name, (array_agg(p.cell_id ORDER BY p.cell_id IS NULL, p.seen_at DESC))[1] AS cell_id
         FROM notebook_presence p JOIN users u ON u.id = p.user_id
        WHERE p.notebook_id = $1 AND p.seen_at >= now() - make_interval(secs => $2)
        GROUP BY p.user_id, u.display_name ORDER BY u.display_name`,
      [notebookId, PRESENCE_QUIET_MS / 1000],
    );
    return rows.map((r) => ({ user: { id: r.user_id, displayName: r.display_name }, editingCellId: r.cell_id }));
  }
}
