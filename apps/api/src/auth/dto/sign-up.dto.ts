import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsEmail, IsNotEmpty, IsOptional, IsString, MaxLength, MinLength } from 'class-validator';
import { MIN_PASSWORD_LENGTH, type SignUpBody } from '@cribra/contracts';

export class SignUpDto implements SignUpBody {
  @ApiProperty({ example: 'someone@example.org' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim() : value))
  @IsEmail({}, { message: 'email must be a valid e-mail address' })
  @MaxLength(320)
  email!: string;

  @ApiProperty({ minLength: MIN_PASSWORD_LENGTH })
  @IsString()
  @MinLength(MIN_PASSWORD_LENGTH, { message: `password must be at least ${MIN_PASSWORD_LENGTH} characters` })
  @MaxLength(200)
  password!: string;

  @ApiProperty({ example: 'Ada Example' })
  @IsString()
  @IsNotEmpty({ message: 'displayName must not be empty' })
  @MaxLength(120)
  displayName!: string;

  @ApiProperty({ required: false, description: 'token from an invitation e-mail (required when SIGNUP_MODE=invite)' })
  @IsOptional()
  @IsString()
  @MaxLength(200)
  invitationToken?: string;
}
