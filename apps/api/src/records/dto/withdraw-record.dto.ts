import { ApiProperty } from '@nestjs/swagger';
import { IsString, Matches, MaxLength } from 'class-validator';
import { WITHDRAW_REASON_MAX, type WithdrawRecordBody } from '@cribra/contracts';

export class WithdrawRecordDto implements WithdrawRecordBody {
  @ApiProperty({ maxLength: WITHDRAW_REASON_MAX, description: 'Shown on the record under the "withdrawn" banner' })
  @IsString()
  @Matches(/\S/, { message: 'reason must not be empty' })
  @MaxLength(WITHDRAW_REASON_MAX, { message: `reason must be at most ${WITHDRAW_REASON_MAX} characters` })
  reason!: string;
}
