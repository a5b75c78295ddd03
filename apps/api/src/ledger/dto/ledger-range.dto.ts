import { ApiProperty } from '@nestjs/swagger';
import { IsNumberString, MaxLength } from 'class-validator';
import type { LedgerComputationBody } from '@cribra/contracts';

export class LedgerRangeDto implements LedgerComputationBody {
  @ApiProperty({ example: '0', description: 'Decimal, inclusive' })
  @IsNumberString({ no_symbols: true }, { message: 'from must be a whole number written in decimal' })
  @MaxLength(15)
  from!: string;

  @ApiProperty({ example: '100000000', description: 'Decimal, exclusive' })
  @IsNumberString({ no_symbols: true }, { message: 'to must be a whole number written in decimal' })
  @MaxLength(15)
  to!: string;
}
