import { BadRequestException, Body, Controller, Get, HttpCode, Param, ParseIntPipe, Post, Query, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { ComputationView, LedgerBlockSummary, LedgerBlockView, LedgerRangeView, Page } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import type { UserEntity } from '../users/user.entity';
import { LedgerRangeDto } from './dto/ledger-range.dto';
import { ListBlocksDto } from './dto/list-blocks.dto';
import { LedgerService } from './ledger.service';

const indexParam = new ParseIntPipe({
  exceptionFactory: () =>
    new BadRequestException({ message: 'index must be a whole number', details: [{ field: 'index', messages: ['must be a whole number'] }] }),
});

@ApiTags('ledger')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller('ledger')
export class LedgerController {
  constructor(private readonly ledger: LedgerService) {}

  @Get('blocks')
  @ApiOperation({ summary: 'Stored ledger blocks, optionally only those meeting [from, to)' })
  list(@Query() q: ListBlocksDto): Promise<Page<LedgerBlockSummary>> {
    return this.ledger.list(q.page, q.pageSize, q.from, q.to);
  }

  @Get('blocks/:index')
  @ApiOperation({ summary: 'One ledger block: π, gap histogram, constellations, record gaps' })
  get(@Param('index', indexParam) index: number): Promise<LedgerBlockView> {
    return this.ledger.get(index);
  }

  @Get('range')
  @ApiOperation({ summary: 'Statistics of [from, to) widened to whole blocks, combined from stored blocks' })
  range(@Query() q: LedgerRangeDto): Promise<LedgerRangeView> {
    return this.ledger.range(q.from, q.to);
  }

  @Post('computations')
  @HttpCode(202)
  @ApiOperation({ summary: 'Request the blocks of [from, to) (up to 1e11) from the runners' })
  request(@CurrentUser() user: UserEntity, @Body() body: LedgerRangeDto): Promise<ComputationView> {
    return this.ledger.request(user, body.from, body.to);
  }
}
