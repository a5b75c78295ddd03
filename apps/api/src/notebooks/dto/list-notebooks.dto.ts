import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional, IsString, MaxLength } from 'class-validator';
import { MEMBER_ROLES, NOTEBOOK_STATUSES, type MemberRole, type NotebookListQuery, type NotebookStatus } from '@cribra/contracts';
import { PageDto } from '../../common/dto/page.dto';

export class ListNotebooksDto extends PageDto implements NotebookListQuery {
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
}
