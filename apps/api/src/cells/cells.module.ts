import { Module } from '@nestjs/common';
import { MembersModule } from '../members/members.module';
import { CellsController } from './cells.controller';
import { CellsService } from './cells.service';

@Module({
  imports: [MembersModule],
  controllers: [CellsController],
  providers: [CellsService],
  exports: [CellsService],
})
export class CellsModule {}
