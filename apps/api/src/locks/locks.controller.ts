import { Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Query, Res, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { DuplicateNotebookResponse, LockRecord, VerificationView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import { NotebookPolicyService } from '../members/notebook-policy.service';
import type { UserEntity } from '../users/user.entity';
import { DuplicateNotebookDto } from './dto/duplicate-notebook.dto';
import { LockExportDto } from './dto/lock-export.dto';
import { LocksService } from './locks.service';

@ApiTags('locks')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller('notebooks/:id')
export class LocksController {
  constructor(
    private readonly locks: LocksService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Post('lock')
  @ApiOperation({ summary: 'Lock a notebook with enough valid sign-offs on its current revision (owner, admin)' })
  async lock(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<LockRecord> {
    await this.policy.authorize(user, 'lock.create', id);
    return this.locks.lock(user, id);
  }

  @Get('lock')
  @ApiOperation({ summary: 'The lock record (404 when the notebook is not locked)' })
  async record(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<LockRecord> {
    await this.policy.authorize(user, 'lock.read', id);
    return this.locks.record(id);
  }

  @Get('lock/export')
  @ApiProduces('application/json', 'text/markdown')
  @ApiOperation({ summary: 'The lock record as JSON or readable Markdown' })
  async export(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Query() q: LockExportDto,
    @Res() res: Response,
  ): Promise<void> {
    await this.policy.authorize(user, 'lock.read', id);
    const file = await this.locks.export(user, id, q.format);
    res.setHeader('Content-Type', file.mediaType);
    res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
    res.send(file.body);
  }

  @Post('lock/checks')
  @HttpCode(202)
  @ApiOperation({ summary: 'Check a locked notebook by re-running it against its lock record' })
  async check(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<VerificationView> {
    await this.policy.authorize(user, 'lock.check', id);
    return this.locks.check(user, id);
  }

  @Post('duplicate')
  @ApiOperation({ summary: 'Copy the notebook (cells, recorded runs, uploads) into a new draft you own' })
  async duplicate(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: DuplicateNotebookDto,
  ): Promise<DuplicateNotebookResponse> {
    await this.policy.authorize(user, 'notebook.duplicate', id);
    return this.locks.duplicate(user, id, body);
  }
}
