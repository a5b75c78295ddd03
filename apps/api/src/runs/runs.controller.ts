import { Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Query, Sse, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Observable } from 'rxjs';
import type { Page, RunAllResponse, RunView } from '@cribra/contracts';
import { CurrentUser, PageDto, SignedInGuard } from '../common';
import type { UserEntity } from '../users/user.entity';
import { CellsService } from '../cells/cells.service';
import { NotebookPolicyService } from '../members/notebook-policy.service';
import { RunEventsService, type SseMessage } from './run-events.service';
import { RunsService } from './runs.service';
import { assertRunnable } from './syntax-check';

@ApiTags('runs')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller()
export class RunsController {
  constructor(
    private readonly runs: RunsService,
    private readonly cells: CellsService,
    private readonly events: RunEventsService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Post('cells/:id/runs')
  @HttpCode(202)
  @ApiOperation({ summary: "Queue a run of the cell's current revision" })
  async runCell(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<RunView> {
    // One read of the cell serves both the permission check and the run (the accept path is hot).
    const cell = await this.runs.cellToRun(id);
    await this.policy.authorize(user, 'runs.create', cell.notebook_id);
    if (cell.kind !== 'note') assertRunnable([{ source: cell.source }]);
    return this.runs.runCell(user, id, 'run', cell);
  }

  @Post('notebooks/:id/runs')
  @HttpCode(202)
  @ApiOperation({ summary: 'Queue a run of every query and claim cell, top to bottom' })
  async runAll(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<RunAllResponse> {
    await this.policy.authorize(user, 'runs.create', id);
    return { runs: await this.runs.runAll(user, id) };
  }

  @Get('cells/:id/runs')
  @ApiOperation({ summary: 'Run history of a cell, newest first' })
  async cellHistory(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Query() q: PageDto,
  ): Promise<Page<RunView>> {
    await this.policy.authorize(user, 'notebook.read', await this.cells.notebookOf(id));
    return this.runs.history('cell_id', id, q.page, q.pageSize);
  }

  @Get('notebooks/:id/runs')
  @ApiOperation({ summary: 'Run history of a notebook, newest first' })
  async notebookHistory(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Query() q: PageDto,
  ): Promise<Page<RunView>> {
    await this.policy.authorize(user, 'notebook.read', id);
    return this.runs.history('notebook_id', id, q.page, q.pageSize);
  }

  @Get('runs/:id')
  @ApiOperation({ summary: 'One run with its outputs and digest' })
  async get(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<RunView> {
    await this.policy.authorize(user, 'notebook.read', await this.runs.notebookOfRun(id));
    return this.runs.get(id);
  }

  @Post('runs/:id/cancel')
  @HttpCode(200)
  @ApiOperation({ summary: 'Cancel a queued or running run (409 when it already finished)' })
  async cancel(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<RunView> {
    await this.policy.authorize(user, 'runs.cancel', await this.runs.notebookOfRun(id));
    return this.runs.cancel(user, id);
  }

  @Sse('notebooks/:id/events')
  @ApiProduces('text/event-stream')
  @ApiOperation({ summary: 'Server-sent events: run progress and notebook revisions' })
  async notebookEvents(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<Observable<SseMessage>> {
    await this.policy.authorize(user, 'notebook.read', id);
    return this.events.stream(id);
  }

  @Sse('runs/:id/events')
  @ApiProduces('text/event-stream')
  @ApiOperation({ summary: 'Server-sent events of one run' })
  async runEvents(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<Observable<SseMessage>> {
    const notebookId = await this.runs.notebookOfRun(id);
    await this.policy.authorize(user, 'notebook.read', notebookId);
    return this.events.streamRun(notebookId, id, () => this.runs.progressOf(id));
  }
}
