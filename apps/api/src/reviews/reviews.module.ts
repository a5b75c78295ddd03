import { Module } from '@nestjs/common';
import { MailModule } from '../mail/mail.module';
import { MembersModule } from '../members/members.module';
import { RunsModule } from '../runs/runs.module';
import { ReviewsController } from './reviews.controller';
import { ReviewsService } from './reviews.service';
import { SignoffWatcherService } from './signoff-watcher.service';
import { VerificationsService } from './verifications.service';

/** Review requests, re-verification, sign-offs and their voiding. */
@Module({
  imports: [MailModule, MembersModule, RunsModule],
  controllers: [ReviewsController],
  providers: [ReviewsService, VerificationsService, SignoffWatcherService],
  exports: [ReviewsService, VerificationsService],
})
export class ReviewsModule {}
