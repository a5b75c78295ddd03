import { ApiProperty } from '@nestjs/swagger';
import { IsIn } from 'class-validator';
import type { SiteRole } from '@cribra/contracts';

export class UpdateRoleDto {
  @ApiProperty({ enum: ['admin', 'member'] })
  @IsIn(['admin', 'member'], { message: 'siteRole must be "admin" or "member"' })
  siteRole!: SiteRole;
}
