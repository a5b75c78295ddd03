import { Body, Controller, Get, HttpCode, Param, ParseUUIDPipe, Post, UseGuards } from '@nestjs/common';
import { ApiCookieAuth, ApiOperation, ApiTags } from '@nestjs/swagger';
import type { ReviewStateView, ReviewView, VerificationSummary, VerificationView } from '@cribra/contracts';
import { CurrentUser, SignedInGuard } from '../common';
import { NotebookPolicyService } from '../members/notebook-policy.service';
import type { UserEntity } from '../users/user.entity';
import { CreateReviewDto } from './dto/create-review.dto';
import { RequestReviewDto } from './dto/request-review.dto';
import { ReviewsService } from './reviews.service';
import { VerificationsService } from './verifications.service';

@ApiTags('review')
@ApiCookieAuth()
@UseGuards(SignedInGuard)
@Controller()
export class ReviewsController {
  constructor(
    private readonly reviews: ReviewsService,
    private readonly verifications: VerificationsService,
    private readonly policy: NotebookPolicyService,
  ) {}

  @Get('notebooks/:id/review')
  @ApiOperation({ summary: 'Review state: revision digest, valid sign-offs, what blocks locking' })
  async state(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<ReviewStateView> {
    await this.policy.authorize(user, 'review.read', id);
    return this.reviews.state(id);
  }

  @Post('notebooks/:id/review/request')
  @HttpCode(200)
  @ApiOperation({ summary: 'Ask for review (draft → in_review); reviewers are told by e-mail' })
  async request(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: RequestReviewDto,
  ): Promise<ReviewStateView> {
    await this.policy.authorize(user, 'review.request', id);
    return this.reviews.request(user, id, body);
  }

  @Post('notebooks/:id/verifications')
  @HttpCode(202)
  @ApiOperation({ summary: 'Re-verify: re-run every cell from source and compare output digests' })
  async verify(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<VerificationView> {
    await this.policy.authorize(user, 'review.verify', id);
    return this.verifications.start(user, id, 'review');
  }

  @Get('notebooks/:id/verifications')
  @ApiOperation({ summary: 'Re-verifications of a notebook, newest first' })
  async listVerifications(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<VerificationSummary[]> {
    await this.policy.authorize(user, 'review.read', id);
    return this.verifications.list(id);
  }

  @Get('verifications/:id')
  @ApiOperation({ summary: 'One re-verification with its per-cell results (same / differs / failed)' })
  async verification(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<VerificationView> {
    await this.policy.authorize(user, 'review.read', await this.verifications.notebookOf(id));
    return this.verifications.get(id);
  }

  @Post('notebooks/:id/reviews')
  @ApiOperation({ summary: 'Sign off (after a re-verify of this revision) or ask for changes, with a comment' })
  async decide(
    @CurrentUser() user: UserEntity,
    @Param('id', ParseUUIDPipe) id: string,
    @Body() body: CreateReviewDto,
  ): Promise<ReviewView> {
    await this.policy.authorize(user, 'review.decide', id);
    return this.reviews.decide(user, id, body);
  }

  @Get('notebooks/:id/reviews')
  @ApiOperation({ summary: 'Review decisions, newest first (voided sign-offs too)' })
  async list(@CurrentUser() user: UserEntity, @Param('id', ParseUUIDPipe) id: string): Promise<ReviewView[]> {
    await this.policy.authorize(user, 'review.read', id);
    return this.reviews.list(id);
  }
}
