import { Module } from '@nestjs/common';
import { MembersModule } from '../members/members.module';
import { PublicationsController } from './publications.controller';
import { RecordsController } from './records.controller';
import { RecordsService } from './records.service';

/** Published records: publish and withdraw (members), the public page's data and downloads (anyone). */
@Module({
  imports: [MembersModule],
  controllers: [PublicationsController, RecordsController],
  providers: [RecordsService],
})
export class RecordsModule {}
