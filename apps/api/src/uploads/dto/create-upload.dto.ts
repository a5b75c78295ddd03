import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, Matches } from 'class-validator';
import { UPLOAD_NAME_PATTERN } from '@cribra/contracts';

/** Multipart fields besides `file`. */
export class CreateUploadDto {
  @ApiPropertyOptional({ description: 'Name a Sift cell reads it by; default: the file name without extension' })
  @IsOptional()
  @IsString()
  @Matches(new RegExp(UPLOAD_NAME_PATTERN), { message: 'name must start with a letter and use letters, digits, _ . - (at most 64)' })
  name?: string;
}
