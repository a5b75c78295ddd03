import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Type } from 'class-transformer';
import { IsDefined, IsIn, IsInt, IsOptional, IsUUID, Max, Min, ValidateIf, ValidateNested } from 'class-validator';
import type { CommentAnchor, CreateThreadBody } from '@cribra/contracts';
import { CommentBodyDto } from './comment-body.dto';

export class AnchorDto {
  @ApiProperty({ enum: ['notebook', 'cell', 'output'] })
  @IsIn(['notebook', 'cell', 'output'], { message: 'anchor.kind must be notebook, cell or output' })
  kind!: CommentAnchor['kind'];

  @ApiPropertyOptional({ description: "For 'cell' and 'output' anchors" })
  @ValidateIf((a: AnchorDto) => a.kind !== 'notebook')
  @IsUUID('all', { message: 'anchor.cellId must be a cell id' })
  cellId?: string;

  @ApiPropertyOptional({ description: "For 'output' anchors: the run that showed the output" })
  @ValidateIf((a: AnchorDto) => a.kind === 'output')
  @IsUUID('all', { message: 'anchor.runId must be a run id' })
  runId?: string;

  @ApiPropertyOptional({ description: "For 'output' anchors: index in the run's outputs" })
  @ValidateIf((a: AnchorDto) => a.kind === 'output')
  @IsInt({ message: 'anchor.outputIndex must be an integer' })
  @Min(0)
  @Max(10_000)
  outputIndex?: number;
}

export class CreateThreadDto extends CommentBodyDto implements CreateThreadBody {
  @ApiProperty({ type: AnchorDto })
  @IsDefined({ message: 'anchor is required' })
  @ValidateNested()
  @Type(() => AnchorDto)
  anchor!: CommentAnchor;
}

export class ListThreadsDto {
  @ApiPropertyOptional({ enum: ['open', 'resolved'] })
  @IsOptional()
  @IsIn(['open', 'resolved'], { message: 'status must be open or resolved' })
  status?: 'open' | 'resolved';

  @ApiPropertyOptional({ description: 'Only threads on this cell or its outputs' })
  @IsOptional()
  @IsUUID('all', { message: 'cellId must be a cell id' })
  cellId?: string;
}
