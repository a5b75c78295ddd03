// Paging query shared by every list route: page from 1 to PAGE_MAX, pageSize from 1 to 100.
import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, IsOptional, Max, Min } from 'class-validator';

/**
 * Largest page number accepted: the row offset (page − 1) · pageSize must stay a safe integer
 * for PostgreSQL's OFFSET (page=1e20 used to answer 500 "bigint out of range"); no list is this long.
 */
export const PAGE_MAX = 1_000_000;

export class PageDto {
  @ApiPropertyOptional({ default: 1, maximum: PAGE_MAX })
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(PAGE_MAX)
  page?: number;

  @ApiPropertyOptional({ default: 20 })
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(100)
  pageSize?: number;
}
