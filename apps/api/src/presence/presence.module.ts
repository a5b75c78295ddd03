import { Module } from '@nestjs/common';
import { MembersModule } from '../members/members.module';
import { PresenceController } from './presence.controller';
import { PresenceService } from './presence.service';

/** Who has a notebook open (heartbeats in PostgreSQL, changes announced on the notebook's event stream). */
@Module({
  imports: [MembersModule],
  controllers: [PresenceController],
  providers: [PresenceService],
})
export class PresenceModule {}
