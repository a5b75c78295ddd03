import { ApiProperty } from '@nestjs/swagger';
import { IsIn } from 'class-validator';
import type { NotebookExportFormat } from '@cribra/contracts';

export class NotebookFormatDto {
  @ApiProperty({ enum: ['markdown', 'latex'] })
  @IsIn(['markdown', 'latex'], { message: 'format must be markdown or latex' })
  format!: NotebookExportFormat;
}
