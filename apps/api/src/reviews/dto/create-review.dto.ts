import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { IsIn, IsOptional, IsString, IsUUID, Matches, MaxLength } from 'class-validator';
import { COMMENT_BODY_MAX, type CreateReviewBody, type ReviewDecision } from '@cribra/contracts';

export class CreateReviewDto implements CreateReviewBody {
  @ApiProperty({ enum: ['signoff', 'changes_requested'] })
  @IsIn(['signoff', 'changes_requested'], { message: 'decision must be signoff or changes_requested' })
  decision!: ReviewDecision;

  @ApiProperty({ description: 'Markdown' })
  @IsString({ message: 'comment must be text' })
  @Matches(/\S/, { message: 'comment must not be empty' })
  @MaxLength(COMMENT_BODY_MAX, { message: `comment must be at most ${COMMENT_BODY_MAX} characters` })
  comment!: string;

  @ApiProperty({ description: 'The revision digest the reviewer looked at (64 hex digits)' })
  @Matches(/^[0-9a-f]{64}$/, { message: 'revisionDigest must be 64 lower-case hex digits' })
  revisionDigest!: string;

  @ApiPropertyOptional({ description: 'Required for a sign-off: a finished re-verify of this revision' })
  @IsOptional()
  @IsUUID('all', { message: 'verificationId must be a verification id' })
  verificationId?: string;
}
