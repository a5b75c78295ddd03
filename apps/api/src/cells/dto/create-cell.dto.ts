import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsInt, IsOptional, IsString, Matches, MaxLength, Min } from 'class-validator';
import { CELL_KINDS, CELL_SOURCE_MAX, CELL_TITLE_MAX, type CellKind, type CreateCellBody } from '@cribra/contracts';

export class CreateCellDto implements CreateCellBody {
  @ApiProperty({ enum: CELL_KINDS })
  @IsIn(CELL_KINDS as CellKind[], { message: 'kind must be query, claim or note' })
  kind!: CellKind;

  @ApiProperty({ maxLength: CELL_SOURCE_MAX })
  @IsString()
  @MaxLength(CELL_SOURCE_MAX)
  source!: string;

  @ApiPropertyOptional({ description: 'Insert before the cell now at this position; default: append' })
  @IsOptional()
  @IsInt()
  @Min(0)
  position?: number;

  @ApiPropertyOptional({ maxLength: CELL_TITLE_MAX, nullable: true, description: 'One line; null or blank: no title' })
  @IsOptional()
  @IsString()
  @MaxLength(CELL_TITLE_MAX, { message: `title must be at most ${CELL_TITLE_MAX} characters` })
  @Matches(/^[^\r\n]*$/, { message: 'title must be one line' })
  title?: string | null;
}
