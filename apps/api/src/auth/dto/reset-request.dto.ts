import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsEmail, MaxLength } from 'class-validator';
import type { ResetRequestBody } from '@cribra/contracts';

export class ResetRequestDto implements ResetRequestBody {
  @ApiProperty({})
  @Transform(({ value }) => (typeof value === 'string' ? value.trim() : value))
  @IsEmail({}, { message: 'email must be a valid e-mail address' })
  @MaxLength(320)
  email!: string;
}
