import { Body, Controller, Get, Param, ParseUUIDPipe, Patch, UseGuards } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { UserView } from '@cribra/contracts';
import { AdminGuard } from '../common/guards/admin.guard';
import { toUserView } from '../users/user-view';
import { UsersService } from '../users/users.service';
import { UpdateRoleDto } from './dto/update-role.dto';

@ApiTags('admin')
@Controller('admin/users')
@UseGuards(AdminGuard)
export class AdminController {
  constructor(private readonly users: UsersService) {}

  @Get()
  async list(): Promise<UserView[]> {
    return (await this.users.list()).map(toUserView);
  }

  @Patch(':id')
  async setRole(@Param('id', new ParseUUIDPipe()) id: string, @Body() dto: UpdateRoleDto): Promise<UserView> {
    return toUserView(await this.users.setRole(id, dto.siteRole));
  }
}
