import { Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Patch, Post, Query, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { CommentThreadView, CommentView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import { NotebookPolicyService } from '../members/notebook-policy.service';
import type { UserEntity } from '../users/user.entity';
import { CommentsService } from './comments.service';
import { CommentBodyDto } from './dto/comment-body.dto';
import { CreateThreadDto, ListThreadsDto } from './dto/create-thread.dto';

@ApiTags('comments')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller()
export class CommentsController {
  constructor(
    private readonly comments: CommentsService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Get('notebooks/:id/threads')
  @ApiOperation({ summary: 'Comment threads of a notebook (filter by status or cell)' })
  async list(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Query() query: ListThreadsDto,
  ): Promise<CommentThreadView[]> {
    await this.policy.authorize(user, 'comments.read', id);
    return this.comments.list(id, query);
  }

  @Post('notebooks/:id/threads')
  @ApiOperation({ summary: 'Open a thread on the notebook, a cell or one output of a cell' })
  async create(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: CreateThreadDto,
  ): Promise<CommentThreadView> {
    await this.policy.authorize(user, 'comments.write', id);
    return this.comments.createThread(user, id, body);
  }

  @Post('threads/:id/comments')
  @ApiOperation({ summary: 'Reply in a thread' })
  async reply(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: CommentBodyDto,
  ): Promise<CommentView> {
    await this.policy.authorize(user, 'comments.write', await this.comments.notebookOfThread(id));
    return this.comments.reply(user, id, body);
  }

  @Patch('comments/:id')
  @ApiOperation({ summary: 'Edit your own comment' })
  async edit(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: CommentBodyDto,
  ): Promise<CommentView> {
    const info = await this.comments.commentInfo(id);
    await this.policy.authorize(user, 'comments.write', info.notebookId);
    this.policy.assertAuthor(user, info.authorId);
    return this.comments.edit(user, id, body);
  }

  @Post('threads/:id/resolve')
  @HttpCode(200)
  @ApiOperation({ summary: 'Mark a thread resolved' })
  async resolve(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<CommentThreadView> {
    await this.policy.authorize(user, 'comments.resolve', await this.comments.notebookOfThread(id));
    return this.comments.setStatus(user, id, 'resolved');
  }

  @Post('threads/:id/reopen')
  @HttpCode(200)
  @ApiOperation({ summary: 'Reopen a resolved thread' })
  async reopen(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<CommentThreadView> {
    await this.policy.authorize(user, 'comments.resolve', await this.comments.notebookOfThread(id));
    return this.comments.setStatus(user, id, 'open');
  }
}
