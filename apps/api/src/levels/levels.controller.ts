import { BadRequestException, Controller, Get, HttpCode, Param, ParseIntPipe, Post, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { ComputationView, WheelLevelSummary, WheelLevelView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import type { UserEntity } from '../users/user.entity';
import { LevelsService } from './levels.service';

const primeParam = new ParseIntPipe({
  exceptionFactory: () =>
    new BadRequestException({ message: 'prime must be a whole number', details: [{ field: 'prime', messages: ['must be a whole number'] }] }),
});
@ApiTags('levels')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller('levels')
export class LevelsController {
  constructor(private readonly levels: LevelsService) {}

  @Get()
  @ApiOperation({ summary: 'Stored wheel levels (and those being computed)' })
  list(): Promise<WheelLevelSummary[]> {
    return this.levels.list();
  }

  @Get(':prime')
  @ApiOperation({ summary: 'One wheel level: histogram, largest gap, consecutive-pattern tallies' })
  get(@Param('prime', primeParam) prime: number): Promise<WheelLevelView> {
    return this.levels.get(prime);
  }

  @Post(':prime/computations')
  @HttpCode(202)
  @ApiOperation({ summary: 'Request a level to be computed by the runners (chunked; up to 47#)' })
  request(@CurrentUser() user: UserEntity, @Param('prime', primeParam) prime: number): Promise<ComputationView> {
    return this.levels.request(user, prime);
  }
}
