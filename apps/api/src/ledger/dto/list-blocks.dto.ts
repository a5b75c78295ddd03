import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsNumberString, IsOptional, MaxLength } from 'class-validator';
import { PageDto } from '../../common/dto/page.dto';

export class ListBlocksDto extends PageDto {
  @ApiPropertyOptional({ description: 'Only blocks ending after this number' })
  @IsOptional()
  @IsNumberString({ no_symbols: true }, { message: 'from must be a whole number written in decimal' })
  @MaxLength(15)
  from?: string;

  @ApiPropertyOptional({ description: 'Only blocks starting before this number' })
  @IsOptional()
  @IsNumberString({ no_symbols: true }, { message: 'to must be a whole number written in decimal' })
  @MaxLength(15)
  to?: string;
}
