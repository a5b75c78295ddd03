import { IsIn } from 'class-validator';
import type { SiteRole } from '@cribra/contracts';

export class UpdateRoleDto {
  @IsIn(['admin', 'member'], { message: 'siteRole must be "admin" or "member"' })
  siteRole!: SiteRole;
}
