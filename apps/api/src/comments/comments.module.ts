import { Module } from '@nestjs/common';
import { MailModule } from '../mail/mail.module';
import { MembersModule } from '../members/members.module';
import { CommentsController } from './comments.controller';
import { CommentsService } from './comments.service';

@Module({
  imports: [MailModule, MembersModule],
  controllers: [CommentsController],
  providers: [CommentsService],
})
export class CommentsModule {}
