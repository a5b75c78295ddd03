import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Param,
  ParseUUIDPipe,
  Post,
  UploadedFile,
  UseGuards,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiBody, ApiConsumes, ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import { UPLOAD_MAX_BYTES, type UploadContent, type UploadView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import type { UserEntity } from '../users/user.entity';
import { NotebookPolicyService } from '../members/notebook-policy.service';
import { CreateUploadDto } from './dto/create-upload.dto';
import { UploadsService, type IncomingFile } from './uploads.service';

@ApiTags('uploads')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller()
export class UploadsController {
  constructor(
    private readonly uploads: UploadsService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Get('notebooks/:id/uploads')
  @ApiOperation({ summary: 'Uploads of a notebook' })
  async list(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<UploadView[]> {
    await this.policy.authorize(user, 'notebook.read', id);
    return this.uploads.list(id);
  }

  @Post('notebooks/:id/uploads')
  @ApiOperation({ summary: 'Upload a tuple file (.txt: one integer per line, # comments) or a CSV table' })
  @ApiConsumes('multipart/form-data')
  @ApiBody({
    schema: {
      type: 'object',
      required: ['file'],
      properties: { file: { type: 'string', format: 'binary' }, name: { type: 'string' } },
    },
  })
  // Memory storage; one byte over the limit is enough to know the file is too large (413).
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: UPLOAD_MAX_BYTES, files: 1, fields: 4 } }))
  async create(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @UploadedFile() file: IncomingFile | undefined,
    @Body() body: CreateUploadDto,
  ): Promise<UploadView> {
    await this.policy.authorize(user, 'uploads.create', id);
    return this.uploads.create(user, id, file, body.name);
  }

  @Get('uploads/:id')
  @ApiOperation({ summary: 'One upload (metadata)' })
  async get(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<UploadView> {
    await this.policy.authorize(user, 'notebook.read', await this.uploads.notebookOf(id));
    return this.uploads.get(id);
  }

  @Get('uploads/:id/content')
  @ApiOperation({ summary: 'The parsed content of an upload' })
  async content(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<UploadContent> {
    await this.policy.authorize(user, 'notebook.read', await this.uploads.notebookOf(id));
    return this.uploads.content(id);
  }

  @Delete('uploads/:id')
  @HttpCode(204)
  @ApiOperation({ summary: 'Delete an upload' })
  async remove(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<void> {
    await this.policy.authorize(user, 'uploads.delete', await this.uploads.notebookOf(id));
    await this.uploads.remove(user, id);
  }
}
