import { ApiProperty } from '@nestjs/swagger';
import { IsIn } from 'class-validator';
import type { UpdateMemberBody } from '@cribra/contracts';

export class UpdateMemberDto implements UpdateMemberBody {
  @ApiProperty({ enum: ['editor', 'reviewer', 'viewer'] })
  @IsIn(['editor', 'reviewer', 'viewer'], { message: 'role must be editor, reviewer or viewer' })
  role!: 'editor' | 'reviewer' | 'viewer';
}
