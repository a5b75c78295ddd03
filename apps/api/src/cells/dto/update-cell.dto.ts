import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsInt, IsOptional, IsString, Matches, MaxLength, Min } from 'class-validator';
import { CELL_KINDS, CELL_SOURCE_MAX, CELL_TITLE_MAX, type CellKind, type UpdateCellBody } from '@cribra/contracts';

export class UpdateCellDto implements UpdateCellBody {
  @ApiProperty({ description: 'The cell revision the edit started from' })
  @IsInt({ message: 'revision must be an integer' })
  @Min(1)
  revision!: number;

  @ApiPropertyOptional({ maxLength: CELL_SOURCE_MAX })
  @IsOptional()
  @IsString()
  @MaxLength(CELL_SOURCE_MAX)
  source?: string;

  @ApiPropertyOptional({ enum: CELL_KINDS })
  @IsOptional()
  @IsIn(CELL_KINDS as CellKind[], { message: 'kind must be query, claim or note' })
  kind?: CellKind;

  @ApiPropertyOptional({ maxLength: CELL_TITLE_MAX, nullable: true, description: 'One line; null or blank: no title' })
  @IsOptional()
  @IsString()
  @MaxLength(CELL_TITLE_MAX, { message: `title must be at most ${CELL_TITLE_MAX} characters` })
  @Matches(/^[^\r\n]*$/, { message: 'title must be one line' })
  title?: string | null;
}
