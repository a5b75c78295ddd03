import { Global, Module } from '@nestjs/common';
import { TypeOrmModule } from '@nestjs/typeorm';
import { MembersModule } from '../members/members.module';
import { AuditController } from './audit.controller';
import { AuditEventEntity } from './audit-event.entity';
import { AuditService } from './audit.service';

/** Global so that every feature can record events without importing this module. */
@Global()
@Module({
  imports: [TypeOrmModule.forFeature([AuditEventEntity]), MembersModule],
  controllers: [AuditController],
  providers: [AuditService],
  exports: [AuditService],
})
export class AuditModule {}
