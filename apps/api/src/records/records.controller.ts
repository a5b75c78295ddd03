import { Controller, Get, Param, Query, Res } from '@nestjs/common';
import { ApiOperation, ApiProduces, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { PublishedRecordView } from '@cribra/contracts';
import { RecordExportDto } from './dto/record-export.dto';
import { RecordsService, type RecordFile } from './records.service';

function send(res: Response, file: RecordFile): void {
  res.setHeader('Content-Type', file.mediaType);
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName.replace(/["\\\r\n]/g, '_')}"`);
  res.send(file.body);
}

/**
 * Published records, readable by anyone without signing in. GET only: nothing here changes state,
 * so no guard and no CSRF token; an id that names no published record gets the one 404 body.
 */
@ApiTags('records')
@Controller('records')
export class RecordsController {
  constructor(private readonly records: RecordsService) {}

  @Get(':id')
  @ApiOperation({ summary: 'A published record (public)' })
  read(@Param('id') id: string): Promise<PublishedRecordView> {
    return this.records.read(id);
  }

  @Get(':id/export')
  @ApiProduces('application/json', 'text/markdown', 'application/x-latex', 'text/plain')
  @ApiOperation({ summary: 'A published record as JSON (the lock record itself), Markdown, LaTeX or a .sift notebook file (public)' })
  async export(@Param('id') id: string, @Query() q: RecordExportDto, @Res() res: Response): Promise<void> {
    send(res, await this.records.export(id, q.format));
  }

  @Get(':id/uploads/:name')
  @ApiOperation({ summary: 'An upload of a published record, as it was read (public)' })
  async upload(@Param('id') id: string, @Param('name') name: string, @Res() res: Response): Promise<void> {
    send(res, await this.records.upload(id, name));
  }
}
