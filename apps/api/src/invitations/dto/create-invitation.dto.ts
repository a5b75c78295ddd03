import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsEmail, IsIn, IsOptional, IsString, MaxLength } from 'class-validator';
import { INVITABLE_ROLES, type CreateInvitationBody, type InvitableRole } from '@cribra/contracts';

export class CreateInvitationDto implements CreateInvitationBody {
  @ApiProperty({ example: 'colleague@example.org' })
  @IsEmail({}, { message: 'email must be an e-mail address' })
  @MaxLength(320)
  email!: string;

  @ApiProperty({ enum: INVITABLE_ROLES })
  @IsIn(INVITABLE_ROLES as InvitableRole[], { message: 'role must be editor, reviewer or viewer' })
  role!: InvitableRole;

  @ApiPropertyOptional({ maxLength: 1000 })
  @IsOptional()
  @IsString()
  @MaxLength(1000, { message: 'message must be at most 1000 characters' })
  message?: string;
}
