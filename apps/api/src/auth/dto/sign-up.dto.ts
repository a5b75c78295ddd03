import { Transform } from 'class-transformer';
import { IsEmail, IsNotEmpty, IsOptional, IsString, MaxLength, MinLength } from 'class-validator';
import { MIN_PASSWORD_LENGTH, type SignUpBody } from '@cribra/contracts';

export class SignUpDto implements SignUpBody {
  @Transform(({ value }) => (typeof value === 'string' ? value.trim() : value))
  @IsEmail({}, { message: 'email must be a valid e-mail address' })
  @MaxLength(320)
  email!: string;

  @IsString()
  @MinLength(MIN_PASSWORD_LENGTH, { message: `password must be at least ${MIN_PASSWORD_LENGTH} characters` })
  @MaxLength(200)
  password!: string;

  @IsString()
  @IsNotEmpty({ message: 'displayName must not be empty' })
  @MaxLength(120)
  displayName!: string;

  @IsOptional()
  @IsString()
  @MaxLength(200)
  invitationToken?: string;
}
