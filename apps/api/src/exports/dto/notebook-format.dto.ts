import { ApiProperty } from '@nestjs/swagger';
import { IsIn } from 'class-validator';
import type { NotebookExportFormat } from '@cribra/contracts';

export class NotebookFormatDto {
  @ApiProperty({ enum: ['markdown', 'latex', 'sift'] })
  @IsIn(['markdown', 'latex', 'sift'], { message: 'format must be markdown, latex or sift' })
  format!: NotebookExportFormat;
}
