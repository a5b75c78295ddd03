import { Controller, Get, Param, ParseUUIDPipe, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { AuditEventView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import type { UserEntity } from '../users/user.entity';
import { NotebookPolicyService } from '../members/notebook-policy.service';
import { AuditService } from './audit.service';

@ApiTags('audit')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller('notebooks/:id/audit')
export class AuditController {
  constructor(
    private readonly audit: AuditService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Get()
  @ApiOperation({ summary: 'Audit trail of a notebook (owner and admins)' })
  async list(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<AuditEventView[]> {
    await this.policy.authorize(user, 'audit.read', id);
    return this.audit.listForNotebook(id);
  }
}
