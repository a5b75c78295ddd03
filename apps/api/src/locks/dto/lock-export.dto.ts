import { ApiProperty } from '@nestjs/swagger';
import { IsIn } from 'class-validator';
import type { LockExportFormat } from '@cribra/contracts';

export class LockExportDto {
  @ApiProperty({ enum: ['json', 'markdown'] })
  @IsIn(['json', 'markdown'], { message: 'format must be json or markdown' })
  format!: LockExportFormat;
}
