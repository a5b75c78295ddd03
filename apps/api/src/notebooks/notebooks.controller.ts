import { Body, Controller, Delete, Get, HttpCode, Param, ParseUUIDPipe, Patch, Post, Query, UploadedFile, UseGuards, UseInterceptors } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBody, ApiConsumes, ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import { NOTEBOOK_INLINE_OUTPUT_BYTES, UPLOAD_MAX_BYTES, type NotebookSummary, type NotebookView, type Page } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import type { UserEntity } from '../users/user.entity';
import { NotebookPolicyService } from '../members/notebook-policy.service';
import { CreateNotebookDto } from './dto/create-notebook.dto';
import { ListNotebooksDto } from './dto/list-notebooks.dto';
import { UpdateNotebookDto } from './dto/update-notebook.dto';
import { NotebooksService } from './notebooks.service';
import type { IncomingFile } from '../uploads/uploads.service';

@ApiTags('notebooks')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller('notebooks')
export class NotebooksController {
  constructor(
    private readonly notebooks: NotebooksService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Get()
  @ApiOperation({ summary: 'My notebooks: search (q), filter by tag, status and my role' })
  list(@CurrentUser() user: UserEntity, @Query() query: ListNotebooksDto): Promise<Page<NotebookSummary>> {
    return this.notebooks.list(user, query);
  }

  @Post()
  @ApiOperation({ summary: 'Create a notebook (you become its owner)' })
  create(@CurrentUser() user: UserEntity, @Body() body: CreateNotebookDto): Promise<NotebookView> {
    return this.notebooks.create(user, body);
  }

  @Post('import')
  @ApiOperation({ summary: 'New notebook from a .sift notebook file (400 with the lines of its problems; nothing stored then)' })
  @ApiConsumes('multipart/form-data')
  @ApiBody({ schema: { type: 'object', required: ['file'], properties: { file: { type: 'string', format: 'binary' } } } })
  // The limits of uploads: memory storage, one file of at most UPLOAD_MAX_BYTES (413 above).
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: UPLOAD_MAX_BYTES, files: 1, fields: 2 } }))
  importFile(@CurrentUser() user: UserEntity, @UploadedFile() file: IncomingFile | undefined): Promise<NotebookView> {
    return this.notebooks.importFile(user, file);
  }

  @Get(':id')
  @ApiOperation({
    summary: 'A notebook with its cells (each with its latest run) and members; outputs stored larger than 64 KiB are left out (outputsOmitted) and read with GET /runs/:id',
  })
  async get(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<NotebookView> {
    await this.policy.authorize(user, 'notebook.read', id);
    return this.notebooks.view(user, id, { inlineOutputsUpTo: NOTEBOOK_INLINE_OUTPUT_BYTES });
  }

  @Patch(':id')
  @ApiOperation({ summary: 'Edit title, summary, tags or required sign-offs (409 on a stale revision)' })
  async update(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: UpdateNotebookDto,
  ): Promise<NotebookView> {
    await this.policy.authorize(user, 'notebook.update', id);
    return this.notebooks.update(user, id, body);
  }

  @Delete(':id')
  @HttpCode(204)
  @ApiOperation({ summary: 'Delete a notebook with its cells, runs and uploads (owner)' })
  async remove(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<void> {
    await this.policy.authorize(user, 'notebook.delete', id);
    await this.notebooks.remove(user, id);
  }
}
