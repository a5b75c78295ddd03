import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsString, Matches, MaxLength } from 'class-validator';
import { NOTEBOOK_TITLE_MAX, type DuplicateNotebookBody } from '@cribra/contracts';

export class DuplicateNotebookDto implements DuplicateNotebookBody {
  @ApiPropertyOptional({ maxLength: NOTEBOOK_TITLE_MAX })
  @IsOptional()
  @IsString()
  @Matches(/\S/, { message: 'title must not be empty' })
  @MaxLength(NOTEBOOK_TITLE_MAX, { message: `title must be at most ${NOTEBOOK_TITLE_MAX} characters` })
  title?: string;
}
