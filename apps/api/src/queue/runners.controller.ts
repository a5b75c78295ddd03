import { Controller, Get, UseGuards } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import { DataSource } from 'typeorm';
import type { RunnerView } from '@cribra/contracts';
import { SignedInGuard } from '../common';

/** Seconds without a heartbeat after which a runner counts as gone. */
const ALIVE_WITHIN_SECONDS = 30;

@ApiTags('computations')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller('runners')
export class RunnersController {
  constructor(@InjectDataSource() private readonly db: DataSource) {}

  @Get()
  @ApiOperation({ summary: 'Runner processes with their heartbeats (live ones first, then the last 50 stopped or lost)' })
  async list(): Promise<RunnerView[]> {
    const rows: Array<{
      id: string;
      host: string;
      pid: number;
      started_at: Date;
      last_seen_at: Date;
      current_job: string | null;
      jobs_done: number;
      stopped_at: Date | null;
      taken_over_at: Date | null;
      taken_over_by: string | null;
      alive: boolean;
    }> = await this.db.query(
      `SELECT *, (stopped_at IS NULL AND taken_over_at IS NULL AND last_seen_at > now() - make_interval(secs => $1)) AS alive FROM runners
        ORDER BY (stopped_at IS NULL AND taken_over_at IS NULL AND last_seen_at > now() - make_interval(secs => $1)) DESC, last_seen_at DESC LIMIT 100`,
      [ALIVE_WITHIN_SECONDS],
    );
    return rows.map((r) => ({
      id: r.id,
      host: r.host,
      pid: r.pid,
      startedAt: new Date(r.started_at).toISOString(),
      lastSeenAt: new Date(r.last_seen_at).toISOString(),
      currentJob: r.current_job,
      jobsDone: r.jobs_done,
      stoppedAt: r.stopped_at ? new Date(r.stopped_at).toISOString() : null,
      alive: r.alive,
      takenOverAt: r.taken_over_at ? new Date(r.taken_over_at).toISOString() : null,
      takenOverBy: r.taken_over_by,
    }));
  }
}
