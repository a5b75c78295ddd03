import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsIn, IsInt, IsOptional, IsString, Max, MaxLength, Min } from 'class-validator';
import { MEMBER_ROLES, NOTEBOOK_STATUSES, type MemberRole, type NotebookListQuery, type NotebookStatus } from '@cribra/contracts';

export class ListNotebooksDto implements NotebookListQuery {
  @ApiPropertyOptional({ description: 'Words searched in title, summary and tags' })
  @IsOptional()
  @IsString()
  @MaxLength(200)
  q?: string;

  @ApiPropertyOptional()
  @IsOptional()
  @IsString()
  @MaxLength(40)
  tag?: string;

  @ApiPropertyOptional({ enum: NOTEBOOK_STATUSES })
  @IsOptional()
  @IsIn(NOTEBOOK_STATUSES as NotebookStatus[], { message: 'status must be draft, in_review or locked' })
  status?: NotebookStatus;

  @ApiPropertyOptional({ enum: MEMBER_ROLES })
  @IsOptional()
  @IsIn(MEMBER_ROLES as MemberRole[], { message: 'role must be owner, editor, reviewer or viewer' })
  role?: MemberRole;

  @ApiPropertyOptional({ default: 1 })
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  page?: number;

  @ApiPropertyOptional({ default: 20 })
  @IsOptional()
  @Type(() => Number)
  @IsInt()
  @Min(1)
  @Max(100)
  pageSize?: number;
}
