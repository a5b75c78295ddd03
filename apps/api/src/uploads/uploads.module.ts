import { Module } from '@nestjs/common';
import { MembersModule } from '../members/members.module';
import { UploadsController } from './uploads.controller';
import { UploadParsePool } from './upload-parse-pool';
import { UploadsService } from './uploads.service';

@Module({
  imports: [MembersModule],
  controllers: [UploadsController],
  providers: [UploadsService, UploadParsePool],
  exports: [UploadsService],
})
export class UploadsModule {}
