import { ApiProperty } from '@nestjs/swagger';
import { IsNotEmpty, IsString, MaxLength } from 'class-validator';
import type { AcceptInvitationBody } from '@cribra/contracts';

export class AcceptInvitationDto implements AcceptInvitationBody {
  @ApiProperty({ description: 'The token from the e-mailed link' })
  @IsString()
  @IsNotEmpty({ message: 'token must not be empty' })
  @MaxLength(200)
  token!: string;
}
