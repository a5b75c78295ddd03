import { ApiProperty, ApiPropertyOptional } from '@nestjs/swagger';
import { ArrayMaxSize, IsArray, IsOptional, IsString, IsUUID, Matches, MaxLength } from 'class-validator';
import { COMMENT_BODY_MAX, type CreateCommentBody, type UpdateCommentBody } from '@cribra/contracts';

/** Body of a new comment, a reply, or an edit. */
export class CommentBodyDto implements CreateCommentBody, UpdateCommentBody {
  @ApiProperty({ description: 'Markdown with math ($…$, $$…$$)', maxLength: COMMENT_BODY_MAX })
  @IsString({ message: 'body must be text' })
  @Matches(/\S/, { message: 'body must not be empty' })
  @MaxLength(COMMENT_BODY_MAX, { message: `body must be at most ${COMMENT_BODY_MAX} characters` })
  body!: string;

  @ApiPropertyOptional({ type: [String], description: 'User ids of members to tell by e-mail' })
  @IsOptional()
  @IsArray()
  @ArrayMaxSize(50)
  @IsUUID('all', { each: true, message: 'mentions must be user ids' })
  mentions?: string[];
}
