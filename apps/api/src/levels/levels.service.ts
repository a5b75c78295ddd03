import { BadRequestException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type { ComputationView, WheelLevelSummary, WheelLevelView } from '@cribra/contracts';
import { AuditService } from '../audit/audit.service';
import type { Actor } from '../members/notebook-policy.service';
import { ComputationRequestError, requestLevel } from '../queue/computation-requests';
import { ComputationsService } from '../queue/computations.service';
import { QueueService } from '../queue/queue.service';

interface LevelRow {
  prime: number;
  modulus: string;
  phi: string;
  largest_gap: number | null;
  status: WheelLevelSummary['status'];
  digest: string | null;
  computation_id: string | null;
  chunks_total: number | null;
  chunks_done: number | null;
  computed_by: string | null;
  computed_at: Date | null;
  engine_version: string | null;
  histogram?: WheelLevelView['histogram'] | null;
  pattern_tallies?: WheelLevelView['patternTallies'] | null;
}

const toSummary = (r: LevelRow): WheelLevelSummary => ({
  prime: r.prime,
  modulus: r.modulus,
  phi: r.phi,
  largestGap: r.largest_gap,
  status: r.status,
  digest: r.digest,
  computationId: r.computation_id,
  chunksTotal: r.chunks_total ?? 0,
  chunksDone: r.chunks_done ?? 0,
  computedBy: r.computed_by,
  computedAt: r.computed_at ? new Date(r.computed_at).toISOString() : null,
  engineVersion: r.engine_version,
});

const SELECT = (extra: string): string => `
  SELECT l.prime, l.modulus, l.phi, l.largest_gap, l.status, l.digest, l.computation_id, c.chunks_total,
         c.chunks_done, l.computed_by, l.computed_at, l.engine_version ${extra}
    FROM wheel_levels l LEFT JOIN computations c ON c.id = l.computation_id`;

@Injectable()
export class LevelsService {
  constructor(
    @InjectDataSource() private readonly db: DataSource,
    private readonly queue: QueueService,
    private readonly computations: ComputationsService,
    private readonly audit: AuditService,
  ) {}

  async list(): Promise<WheelLevelSummary[]> {
    const rows: LevelRow[] = await this.db.query(`${SELECT('')} ORDER BY l.prime`);
    return rows.map(toSummary);
  }

  async get(prime: number): Promise<WheelLevelView> {
    const rows: LevelRow[] = await this.db.query(`${SELECT(', l.histogram, l.pattern_tallies')} WHERE l.prime = $1`, [prime]);
    if (!rows.length) throw new NotFoundException(`Wheel level ${prime} is not stored; request it first`);
    const r = rows[0];
    return { ...toSummary(r), histogram: r.histogram ?? [], patternTallies: r.pattern_tallies ?? [] };
  }

  async request(actor: Actor, prime: number): Promise<ComputationView> {
    try {
      const { computationId, created } = await requestLevel(this.db, this.queue.boss, prime, actor.id);
      if (created) await this.audit.record(actor.id, 'level.request', null, { prime, computationId });
      return this.computations.get(computationId);
    } catch (err) {
      if (err instanceof ComputationRequestError) {
        throw new BadRequestException({ message: err.message, details: [{ field: err.field, messages: [err.message] }] });
      }
      throw err;
    }
  }
}
