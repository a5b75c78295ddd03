import { ApiProperty } from '@nestjs/swagger';
import { IsIn } from 'class-validator';
import type { TableExportFormat } from '@cribra/contracts';

export class TableFormatDto {
  @ApiProperty({ enum: ['csv', 'json'] })
  @IsIn(['csv', 'json'], { message: 'format must be csv or json' })
  format!: TableExportFormat;
}
