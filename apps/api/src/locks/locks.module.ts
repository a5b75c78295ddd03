import { Module } from '@nestjs/common';
import { MembersModule } from '../members/members.module';
import { ReviewsModule } from '../reviews/reviews.module';
import { LocksController } from './locks.controller';
import { LocksService } from './locks.service';

/** Locks, lock records and duplication. */
@Module({
  imports: [MembersModule, ReviewsModule],
  controllers: [LocksController],
  providers: [LocksService],
})
export class LocksModule {}
