import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsEmail, IsNotEmpty, IsString, MaxLength } from 'class-validator';
import type { SignInBody } from '@cribra/contracts';

export class SignInDto implements SignInBody {
  @ApiProperty({ example: 'ilse.marenko@northvale.example' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim() : value))
  @IsEmail({}, { message: 'email must be a valid e-mail address' })
  @MaxLength(320)
  email!: string;

  @ApiProperty({})
  @IsString()
  @IsNotEmpty({ message: 'password must not be empty' })
  @MaxLength(200)
  password!: string;
}
