import { ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional } from 'class-validator';

export class ListInvitationsDto {
  @ApiPropertyOptional({ enum: ['pending', 'all'], default: 'pending' })
  @IsOptional()
  @IsIn(['pending', 'all'], { message: 'status must be pending or all' })
  status?: 'pending' | 'all';
}
