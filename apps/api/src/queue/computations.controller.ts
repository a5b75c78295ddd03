import { Controller, Get, Param, ParseUUIDPipe, Query, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiPropertyOptional, ApiTags } from '@nestjs/swagger';
import { IsIn, IsOptional } from 'class-validator';
import type { ComputationKind, ComputationStatus, ComputationView } from '@cribra/contracts';
import { SignedInGuard } from '../common';
import { ComputationsService } from './computations.service';

export class ListComputationsDto {
  @ApiPropertyOptional({ enum: ['level', 'ledger'] })
  @IsOptional()
  @IsIn(['level', 'ledger'], { message: 'kind must be level or ledger' })
  kind?: ComputationKind;

  @ApiPropertyOptional({ enum: ['queued', 'running', 'succeeded', 'failed'] })
  @IsOptional()
  @IsIn(['queued', 'running', 'succeeded', 'failed'], { message: 'status must be queued, running, succeeded or failed' })
  status?: ComputationStatus;
}

@ApiTags('computations')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller('computations')
export class ComputationsController {
  constructor(private readonly computations: ComputationsService) {}

  @Get()
  @ApiOperation({ summary: 'Recent chunked computations (levels, ledger ranges) with their progress' })
  list(@Query() q: ListComputationsDto): Promise<ComputationView[]> {
    return this.computations.list(q.kind, q.status);
  }

  @Get(':id')
  @ApiOperation({ summary: 'One computation with its chunk progress' })
  get(@Param('id', ParseUUIDPipe) id: string): Promise<ComputationView> {
    return this.computations.get(id);
  }
}
