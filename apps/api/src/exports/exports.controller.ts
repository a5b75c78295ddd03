import { Controller, Get, Param, ParseIntPipe, ParseUUIDPipe, Query, Res, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentUser, SignedInGuard } from '../common';
import type { UserEntity } from '../users/user.entity';
import { NotebookPolicyService } from '../members/notebook-policy.service';
import { RunsService } from '../runs/runs.service';
import { UploadsService } from '../uploads/uploads.service';
import { NotebookFormatDto } from './dto/notebook-format.dto';
import { TableFormatDto } from './dto/table-format.dto';
import { ExportsService, type ExportFile } from './exports.service';

function send(res: Response, file: ExportFile): void {
  res.setHeader('Content-Type', file.mediaType);
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
  res.send(file.body);
}

@ApiTags('exports')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller()
export class ExportsController {
  constructor(
    private readonly exportsService: ExportsService,
    private readonly runs: RunsService,
    private readonly uploads: UploadsService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Get('notebooks/:id/export')
  @ApiProduces('text/markdown', 'application/x-latex', 'text/plain')
  @ApiOperation({ summary: 'The notebook with its latest results as Markdown or LaTeX, or its cells as a .sift notebook file' })
  async notebook(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Query() q: NotebookFormatDto,
    @Res() res: Response,
  ): Promise<void> {
    await this.policy.authorize(user, 'export', id);
    send(res, await this.exportsService.notebook(user, id, q.format));
  }

  @Get('runs/:id/outputs/:index/export')
  @ApiProduces('text/csv', 'application/json')
  @ApiOperation({ summary: 'A table output of a run as CSV or JSON' })
  async runTable(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('index', ParseIntPipe) index: number,
    @Query() q: TableFormatDto,
    @Res() res: Response,
  ): Promise<void> {
    await this.policy.authorize(user, 'export', await this.runs.notebookOfRun(id));
    send(res, await this.exportsService.runTable(id, index, q.format));
  }

  @Get('uploads/:id/export')
  @ApiProduces('text/csv', 'application/json')
  @ApiOperation({ summary: 'An uploaded table or tuple file as CSV or JSON' })
  async uploadTable(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Query() q: TableFormatDto,
    @Res() res: Response,
  ): Promise<void> {
    await this.policy.authorize(user, 'export', await this.uploads.notebookOf(id));
    send(res, await this.exportsService.uploadTable(id, q.format));
  }
}
