import { Module } from '@nestjs/common';
import { CellsModule } from '../cells/cells.module';
import { MembersModule } from '../members/members.module';
import { QueueModule } from '../queue/queue.module';
import { RunEventsService } from './run-events.service';
import { RunsController } from './runs.controller';
import { RunsService } from './runs.service';

@Module({
  imports: [MembersModule, CellsModule, QueueModule],
  controllers: [RunsController],
  providers: [RunsService, RunEventsService],
  exports: [RunsService, RunEventsService],
})
export class RunsModule {}
