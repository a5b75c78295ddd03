import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, MaxLength } from 'class-validator';
import type { RequestReviewBody } from '@cribra/contracts';

export class RequestReviewDto implements RequestReviewBody {
  @ApiPropertyOptional({ maxLength: 2000 })
  @IsOptional()
  @IsString()
  @MaxLength(2000, { message: 'message must be at most 2000 characters' })
  message?: string;
}
