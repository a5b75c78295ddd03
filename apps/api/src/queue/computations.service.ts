import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type { ComputationView } from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import { listComputations, loadComputation } from './computation-views';

@Injectable()
export class ComputationsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly audit: AuditService,
  ) {}

  async get(id: string): Promise<ComputationView> {
    const c = await loadComputation(this.db, id);
    if (!c) throw new NotFoundException('Computation not found');
    return c;
  }

  list(kind?: string, status?: string): Promise<ComputationView[]> {
    return listComputations(this.db, kind, status);
  }

  /**
   * Marks a queued or running computation cancelled (its level too, unless stored). Cooperative:
   * runners read the status before each chunk and skip the rest; a chunk already under way
   * finishes and is stored, and nothing stored is removed.
   */
  async cancel(actor: { id: string }, id: string): Promise<ComputationView> {
    await this.db.transaction(async (m) => {
      const [row] = await m.query(`SELECT status, kind, params FROM computations WHERE id = $1 FOR UPDATE`, [id]);
      if (!row) throw new NotFoundException('Computation not found');
      if (row.status !== 'queued' && row.status !== 'running') {
        throw new ConflictException(`The computation has already ${row.status === 'cancelled' ? 'been cancelled' : row.status}; nothing to cancel`);
      }
      await m.query(`UPDATE computations SET status = 'cancelled', finished_at = now() WHERE id = $1`, [id]);
      await m.query(`UPDATE wheel_levels SET status = 'cancelled' WHERE computation_id = $1 AND status <> 'stored'`, [id]);
      await this.audit.record(actor.id, 'computation.cancel', null, { computationId: id, kind: row.kind, params: row.params }, m);
    });
    return this.get(id);
  }
}
