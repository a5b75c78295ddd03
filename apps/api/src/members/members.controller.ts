import { Body, Controller, Delete, Get, HttpCode, Param, ParseUUIDPipe, Patch, Post, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { MemberView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import type { UserEntity } from '../users/user.entity';
import { AddMemberDto } from './dto/add-member.dto';
import { UpdateMemberDto } from './dto/update-member.dto';
import { MembersService } from './members.service';
import { NotebookPolicyService } from './notebook-policy.service';

@ApiTags('members')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller('notebooks/:id/members')
export class MembersController {
  constructor(
    private readonly members: MembersService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Get()
  @ApiOperation({ summary: 'Members of a notebook with their roles' })
  async list(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<MemberView[]> {
    await this.policy.authorize(user, 'members.read', id);
    return this.members.list(id);
  }

  @Post()
  @ApiOperation({ summary: 'Add an existing user as editor, reviewer or viewer' })
  async add(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: AddMemberDto,
  ): Promise<MemberView> {
    await this.policy.authorize(user, 'members.manage', id);
    return this.members.add(user.id, id, body.email, body.role);
  }

  @Patch(':userId')
  @ApiOperation({ summary: "Change a member's role" })
  async update(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('userId', ParseUUIDPipe) userId: string,
    @Body() body: UpdateMemberDto,
  ): Promise<MemberView> {
    await this.policy.authorize(user, 'members.manage', id);
    return this.members.changeRole(user.id, id, userId, body.role);
  }

  @Delete(':userId')
  @HttpCode(204)
  @ApiOperation({ summary: 'Remove a member' })
  async remove(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Param('userId', ParseUUIDPipe) userId: string,
  ): Promise<void> {
    await this.policy.authorize(user, 'members.manage', id);
    await this.members.remove(user.id, id, userId);
  }
}
