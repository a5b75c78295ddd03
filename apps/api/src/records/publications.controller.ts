import { Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { PublicationView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import { NotebookPolicyService } from '../members/notebook-policy.service';
import type { UserEntity } from '../users/user.entity';
import { WithdrawRecordDto } from './dto/withdraw-record.dto';
import { RecordsService } from './records.service';

/** Publishing a locked notebook's record, and withdrawing it: signed in, CSRF-checked like every POST. */
@ApiTags('records')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller('notebooks/:id/publication')
export class PublicationsController {
  constructor(
    private readonly records: RecordsService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Post()
  @ApiOperation({ summary: 'Publish the lock record at a permanent public address (owner, admin; the notebook is locked)' })
  async publish(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<PublicationView> {
    await this.policy.authorize(user, 'record.publish', id);
    return this.records.publish(user, id);
  }

  @Get()
  @ApiOperation({ summary: 'The publication of this notebook\'s record (404 when not published)' })
  async get(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<PublicationView> {
    await this.policy.authorize(user, 'record.read', id);
    return this.records.publication(id);
  }

  @Post('withdrawal')
  @HttpCode(200)
  @ApiOperation({ summary: 'Withdraw the published record with a reason (it stays readable under a banner)' })
  async withdraw(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string, @Body() body: WithdrawRecordDto): Promise<PublicationView> {
    await this.policy.authorize(user, 'record.publish', id);
    return this.records.withdraw(user, id, body.reason);
  }
}
