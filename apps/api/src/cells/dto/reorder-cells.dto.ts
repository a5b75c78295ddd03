import { ApiProperty } from '@nestjs/swagger';
import { ArrayMaxSize, IsArray, IsInt, IsUUID, Min } from 'class-validator';
import type { ReorderCellsBody } from '@cribra/contracts';

export class ReorderCellsDto implements ReorderCellsBody {
  @ApiProperty({ description: 'The notebook revision the reorder started from' })
  @IsInt({ message: 'revision must be an integer' })
  @Min(1)
  revision!: number;

  @ApiProperty({ type: [String], description: 'Every cell id of the notebook, once, in the new order' })
  @IsArray()
  @ArrayMaxSize(2000)
  @IsUUID('all', { each: true, message: 'cellIds must hold cell ids' })
  cellIds!: string[];
}
