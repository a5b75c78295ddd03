import { Module } from '@nestjs/common';
import { MembersModule } from '../members/members.module';
import { NotebooksModule } from '../notebooks/notebooks.module';
import { RunsModule } from '../runs/runs.module';
import { UploadsModule } from '../uploads/uploads.module';
import { ExportsController } from './exports.controller';
import { ExportsService } from './exports.service';

@Module({
  imports: [MembersModule, NotebooksModule, RunsModule, UploadsModule],
  controllers: [ExportsController],
  providers: [ExportsService],
})
export class ExportsModule {}
