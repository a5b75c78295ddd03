import { ApiProperty } from '@nestjs/swagger';
import { IsNotEmpty, IsString, MaxLength, MinLength } from 'class-validator';
import { MIN_PASSWORD_LENGTH, type ResetConfirmBody } from '@cribra/contracts';

export class ResetConfirmDto implements ResetConfirmBody {
  @ApiProperty({ description: 'the token from the reset link' })
  @IsString()
  @IsNotEmpty({ message: 'token must not be empty' })
  @MaxLength(200)
  token!: string;

  @ApiProperty({ minLength: MIN_PASSWORD_LENGTH })
  @IsString()
  @MinLength(MIN_PASSWORD_LENGTH, { message: `newPassword must be at least ${MIN_PASSWORD_LENGTH} characters` })
  @MaxLength(200)
  newPassword!: string;
}
