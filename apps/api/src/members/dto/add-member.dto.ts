import { ApiProperty } from '@nestjs/swagger';
import { IsEmail, IsIn } from 'class-validator';
import type { AddMemberBody } from '@cribra/contracts';

export class AddMemberDto implements AddMemberBody {
  @ApiProperty({ example: 'colleague@example.org' })
  @IsEmail({}, { message: 'email must be an e-mail address' })
  email!: string;

  @ApiProperty({ enum: ['editor', 'reviewer', 'viewer'] })
  @IsIn(['editor', 'reviewer', 'viewer'], { message: 'role must be editor, reviewer or viewer' })
  role!: 'editor' | 'reviewer' | 'viewer';
}
