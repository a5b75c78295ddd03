import { ApiProperty } from '@nestjs/swagger';
import { IsNotEmpty, IsString, MaxLength, MinLength } from 'class-validator';
import { MIN_PASSWORD_LENGTH, type ChangePasswordBody } from '@cribra/contracts';

export class ChangePasswordDto implements ChangePasswordBody {
  @ApiProperty({})
  @IsString()
  @IsNotEmpty({ message: 'currentPassword must not be empty' })
  @MaxLength(200)
  currentPassword!: string;

  @ApiProperty({ minLength: MIN_PASSWORD_LENGTH })
  @IsString()
  @MinLength(MIN_PASSWORD_LENGTH, { message: `newPassword must be at least ${MIN_PASSWORD_LENGTH} characters` })
  @MaxLength(200)
  newPassword!: string;
}
