import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { Transform } from 'class-transformer';
import { ArrayMaxSize, IsArray, IsInt, IsOptional, IsString, Length, Matches, Max, MaxLength, Min } from 'class-validator';
import {
  NOTEBOOK_SUMMARY_MAX,
  NOTEBOOK_TAG_MAX,
  NOTEBOOK_TAGS_MAX,
  NOTEBOOK_TITLE_MAX,
  type CreateNotebookBody,
} from '@cribra/contracts';

/** Tags are stored trimmed and lower-cased, without duplicates. */
export const normalizeTags = ({ value }: { value: unknown }): unknown =>
  Array.isArray(value)
    ? [...new Set(value.map((t) => (typeof t === 'string' ? t.trim().toLowerCase() : t)))]
    : value;

export const TAG_PATTERN = /^[a-z0-9][a-z0-9#+._-]*$/;

export class CreateNotebookDto implements CreateNotebookBody {
  @ApiProperty({ maxLength: NOTEBOOK_TITLE_MAX })
  @IsString()
  @Transform(({ value }) => (typeof value === 'string' ? value.trim() : value))
  @Length(1, NOTEBOOK_TITLE_MAX, { message: `title must be 1 to ${NOTEBOOK_TITLE_MAX} characters` })
  title!: string;

  @ApiPropertyOptional({ maxLength: NOTEBOOK_SUMMARY_MAX })
  @IsOptional()
  @IsString()
  @MaxLength(NOTEBOOK_SUMMARY_MAX)
  summary?: string;

  @ApiPropertyOptional({ type: [String], example: ['wheel', 'gap-patterns'] })
  @IsOptional()
  @IsArray()
  @ArrayMaxSize(NOTEBOOK_TAGS_MAX)
  @Transform(normalizeTags)
  @IsString({ each: true })
  @Length(1, NOTEBOOK_TAG_MAX, { each: true, message: `each tag must be 1 to ${NOTEBOOK_TAG_MAX} characters` })
  @Matches(TAG_PATTERN, { each: true, message: 'tags use letters, digits and # + . _ -' })
  tags?: string[];

  @ApiPropertyOptional({ minimum: 1, maximum: 20, default: 1 })
  @IsOptional()
  @IsInt()
  @Min(1)
  @Max(20)
  requiredSignoffs?: number;
}
