import { ApiProperty, PartialType } from '@nestjs/swagger';
import { IsInt, Min } from 'class-validator';
import type { UpdateNotebookBody } from '@cribra/contracts';
import { CreateNotebookDto } from './create-notebook.dto';

export class UpdateNotebookDto extends PartialType(CreateNotebookDto) implements UpdateNotebookBody {
  @ApiProperty({ description: 'The notebook revision the edit started from' })
  @IsInt({ message: 'revision must be an integer' })
  @Min(1)
  revision!: number;
}
