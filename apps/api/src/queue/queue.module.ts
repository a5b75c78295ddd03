import { Module } from '@nestjs/common';
import { ComputationsController } from './computations.controller';
import { ComputationsService } from './computations.service';
import { QueueService } from './queue.service';
import { RunnersController } from './runners.controller';

/** pg-boss for the API (send, cancel) and the computations it tracks. */
@Module({
  controllers: [ComputationsController, RunnersController],
  providers: [QueueService, ComputationsService],
  exports: [QueueService, ComputationsService],
})
export class QueueModule {}
