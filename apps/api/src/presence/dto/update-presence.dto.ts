import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsOptional, IsUUID, Matches } from 'class-validator';
import type { UpdatePresenceBody } from '@cribra/contracts';

export class UpdatePresenceDto implements UpdatePresenceBody {
  @ApiProperty({ description: 'A random id of the browser tab (letters, digits, - and _; 8 to 64)' })
  @Matches(/^[A-Za-z0-9_-]{8,64}$/, { message: 'tabId must be 8 to 64 letters, digits, - or _' })
  tabId!: string;

  @ApiPropertyOptional({ description: 'The cell whose editor has the focus in this tab, or null', nullable: true })
  @IsOptional()
  @IsUUID('all', { message: 'cellId must be a cell id' })
  cellId?: string | null;
}
