import { ApiProperty } from '@nestjs/swagger';
import { IsIn } from 'class-validator';
import type { RecordExportFormat } from '@cribra/contracts';

export const RECORD_EXPORT_FORMATS: readonly RecordExportFormat[] = ['json', 'markdown', 'latex', 'sift'];

export class RecordExportDto {
  @ApiProperty({ enum: RECORD_EXPORT_FORMATS })
  @IsIn(RECORD_EXPORT_FORMATS, { message: 'format must be json, markdown, latex or sift' })
  format!: RecordExportFormat;
}
