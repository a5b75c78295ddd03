import { Body, Controller, Delete, Get, HttpCode, Param, ParseUUIDPipe, Put, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { PresenceView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import { NotebookPolicyService, type Actor } from '../members/notebook-policy.service';
import { UpdatePresenceDto } from './dto/update-presence.dto';
import { PresenceService } from './presence.service';

@ApiTags('presence')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller('notebooks/:id/presence')
export class PresenceController {
  constructor(
    private readonly presence: PresenceService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Get()
  @ApiOperation({ summary: 'Who has the notebook open now, and which cell each is editing' })
  async list(@CurrentUser() user: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<PresenceView[]> {
    await this.policy.authorize(user, 'notebook.read', id);
    return this.presence.list(id);
  }

  @Put()
  @ApiOperation({ summary: "A tab's heartbeat (every 10 s and on focus changes); answers with who is here" })
  async beat(@CurrentUser() user: Actor, @Param('id', ParseUUIDPipe) id: string, @Body() body: UpdatePresenceDto): Promise<PresenceView[]> {
    await this.policy.authorize(user, 'notebook.read', id);
    return this.presence.beat(user.id, id, body.tabId, body.cellId ?? null);
  }

  @Delete(':tabId')
  @HttpCode(204)
  @ApiOperation({ summary: 'The tab closed or left the notebook' })
  async leave(@CurrentUser() user: Actor, @Param('id', ParseUUIDPipe) id: string, @Param('tabId') tabId: string): Promise<void> {
    await this.presence.leave(user.id, id, tabId);
  }
}
