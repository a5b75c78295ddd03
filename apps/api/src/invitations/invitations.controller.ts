import { Body, Controller, Delete, Get, HttpCode, Param, ParseUUIDPipe, Post, Query, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { AcceptInvitationResponse, InvitationPreview, InvitationView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import { NotebookPolicyService } from '../members/notebook-policy.service';
import type { UserEntity } from '../users/user.entity';
import { AcceptInvitationDto } from './dto/accept-invitation.dto';
import { CreateInvitationDto } from './dto/create-invitation.dto';
import { ListInvitationsDto } from './dto/list-invitations.dto';
import { InvitationsService } from './invitations.service';

@ApiTags('invitations')
@ApiCookieAuth()
@Controller()
export class InvitationsController {
  constructor(
    private readonly invitations: InvitationsService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Get('notebooks/:id/invitations')
  @UseGuards(SignedInGuard)
  @ApiOperation({ summary: 'Invitations of a notebook (pending by default) with their delivery state' })
  async list(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Query() query: ListInvitationsDto,
  ): Promise<InvitationView[]> {
    await this.policy.authorize(user, 'invitations.read', id);
    return this.invitations.list(id, query.status);
  }

  @Post('notebooks/:id/invitations')
  @UseGuards(SignedInGuard)
  @ApiOperation({ summary: 'Invite an e-mail address as editor, reviewer or viewer (mails a single-use link)' })
  async create(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: CreateInvitationDto,
  ): Promise<InvitationView> {
    await this.policy.authorize(user, 'invitations.manage', id);
    return this.invitations.create(user, id, body);
  }

  @Post('invitations/:id/resend')
  @HttpCode(200)
  @UseGuards(SignedInGuard)
  @ApiOperation({ summary: 'Send a new link (the previous one stops working), valid 7 more days' })
  async resend(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<InvitationView> {
    await this.policy.authorize(user, 'invitations.manage', await this.invitations.notebookOf(id));
    return this.invitations.resend(user, id);
  }

  @Delete('invitations/:id')
  @HttpCode(204)
  @UseGuards(SignedInGuard)
  @ApiOperation({ summary: 'Revoke an invitation (its link stops working)' })
  async revoke(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<void> {
    await this.policy.authorize(user, 'invitations.manage', await this.invitations.notebookOf(id));
    await this.invitations.revoke(user, id);
  }

  @Get('invitations/token/:token')
  @ApiOperation({ summary: 'What an invitation link offers (no sign-in needed; 404 unknown, 410 used/revoked/expired)' })
  preview(@Param('token') token: string): Promise<InvitationPreview> {
    return this.invitations.preview(token);
  }

  @Post('invitations/accept')
  @HttpCode(200)
  @UseGuards(SignedInGuard)
  @ApiOperation({ summary: 'Join the notebook with the invited role (the account must use the invited address)' })
  accept(@CurrentUser() user: UserEntity, @Body() body: AcceptInvitationDto): Promise<AcceptInvitationResponse> {
    return this.invitations.acceptAs(user, body.token);
  }
}
