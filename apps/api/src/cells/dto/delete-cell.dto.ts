import { ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsInt, IsOptional, Min } from 'class-validator';

export class DeleteCellDto {
  @ApiPropertyOptional({ description: 'When given, the delete applies only at this cell revision (else 409)' })
  @IsOptional()
  @Type(() => Number)
  @IsInt({ message: 'revision must be an integer' })
  @Min(1)
  revision?: number;
}
