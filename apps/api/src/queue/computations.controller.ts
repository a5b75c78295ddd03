import { Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, Query, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiPropertyOptional, ApiTags } from '@nestjs/swagger';
import { IsIn, IsOptional } from 'class-validator';
import type { ComputationKind, ComputationStatus, ComputationView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import type { Actor } from '../members/notebook-policy.service';
import { ComputationsService } from './computations.service';

export class ListComputationsDto {
  @ApiPropertyOptional({ enum: ['level', 'ledger'] })
  @IsOptional()
  @IsIn(['level', 'ledger'], { message: 'kind must be level or ledger' })
  kind?: ComputationKind;

  @ApiPropertyOptional({ enum: ['queued', 'running', 'succeeded', 'failed', 'cancelled'] })
  @IsOptional()
  @IsIn(['queued', 'running', 'succeeded', 'failed', 'cancelled'], { message: 'status must be queued, running, succeeded, failed or cancelled' })
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

  @Post(':id/cancel')
  @HttpCode(200)
  @ApiOperation({ summary: 'Cancel a queued or running computation (runners skip the rest; stored blocks and chunks stay)' })
  cancel(@CurrentUser() actor: Actor, @Param('id', ParseUUIDPipe) id: string): Promise<ComputationView> {
    return this.computations.cancel(actor, id);
  }
}
