import { ApiProperty } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { IsNotEmpty, IsString, MaxLength } from 'class-validator';
import type { UpdateProfileBody } from '@cribra/contracts';

export class UpdateProfileDto implements UpdateProfileBody {
  @ApiProperty({ example: 'Ada Example' })
  @Transform(({ value }) => (typeof value === 'string' ? value.trim() : value))
  @IsString()
  @IsNotEmpty({ message: 'displayName must not be empty' })
  @MaxLength(120)
  displayName!: string;
}
